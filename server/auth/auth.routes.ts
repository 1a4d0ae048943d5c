import { Router, type Request } from 'express';
import type passport from 'passport';
import {
  acceptInvitation, changePassword, completePasswordReset, invitation, login, logout, me, requestPasswordReset, signup,
} from '../../src/shared/contract/auth';
import type { Session } from '../../src/shared/contract/auth';
import type { AppDeps } from '../platform/deps';
import { AppError } from '../platform/errors';
import { endpointsOf } from '../platform/http/mount';
import { csrfTokenFor } from '../platform/http/middleware';
import * as auth from './auth.service';
import { authenticateLocal, logIn, logOut } from './passport';
import type { SessionUser } from './roles';
import { assertLoginAllowed, assertResetAllowed, recordLoginFailure, recordLoginSuccess } from './throttle';

/** Routes that work without a session, and so without a CSRF token. */
const CSRF_EXEMPT = new Set([
  '/api/auth/login',
  '/api/auth/signup',
  '/api/auth/password-reset/request',
  '/api/auth/password-reset/complete',
]);
export const isCsrfExempt = (path: string) => CSRF_EXEMPT.has(path) || /^\/api\/invitations\/[^/]+\/accept$/.test(path);

/** Reset requests from one address: this many in a quarter of an hour, then 429. */
const RESETS_PER_ADDRESS = 10;

const address = (req: Request) => req.ip ?? 'unknown';

export function authRoutes(deps: AppDeps, p: passport.Authenticator) {
  const { db, config } = deps;
  const r = Router();
  const on = endpointsOf(r, deps);
  const throttle = { maxFailures: config.LOGIN_MAX_FAILURES, maxFailuresPerAddress: config.LOGIN_MAX_FAILURES_PER_ADDRESS, windowMinutes: config.LOGIN_WINDOW_MINUTES };

  async function session(req: Request, user: SessionUser): Promise<Session> {
    return { user, csrfToken: csrfTokenFor(req), business: await auth.businessOf(deps, user.businessId) };
  }

  on(login, async ({ req, body }) => {
    await assertLoginAllowed(db, body.email, address(req));
    const user = await authenticateLocal(p, req);
    if (!user) {
      await recordLoginFailure(db, throttle, body.email, address(req));
      throw new AppError(401, 'bad_credentials', 'That e-mail and password do not match an account.');
    }
    await recordLoginSuccess(db, body.email, address(req));
    await logIn(req, user);
    return session(req, user);
  });

  on(me, ({ req, user }) => session(req, user));

  on(logout, async ({ req, res }) => {
    if (req.user) await logOut(req);
    res.clearCookie('tt.sid');
  });

  on(changePassword, async ({ req, user, body }) => {
    await auth.changePassword(deps, user, req.sessionID, body.currentPassword, body.newPassword);
  });

  on(signup, async ({ req, body }) => {
    const user = await auth.signup(deps, body);
    await logIn(req, user);
    return session(req, user);
  });

  on(requestPasswordReset, async ({ req, body }) => {
    await assertResetAllowed(db, address(req), RESETS_PER_ADDRESS, 15);
    // The answer goes before the lookup, so its timing says nothing of whether the account exists.
    deps.background.run('password reset', () => auth.sendPasswordReset(deps, body.email));
    return { ok: true as const };
  });

  on(completePasswordReset, async ({ body }) => {
    await auth.completePasswordReset(deps, body.token, body.password);
  });

  on(invitation, ({ params }) => auth.getInvitation(deps, params.token));

  on(acceptInvitation, async ({ req, params, body }) => {
    const user = await auth.acceptInvitation(deps, params.token, body);
    await logIn(req, user);
    return session(req, user);
  });

  return r;
}
