import type { Role } from '../../src/shared/capabilities';
export { ROLES, type Role } from '../../src/shared/capabilities';

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

export { CAPABILITIES, can, type Capability } from '../../src/shared/capabilities';
