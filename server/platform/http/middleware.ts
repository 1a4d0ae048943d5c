import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { NextFunction, Request, Response } from 'express';
import { AppError, forbidden, notFound, unauthenticated } from '../errors';
import { can, type Capability } from '../../auth/roles';

/** 401 unless signed in. */
export function requireUser(req: Request, _res: Response, next: NextFunction) {
  if (!req.user) throw unauthenticated();
  next();
}

/** 401 unless signed in, 403 unless the role has the capability. */
export function allow(capability: Capability) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (!req.user) throw unauthenticated();
    if (!can(req.user.role, capability)) throw forbidden();
    next();
  };
}

export function csrfTokenFor(req: Request): string {
  if (!req.session.csrfToken) req.session.csrfToken = randomBytes(24).toString('base64url');
  return req.session.csrfToken;
}

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Synchroniser-token CSRF check: a signed-in session's state-changing request
 * must carry X-CSRF-Token. Anonymous requests pass through to get their 401.
 */
export function csrfProtection(isExempt: (path: string) => boolean) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE.has(req.method) || !req.user || isExempt(req.path)) return next();
    const sent = req.get('x-csrf-token') ?? '';
    const expected = req.session.csrfToken ?? '';
    const ok = sent.length > 0 && sent.length === expected.length && timingSafeEqual(Buffer.from(sent), Buffer.from(expected));
    if (!ok) {
      return next(new AppError(403, 'csrf', 'The request is missing its security token. Reload the page and try again.'));
    }
    next();
  };
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** For `router.param(name, uuidParam)`: a malformed id is simply not found. */
export function uuidParam(_req: Request, _res: Response, next: NextFunction, value: string) {
  if (!UUID.test(value)) throw notFound();
  next();
}
