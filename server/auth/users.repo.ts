import type { Knex } from 'knex';
import type { Role, SessionUser } from './roles';

export interface UserRow {
  id: string;
  business_id: string;
  email: string;
  name: string;
  role: Role;
  password_hash: string | null;
}

export function toSessionUser(r: UserRow): SessionUser {
  return { id: r.id, email: r.email, name: r.name, role: r.role, businessId: r.business_id };
}

export async function findUserByEmail(db: Knex, email: string): Promise<UserRow | undefined> {
  return db<UserRow>('users').whereRaw('lower(email) = lower(?)', [email]).first();
}

export async function findUserById(db: Knex, id: string): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ id }).first();
}

export async function findBusiness(db: Knex, businessId: string) {
  const b = await db('businesses').where({ id: businessId }).first();
  if (!b) return undefined;
  return { id: b.id as string, name: b.name as string, country: b.country as string, currency: b.currency as string, taxMode: b.tax_mode as 'inclusive' | 'exclusive' };
}
