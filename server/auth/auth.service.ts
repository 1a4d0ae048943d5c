import type { Knex } from 'knex';
import type { z } from 'zod';
import { badRequest, conflict, notFound } from '../platform/errors';
import type { Mailer } from '../platform/mailer';
import { hashPassword, hashToken, newToken } from './passwords';
import type { signupSchema } from './auth.schemas';
import { findUserByEmail, toSessionUser, type UserRow } from './users.repo';

const RESET_HOURS = 2;
export const INVITE_DAYS = 7;

export async function signup(db: Knex, input: z.output<typeof signupSchema>) {
  if (await findUserByEmail(db, input.email)) {
    throw conflict('email_taken', 'An account with this e-mail already exists. Sign in or reset your password.');
  }
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (trx) => {
    const [b] = await trx('businesses')
      .insert({ name: input.businessName, country: input.country, currency: input.currency, tax_mode: input.taxMode })
      .returning('id');
    await trx('sites').insert({ business_id: b.id, name: input.siteName });
    const [u] = await trx<UserRow>('users')
      .insert({ business_id: b.id, email: input.email, name: input.name, role: 'owner', password_hash: passwordHash })
      .returning('*');
    return toSessionUser(u);
  });
}

export async function requestPasswordReset(db: Knex, mailer: Mailer, appUrl: string, email: string) {
  const user = await findUserByEmail(db, email);
  // The answer is the same whether or not the account exists.
  if (!user) return;
  const { token, tokenHash } = newToken();
  await db('password_resets').insert({ user_id: user.id, token_hash: tokenHash, expires_at: db.raw(`now() + interval '${RESET_HOURS} hours'`) });
  const link = `${appUrl}/reset-password?token=${token}`;
  await mailer.send({
    to: user.email,
    subject: 'Reset your Tamp & Tally password',
    text: `Hello ${user.name},\n\nSomeone asked to reset the password of your Tamp & Tally account. To choose a new one, open this link within ${RESET_HOURS} hours:\n\n${link}\n\nThe link works once. If you did not ask for this, ignore this message; your password stays as it is.\n`,
  });
}

export async function completePasswordReset(db: Knex, token: string, password: string) {
  const passwordHash = await hashPassword(password);
  await db.transaction(async (trx) => {
    // Marking it used in the same statement makes the link single-use even under races.
    const [row] = await trx('password_resets')
      .where({ token_hash: hashToken(token) })
      .whereNull('used_at')
      .where('expires_at', '>', trx.fn.now())
      .update({ used_at: trx.fn.now() })
      .returning('user_id');
    if (!row) throw badRequest('invalid_token', 'This reset link has expired or was already used. Ask for a new one.');
    await trx('users').where({ id: row.user_id }).update({ password_hash: passwordHash, updated_at: trx.fn.now() });
    await trx('password_resets').where({ user_id: row.user_id }).whereNull('used_at').update({ used_at: trx.fn.now() });
  });
}

async function openInvitation(db: Knex, token: string) {
  const inv = await db('invitations as i')
    .join('businesses as b', 'b.id', 'i.business_id')
    .where({ 'i.token_hash': hashToken(token) })
    .whereNull('i.accepted_at')
    .where('i.expires_at', '>', db.fn.now())
    .first('i.*', 'b.name as business_name');
  if (!inv) throw notFound('This invitation');
  return inv;
}

export async function getInvitation(db: Knex, token: string) {
  const inv = await openInvitation(db, token);
  return { email: inv.email as string, role: inv.role as string, businessName: inv.business_name as string };
}

export async function acceptInvitation(db: Knex, token: string, input: { name: string; password: string }) {
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (trx) => {
    const inv = await openInvitation(trx, token);
    const claimed = await trx('invitations').where({ id: inv.id }).whereNull('accepted_at').update({ accepted_at: trx.fn.now() });
    if (claimed !== 1) throw notFound('This invitation');
    if (await findUserByEmail(trx, inv.email)) {
      throw conflict('email_taken', 'An account with this e-mail already exists. Sign in instead.');
    }
    const [u] = await trx<UserRow>('users')
      .insert({ business_id: inv.business_id, email: inv.email, name: input.name, role: inv.role, password_hash: passwordHash })
      .returning('*');
    return toSessionUser(u);
  });
}
