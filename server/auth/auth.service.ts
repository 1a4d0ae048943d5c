import type { z } from 'zod';
import type { signupSchema } from '../../src/shared/contract/auth';
import type { Business } from '../../src/shared/contract/auth';
import { countryDefaults } from '../../src/shared/countries';
import { minorUnitStep } from '../../src/shared/money';
import type { AppDeps } from '../platform/deps';
import { badRequest, conflict, invalidInput, notFound } from '../platform/errors';
import { hashPassword, hashToken, newToken, verifyPassword } from './passwords';
import type { SessionUser } from './roles';
import {
  claimInvitation, claimPasswordReset, endSessionsOf, expireResetsOf, findBusinessRow, findOpenInvitation, findUserByEmail, findUserById,
  insertBusiness, insertPasswordReset, insertStartingPolicy, insertUser, resetsSentWithinHour, setPasswordHash, toSessionUser, type BusinessRow,
} from './users.repo';

const RESET_HOURS = 2;
/** Reset links sent to one account within an hour, at the most; further requests send nothing (and say the same). */
const RESETS_PER_HOUR = 3;
export const INVITE_DAYS = 7;

export function presentBusiness(b: BusinessRow): Business {
  return { id: b.id, name: b.name, country: b.country, currency: b.currency, taxMode: b.tax_mode, taxName: b.tax_name, timeZone: b.time_zone };
}

export async function businessOf({ db }: Pick<AppDeps, 'db'>, businessId: string): Promise<Business> {
  const b = await findBusinessRow(db, businessId);
  if (!b) throw notFound('That business');
  return presentBusiness(b);
}

export async function signup({ db }: AppDeps, input: z.output<typeof signupSchema>): Promise<SessionUser> {
  if (await findUserByEmail(db, input.email)) {
    throw conflict('email_taken', 'An account with this e-mail already exists. Sign in or reset your password.');
  }
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (trx) => {
    const country = countryDefaults(input.country);
    const b = await insertBusiness(trx, {
      name: input.businessName, country: input.country, currency: input.currency, tax_mode: input.taxMode,
      tax_name: input.taxName ?? country?.taxName ?? 'Tax', time_zone: input.timeZone ?? 'Europe/London',
    });
    await insertStartingPolicy(trx, b.id, {
      taxMode: input.taxMode,
      taxRatePct: input.taxRatePct ?? country?.standardRatePct ?? '0',
      priceStep: minorUnitStep(input.currency).times(5).toFixed(),
    });
    await trx('sites').insert({ business_id: b.id, name: input.siteName });
    return toSessionUser(await insertUser(trx, { business_id: b.id, email: input.email, name: input.name, role: 'owner', password_hash: passwordHash }));
  });
}

/**
 * Sends a reset link when the address has an account. Called after the answer has gone, so
 * that the answer takes the same time whether the account exists or not; an account gets at
 * most RESETS_PER_HOUR links an hour, however often it is asked.
 */
export async function sendPasswordReset({ db, mailer, config }: AppDeps, email: string): Promise<void> {
  const user = await findUserByEmail(db, email);
  if (!user) return;
  if ((await resetsSentWithinHour(db, user.id)) >= RESETS_PER_HOUR) return;
  const { token, tokenHash } = newToken();
  await insertPasswordReset(db, user.id, tokenHash, RESET_HOURS);
  const link = `${config.APP_URL}/reset-password?token=${token}`;
  await mailer.send({
    to: user.email,
    subject: 'Reset your Tamp & Tally password',
    text: `Hello ${user.name},\n\nSomeone asked to reset the password of your Tamp & Tally account. To choose a new one, open this link within ${RESET_HOURS} hours:\n\n${link}\n\nThe link works once. If you did not ask for this, ignore this message; your password stays as it is.\n`,
  });
}

/** Sets the new password and ends every session of that user (whoever had the old one is signed out). */
export async function completePasswordReset({ db }: AppDeps, token: string, password: string): Promise<void> {
  const passwordHash = await hashPassword(password);
  await db.transaction(async (trx) => {
    const userId = await claimPasswordReset(trx, hashToken(token));
    if (!userId) throw badRequest('invalid_token', 'This reset link has expired or was already used. Ask for a new one.');
    await setPasswordHash(trx, userId, passwordHash);
    await expireResetsOf(trx, userId);
    await endSessionsOf(trx, userId);
  });
}

/** Changes the signed-in user's password; their other sessions end, this one stays. */
export async function changePassword({ db }: AppDeps, user: SessionUser, currentSid: string, current: string, next: string): Promise<void> {
  const row = await findUserById(db, user.id);
  if (!row?.password_hash || !(await verifyPassword(row.password_hash, current))) {
    throw invalidInput({ currentPassword: 'That is not your current password.' }, 'Your current password did not match.');
  }
  const passwordHash = await hashPassword(next);
  await db.transaction(async (trx) => {
    await setPasswordHash(trx, user.id, passwordHash);
    await expireResetsOf(trx, user.id);
    await endSessionsOf(trx, user.id, currentSid);
  });
}

async function openInvitation({ db }: Pick<AppDeps, 'db'>, token: string) {
  const inv = await findOpenInvitation(db, hashToken(token));
  if (!inv) throw notFound('This invitation');
  return inv;
}

export async function getInvitation(deps: AppDeps, token: string) {
  const inv = await openInvitation(deps, token);
  return { email: inv.email, role: inv.role, businessName: inv.business_name };
}

export async function acceptInvitation({ db }: AppDeps, token: string, input: { name: string; password: string }): Promise<SessionUser> {
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (trx) => {
    const inv = await openInvitation({ db: trx }, token);
    if (!(await claimInvitation(trx, inv.id))) throw notFound('This invitation');
    if (await findUserByEmail(trx, inv.email)) {
      throw conflict('email_taken', 'An account with this e-mail already exists. Sign in instead.');
    }
    return toSessionUser(await insertUser(trx, { business_id: inv.business_id, email: inv.email, name: input.name, role: inv.role, password_hash: passwordHash }));
  });
}
