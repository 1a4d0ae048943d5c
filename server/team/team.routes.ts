import { Router } from 'express';
import type { AppDeps } from '../platform/deps';
import { inviteSchema, roleChangeSchema } from '../auth/auth.schemas';
import { allow, uuidParam } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';
import { listMembers, listOpenInvitations } from './team.repo';
import * as team from './team.service';

export function teamRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();

  r.param('id', uuidParam);

  r.get('/api/team', allow('team.manage'), async (req, res) => {
    const b = req.user!.businessId;
    res.json({ members: await listMembers(db, b), invitations: await listOpenInvitations(db, b) });
  });

  r.post('/api/team/invitations', allow('team.manage'), async (req, res) => {
    const input = parse(inviteSchema, req.body);
    res.status(201).json({ invitation: await team.invite(db, deps.mailer, deps.config.APP_URL, req.user!, input) });
  });

  r.delete('/api/team/invitations/:id', allow('team.manage'), async (req, res) => {
    await team.revokeInvitation(db, req.user!.businessId, String(req.params.id));
    res.status(204).end();
  });

  r.patch('/api/team/members/:id', allow('team.manage'), async (req, res) => {
    const { role } = parse(roleChangeSchema, req.body);
    res.json({ member: await team.changeRole(db, req.user!.businessId, String(req.params.id), role) });
  });

  r.delete('/api/team/members/:id', allow('team.manage'), async (req, res) => {
    await team.removeMember(db, req.user!.businessId, String(req.params.id));
    res.status(204).end();
  });

  return r;
}
