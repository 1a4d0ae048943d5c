export const ROLES = ['owner', 'manager', 'barista', 'bookkeeper'] as const;
export type Role = (typeof ROLES)[number];

/** The signed-in user as every route sees it. */
export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  businessId: string;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
  }
}

/**
 * Who may do what. Routes name a capability; the table below is the one place
 * that says which roles have it (the client mirrors it for navigation only).
 */
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
  // Issue 6: bookkeeper and owner everything in the books; manager counts, imports and reports; barista counts and waste.
  'waste.write': ['owner', 'barista', 'bookkeeper'],
  'sales.import': ['owner', 'manager', 'bookkeeper'],
  'reports.read': ['owner', 'manager', 'bookkeeper'],
  'periods.close': ['owner', 'bookkeeper'],
  'periods.reopen': ['owner'],
} as const satisfies Record<string, readonly Role[]>;

export type Capability = keyof typeof CAPABILITIES;

export function can(role: Role, capability: Capability): boolean {
  return (CAPABILITIES[capability] as readonly Role[]).includes(role);
}
