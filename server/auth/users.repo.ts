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

export async function insertUser(db: Knex, row: Omit<UserRow, 'id'>): Promise<UserRow> {
  const [u] = await db<UserRow>('users').insert(row).returning('*');
  return u;
}

export async function setPasswordHash(db: Knex, userId: string, passwordHash: string): Promise<void> {
  await db('users').where({ id: userId }).update({ password_hash: passwordHash, updated_at: db.fn.now() });
}

/** Ends every stored session of a user, but the one kept (the session that changed the password). */
export async function endSessionsOf(db: Knex, userId: string, keepSid?: string): Promise<void> {
  const q = db('session').whereRaw(`(sess::jsonb #>> '{passport,user}') = ?`, [userId]);
  if (keepSid) q.whereNot({ sid: keepSid });
  await q.delete();
}

export interface BusinessRow {
  id: string;
  name: string;
  country: string;
  currency: string;
  tax_mode: 'inclusive' | 'exclusive';
  tax_name: string;
  time_zone: string;
}

export async function findBusinessRow(db: Knex, businessId: string): Promise<BusinessRow | undefined> {
  return db<BusinessRow>('businesses').where({ id: businessId }).first('id', 'name', 'country', 'currency', 'tax_mode', 'tax_name', 'time_zone');
}

export async function insertBusiness(db: Knex, row: Omit<BusinessRow, 'id'>): Promise<BusinessRow> {
  const [b] = await db<BusinessRow>('businesses').insert(row).returning(['id', 'name', 'country', 'currency', 'tax_mode', 'tax_name', 'time_zone']);
  return b;
}

/**
 * A new business's pricing policy: the country's tax at its standard rate (or the owner's), a
 * 70 % target margin, prices rounded up to five of the currency's minor units.
 */
export async function insertStartingPolicy(db: Knex, businessId: string, p: { taxMode: 'inclusive' | 'exclusive'; taxRatePct: string; priceStep: string }): Promise<void> {
  await db('pricing_policies').insert({ business_id: businessId, category: null, target_margin_pct: '70', tax_mode: p.taxMode, tax_rate_pct: p.taxRatePct, price_step: p.priceStep, rounding: 'up' });
}

export async function insertPasswordReset(db: Knex, userId: string, tokenHash: string, hours: number): Promise<void> {
  await db('password_resets').insert({ user_id: userId, token_hash: tokenHash, expires_at: db.raw('now() + make_interval(hours => ?)', [hours]) });
}

/** How many reset links were sent to a user within the last hour. */
export async function resetsSentWithinHour(db: Knex, userId: string): Promise<number> {
  const r = await db('password_resets').where({ user_id: userId }).where('created_at', '>', db.raw("now() - interval '1 hour'")).count<{ n: string }[]>('* as n');
  return Number(r[0].n);
}

/** Marks a reset link used and answers its user, or undefined when it is unknown, used or expired. */
export async function claimPasswordReset(db: Knex, tokenHash: string): Promise<string | undefined> {
  // Marking it used in the same statement makes the link single-use even under races.
  const [row] = await db('password_resets')
    .where({ token_hash: tokenHash })
    .whereNull('used_at')
    .where('expires_at', '>', db.fn.now())
    .update({ used_at: db.fn.now() })
    .returning('user_id');
  return row?.user_id as string | undefined;
}

export async function expireResetsOf(db: Knex, userId: string): Promise<void> {
  await db('password_resets').where({ user_id: userId }).whereNull('used_at').update({ used_at: db.fn.now() });
}

export interface InvitationRow {
  id: string;
  business_id: string;
  email: string;
  role: Role;
  business_name: string;
}

export async function findOpenInvitation(db: Knex, tokenHash: string): Promise<InvitationRow | undefined> {
  return db('invitations as i')
    .join('businesses as b', 'b.id', 'i.business_id')
    .where({ 'i.token_hash': tokenHash })
    .whereNull('i.accepted_at')
    .where('i.expires_at', '>', db.fn.now())
    .first('i.id', 'i.business_id', 'i.email', 'i.role', 'b.name as business_name');
}

export async function claimInvitation(db: Knex, id: string): Promise<boolean> {
  return (await db('invitations').where({ id }).whereNull('accepted_at').update({ accepted_at: db.fn.now() })) === 1;
}
