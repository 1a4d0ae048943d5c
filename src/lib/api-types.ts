// Shapes of the foundation API's bodies as the client reads them.

export const roles = ['owner', 'manager', 'barista', 'bookkeeper'] as const;
export type Role = (typeof roles)[number];

export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  manager: 'Manager',
  barista: 'Barista',
  bookkeeper: 'Bookkeeper',
};

export type TaxMode = 'inclusive' | 'exclusive';

export interface User {
  id: string;
  email: string;
  name: string;
  role: Role;
  businessId: string;
}

export interface Business {
  id: string;
  name: string;
  country: string;
  currency: string;
  taxMode: TaxMode;
}

export interface Site {
  id: string;
  name: string;
}

/** What login, signup, invitation accept and GET /api/auth/me return. */
export interface Session {
  user: User;
  csrfToken: string;
  business: Business;
}
