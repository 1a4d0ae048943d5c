import type { Knex } from 'knex';

export async function listMembers(db: Knex, businessId: string) {
  return db('users').where({ business_id: businessId }).orderBy([{ column: 'role' }, { column: 'name' }]).select('id', 'email', 'name', 'role');
}

export async function listOpenInvitations(db: Knex, businessId: string) {
  const rows = await db('invitations')
    .where({ business_id: businessId })
    .whereNull('accepted_at')
    .where('expires_at', '>', db.fn.now())
    .orderBy('created_at', 'desc')
    .select('id', 'email', 'role', 'expires_at');
  return rows.map((r) => ({ id: r.id, email: r.email, role: r.role, expiresAt: new Date(r.expires_at).toISOString() }));
}

export async function countOwners(db: Knex, businessId: string) {
  const r = await db('users').where({ business_id: businessId, role: 'owner' }).count<{ n: string }[]>('* as n');
  return Number(r[0].n);
}

export async function findMember(db: Knex, businessId: string, id: string) {
  return db('users').where({ business_id: businessId, id }).first('id', 'email', 'name', 'role');
}
