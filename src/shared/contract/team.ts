import { z } from 'zod';
import { ROLES } from '../capabilities';
import { email } from '../schemas/basic-fields';
import { endpoint } from './endpoint';

export const memberSchema = z.object({ id: z.uuid(), email: z.string(), name: z.string(), role: z.enum(ROLES) });
export const invitationSchema = z.object({ id: z.uuid(), email: z.string(), role: z.enum(ROLES), expiresAt: z.string() });
export type Member = z.output<typeof memberSchema>;
export type Invitation = z.output<typeof invitationSchema>;

export const inviteSchema = z.object({ email, role: z.enum(ROLES, { error: 'Choose a role.' }) });
export const roleChangeSchema = z.object({ role: z.enum(ROLES, { error: 'Choose a role.' }) });

export const team = endpoint({
  method: 'GET', path: '/api/team', access: 'team.manage',
  summary: 'The members and the open invitations.',
  response: z.object({ members: z.array(memberSchema), invitations: z.array(invitationSchema) }),
});

export const invite = endpoint({
  method: 'POST', path: '/api/team/invitations', access: 'team.manage',
  summary: 'Invites someone by e-mail with a role (the link is e-mailed; it lasts 7 days).',
  body: inviteSchema, response: z.object({ invitation: invitationSchema }), status: 201,
  errors: { 409: '`email_taken`: that e-mail already has an account' },
});

export const revokeInvitation = endpoint({
  method: 'DELETE', path: '/api/team/invitations/:id', access: 'team.manage',
  summary: 'Withdraws an open invitation.',
  response: null,
});

export const changeRole = endpoint({
  method: 'PATCH', path: '/api/team/members/:id', access: 'team.manage',
  summary: "Changes a member's role.",
  body: roleChangeSchema, response: z.object({ member: memberSchema }),
  errors: { 409: '`last_owner`' },
});

export const removeMember = endpoint({
  method: 'DELETE', path: '/api/team/members/:id', access: 'team.manage',
  summary: 'Removes a member; their sessions end.',
  response: null,
  errors: { 409: '`last_owner`' },
});
