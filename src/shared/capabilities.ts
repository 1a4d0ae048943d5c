/**
 * Who may do what: the one table of roles and capabilities. The server checks it on every
 * route (each contract entry names its capability); the client asks it, through `can`, whether
 * to show an action. A page never compares role names itself.
 */
export const ROLES = ['owner', 'manager', 'barista', 'bookkeeper'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  owner: 'Owner',
  manager: 'Manager',
  barista: 'Barista',
  bookkeeper: 'Bookkeeper',
};

export const CAPABILITIES = {
  'team.manage': ['owner'],
  'business.manage': ['owner'],
  'sites.read': ['owner', 'manager', 'barista', 'bookkeeper'],
  'cards.read': ['owner', 'manager', 'barista', 'bookkeeper'],
  'costs.read': ['owner', 'manager', 'bookkeeper'],
  'costs.write': ['owner', 'manager'],
  'prices.apply': ['owner', 'manager'],
  'prices.history': ['owner', 'manager', 'bookkeeper'],
  'orders.read': ['owner', 'manager', 'bookkeeper'],
  'orders.write': ['owner', 'manager'],
  'orders.pay': ['owner'],
  'payments.manage': ['owner'],
  'stock.read': ['owner', 'manager', 'barista', 'bookkeeper'],
  'stock.manage': ['owner', 'manager'],
  'counts.write': ['owner', 'manager', 'barista', 'bookkeeper'],
  // Owner and bookkeeper everything in the books; manager counts, imports and reports; barista counts and waste.
  'waste.write': ['owner', 'barista', 'bookkeeper'],
  'sales.import': ['owner', 'manager', 'bookkeeper'],
  'reports.read': ['owner', 'manager', 'bookkeeper'],
  'periods.close': ['owner', 'bookkeeper'],
  'periods.reopen': ['owner'],
} as const satisfies Record<string, readonly Role[]>;

export type Capability = keyof typeof CAPABILITIES;

export function can(role: Role | null | undefined, capability: Capability): boolean {
  return role != null && (CAPABILITIES[capability] as readonly Role[]).includes(role);
}

/** The roles that hold a capability, for documentation and tests. */
export function rolesWith(capability: Capability): readonly Role[] {
  return CAPABILITIES[capability];
}

/** Roles that see money (costs, prices paid, values). A barista reads builds, never figures of cost. */
export function seesCosts(role: Role | null | undefined): boolean {
  return can(role, 'costs.read');
}
