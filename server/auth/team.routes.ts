import { Router } from 'express';
import { changeRole, invite, removeMember, revokeInvitation, team } from '../../src/shared/contract/team';
import type { AppDeps } from '../platform/deps';
import { endpointsOf } from '../platform/http/mount';
import * as service from './team.service';

export function teamRoutes(deps: AppDeps) {
  const r = Router();
  const on = endpointsOf(r, deps);
  on(team, ({ user }) => service.team(deps, user.businessId));
  on(invite, async ({ user, body }) => ({ invitation: await service.invite(deps, user, body) }));
  on(revokeInvitation, ({ user, params }) => service.revokeInvitation(deps, user.businessId, params.id));
  on(changeRole, async ({ user, params, body }) => ({ member: await service.changeRole(deps, user.businessId, params.id, body.role) }));
  on(removeMember, ({ user, params }) => service.removeMember(deps, user.businessId, params.id));
  return r;
}
