import type { Knex } from 'knex';
import type { Role } from './roles';

export interface MemberRow { id: string; email: string; name: string; role: Role }
export interface InvitationRow { id: string; email: string; role: Role; expires_at: string }

export async function listMembers(db: Knex, businessId: string): Promise<MemberRow[]> {
  return db('users').where({ business_id: businessId }).orderBy([{ column: 'role' }, { column: 'name' }]).select('id', 'email', 'name', 'role');
}

export async function listOpenInvitations(db: Knex, businessId: string): Promise<InvitationRow[]> {
  return db('invitations')
    .where({ business_id: businessId })
    .whereNull('accepted_at')
    .where('expires_at', '>', db.fn.now())
    .orderBy('created_at', 'desc')
    .select('id', 'email', 'role', 'expires_at');
}

export async function insertInvitation(db: Knex, row: { business_id: string; email: string; role: Role; token_hash: string; invited_by: string }, days: number): Promise<InvitationRow> {
  const [inv] = await db('invitations').insert({ ...row, expires_at: db.raw('now() + make_interval(days => ?)', [days]) }).returning(['id', 'email', 'role', 'expires_at']);
  return inv;
}

export async function deleteOpenInvitation(db: Knex, businessId: string, id: string): Promise<boolean> {
  return (await db('invitations').where({ business_id: businessId, id }).whereNull('accepted_at').delete()) > 0;
}

export async function businessName(db: Knex, businessId: string): Promise<string> {
  return (await db('businesses').where({ id: businessId }).first('name')).name as string;
}

/** Locks the business's owners, so two demotions cannot both pass the last-owner check. */
export async function lockOwners(db: Knex, businessId: string): Promise<void> {
  await db.raw('select id from users where business_id = ? and role = ? for update', [businessId, 'owner']);
}

export async function countOwners(db: Knex, businessId: string): Promise<number> {
  const r = await db('users').where({ business_id: businessId, role: 'owner' }).count<{ n: string }[]>('* as n');
  return Number(r[0].n);
}

export async function findMember(db: Knex, businessId: string, id: string): Promise<MemberRow | undefined> {
  return db('users').where({ business_id: businessId, id }).first('id', 'email', 'name', 'role');
}

export async function setRole(db: Knex, id: string, role: Role): Promise<void> {
  await db('users').where({ id }).update({ role, updated_at: db.fn.now() });
}

export async function deleteUser(db: Knex, id: string): Promise<void> {
  await db('users').where({ id }).delete();
}
