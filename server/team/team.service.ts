import type { Knex } from 'knex';
import type { Mailer } from '../platform/mailer';
import { conflict, notFound } from '../platform/errors';
import { newToken } from '../auth/passwords';
import { INVITE_DAYS } from '../auth/auth.service';
import type { Role, SessionUser } from '../auth/roles';
import { countOwners, findMember } from './team.repo';

const ROLE_WORDS: Record<Role, string> = {
  owner: 'an owner (everything, including the team and payments)',
  manager: 'a manager (ingredients, recipes, prices, suppliers, orders and stock counts)',
  barista: 'a barista (drink builds for the bar, waste and stock counts)',
  bookkeeper: 'the bookkeeper (reads costs, orders and reports, and exports them)',
};

export async function invite(db: Knex, mailer: Mailer, appUrl: string, by: SessionUser, input: { email: string; role: Role }) {
  if (await db('users').whereRaw('lower(email) = lower(?)', [input.email]).first()) {
    throw conflict('email_taken', 'That e-mail already has a Tamp & Tally account.');
  }
  const { token, tokenHash } = newToken();
  const business = await db('businesses').where({ id: by.businessId }).first('name');
  const [row] = await db('invitations')
    .insert({ business_id: by.businessId, email: input.email, role: input.role, token_hash: tokenHash, invited_by: by.id, expires_at: db.raw(`now() + interval '${INVITE_DAYS} days'`) })
    .returning(['id', 'email', 'role', 'expires_at']);
  const link = `${appUrl}/accept-invite?token=${token}`;
  await mailer.send({
    to: input.email,
    subject: `${by.name} invited you to ${business.name} on Tamp & Tally`,
    text: `Hello,\n\n${by.name} has invited you to join ${business.name} on Tamp & Tally as ${ROLE_WORDS[input.role]}.\n\nTo accept, choose your name and a password here within ${INVITE_DAYS} days:\n\n${link}\n`,
  });
  return { id: row.id as string, email: row.email as string, role: row.role as Role, expiresAt: new Date(row.expires_at).toISOString() };
}

export async function revokeInvitation(db: Knex, businessId: string, id: string) {
  const n = await db('invitations').where({ business_id: businessId, id }).whereNull('accepted_at').delete();
  if (n === 0) throw notFound('That invitation');
}

/** Changes a role; the business always keeps at least one owner. */
export async function changeRole(db: Knex, businessId: string, id: string, role: Role) {
  return db.transaction(async (trx) => {
    // Lock the business's owners so two demotions cannot both pass the check.
    await trx.raw('select id from users where business_id = ? and role = ? for update', [businessId, 'owner']);
    const m = await findMember(trx, businessId, id);
    if (!m) throw notFound('That team member');
    if (m.role === 'owner' && role !== 'owner' && (await countOwners(trx, businessId)) <= 1) {
      throw conflict('last_owner', 'A business needs at least one owner. Make someone else an owner first.');
    }
    await trx('users').where({ id }).update({ role, updated_at: trx.fn.now() });
    return { ...m, role };
  });
}

export async function removeMember(db: Knex, businessId: string, id: string) {
  await db.transaction(async (trx) => {
    await trx.raw('select id from users where business_id = ? and role = ? for update', [businessId, 'owner']);
    const m = await findMember(trx, businessId, id);
    if (!m) throw notFound('That team member');
    if (m.role === 'owner' && (await countOwners(trx, businessId)) <= 1) {
      throw conflict('last_owner', 'A business needs at least one owner. Make someone else an owner first.');
    }
    await trx('users').where({ id }).delete();
    // Their sessions end at the next request: deserializeUser finds no user.
  });
}
