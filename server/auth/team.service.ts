import type { Invitation, Member } from '../../src/shared/contract/team';
import type { AppDeps } from '../platform/deps';
import { conflict, notFound } from '../platform/errors';
import { INVITE_DAYS } from './auth.service';
import { newToken } from './passwords';
import type { Role, SessionUser } from './roles';
import {
  businessName, countOwners, deleteOpenInvitation, deleteUser, findMember, insertInvitation, listMembers, listOpenInvitations, lockOwners, setRole,
  type InvitationRow,
} from './team.repo';
import { endSessionsOf, findUserByEmail } from './users.repo';

const ROLE_WORDS: Record<Role, string> = {
  owner: 'an owner (everything, including the team and payments)',
  manager: 'a manager (ingredients, recipes, prices, suppliers, orders and stock counts)',
  barista: 'a barista (drink builds for the bar, waste and stock counts)',
  bookkeeper: 'the bookkeeper (reads costs, orders and reports, and exports them)',
};

const presentInvitation = (r: InvitationRow): Invitation => ({ id: r.id, email: r.email, role: r.role, expiresAt: new Date(r.expires_at).toISOString() });

export async function team({ db }: AppDeps, businessId: string): Promise<{ members: Member[]; invitations: Invitation[] }> {
  const [members, invitations] = await Promise.all([listMembers(db, businessId), listOpenInvitations(db, businessId)]);
  return { members, invitations: invitations.map(presentInvitation) };
}

export async function invite({ db, mailer, config }: AppDeps, by: SessionUser, input: { email: string; role: Role }): Promise<Invitation> {
  if (await findUserByEmail(db, input.email)) {
    throw conflict('email_taken', 'That e-mail already has a Tamp & Tally account.');
  }
  const { token, tokenHash } = newToken();
  const name = await businessName(db, by.businessId);
  const row = await insertInvitation(db, { business_id: by.businessId, email: input.email, role: input.role, token_hash: tokenHash, invited_by: by.id }, INVITE_DAYS);
  const link = `${config.APP_URL}/accept-invite?token=${token}`;
  await mailer.send({
    to: input.email,
    subject: `${by.name} invited you to ${name} on Tamp & Tally`,
    text: `Hello,\n\n${by.name} has invited you to join ${name} on Tamp & Tally as ${ROLE_WORDS[input.role]}.\n\nTo accept, choose your name and a password here within ${INVITE_DAYS} days:\n\n${link}\n`,
  });
  return presentInvitation(row);
}

export async function revokeInvitation({ db }: AppDeps, businessId: string, id: string): Promise<void> {
  if (!(await deleteOpenInvitation(db, businessId, id))) throw notFound('That invitation');
}

const LAST_OWNER = 'A business needs at least one owner. Make someone else an owner first.';

/** Changes a role; the business always keeps at least one owner. */
export async function changeRole({ db }: AppDeps, businessId: string, id: string, role: Role): Promise<Member> {
  return db.transaction(async (trx) => {
    await lockOwners(trx, businessId);
    const m = await findMember(trx, businessId, id);
    if (!m) throw notFound('That team member');
    if (m.role === 'owner' && role !== 'owner' && (await countOwners(trx, businessId)) <= 1) throw conflict('last_owner', LAST_OWNER);
    await setRole(trx, id, role);
    return { ...m, role };
  });
}

/** Removes a member; their sessions end with them. */
export async function removeMember({ db }: AppDeps, businessId: string, id: string): Promise<void> {
  await db.transaction(async (trx) => {
    await lockOwners(trx, businessId);
    const m = await findMember(trx, businessId, id);
    if (!m) throw notFound('That team member');
    if (m.role === 'owner' && (await countOwners(trx, businessId)) <= 1) throw conflict('last_owner', LAST_OWNER);
    await endSessionsOf(trx, id);
    await deleteUser(trx, id);
  });
}
