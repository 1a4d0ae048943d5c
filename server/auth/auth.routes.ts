import { Router, type Request } from 'express';
import type { AppDeps } from '../platform/deps';
import { unauthenticated } from '../platform/errors';
import { csrfTokenFor } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';
import { acceptInviteSchema, loginSchema, resetCompleteSchema, resetRequestSchema, signupSchema } from './auth.schemas';
import * as auth from './auth.service';
import { authenticateLocal, logIn, logOut } from './passport';
import type { SessionUser } from './roles';
import { loginThrottles } from './throttle';
import { findBusiness } from './users.repo';
import type passport from 'passport';

/** Routes that work without a session, and so without a CSRF token. */
const CSRF_EXEMPT = new Set([
  '/api/auth/login',
  '/api/auth/signup',
  '/api/auth/password-reset/request',
  '/api/auth/password-reset/complete',
]);
export const isCsrfExempt = (path: string) => CSRF_EXEMPT.has(path) || /^\/api\/invitations\/[^/]+\/accept$/.test(path);

export function authRoutes(deps: AppDeps, p: passport.Authenticator) {
  const { db } = deps;
  const r = Router();

  async function loginBody(req: Request, user: SessionUser) {
    return { user, csrfToken: csrfTokenFor(req), business: await findBusiness(db, user.businessId) };
  }

  r.post('/api/auth/login', ...loginThrottles(db, { maxFailures: deps.config.LOGIN_MAX_FAILURES, maxFailuresPerAddress: deps.config.LOGIN_MAX_FAILURES_PER_ADDRESS, windowMinutes: deps.config.LOGIN_WINDOW_MINUTES }), async (req, res) => {
    parse(loginSchema, req.body);
    const user = await authenticateLocal(p, req);
    if (!user) {
      res.status(401).json({ error: { code: 'bad_credentials', message: 'That e-mail and password do not match an account.' } });
      return;
    }
    await logIn(req, user);
    res.json(await loginBody(req, user));
  });

  r.get('/api/auth/me', async (req, res) => {
    if (!req.user) throw unauthenticated();
    res.json(await loginBody(req, req.user));
  });

  r.post('/api/auth/logout', async (req, res) => {
    if (req.user) await logOut(req);
    res.clearCookie('tt.sid');
    res.status(204).end();
  });

  r.post('/api/auth/signup', async (req, res) => {
    const input = parse(signupSchema, req.body);
    const user = await auth.signup(db, input);
    await logIn(req, user);
    res.status(201).json(await loginBody(req, user));
  });

  r.post('/api/auth/password-reset/request', async (req, res) => {
    const { email } = parse(resetRequestSchema, req.body);
    await auth.requestPasswordReset(db, deps.mailer, deps.config.APP_URL, email);
    res.status(202).json({ ok: true });
  });

  r.post('/api/auth/password-reset/complete', async (req, res) => {
    const { token, password } = parse(resetCompleteSchema, req.body);
    await auth.completePasswordReset(db, token, password);
    res.status(204).end();
  });

  r.get('/api/invitations/:token', async (req, res) => {
    res.json(await auth.getInvitation(db, req.params.token));
  });

  r.post('/api/invitations/:token/accept', async (req, res) => {
    const input = parse(acceptInviteSchema, req.body);
    const user = await auth.acceptInvitation(db, req.params.token, input);
    await logIn(req, user);
    res.status(201).json(await loginBody(req, user));
  });

  return r;
}
