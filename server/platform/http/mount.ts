import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import type { z } from 'zod';
import type { SessionUser } from '../../auth/roles';
import { can } from '../../../src/shared/capabilities';
import {
  isRawResponse,
  isSchema,
  paramNames,
  successStatus,
  type BodyOf,
  type Endpoint,
  type ParamsOf,
  type QueryOf,
  type ReplyOf,
} from '../../../src/shared/contract/endpoint';
import { zodFieldErrors } from '../../../src/shared/schemas/field-errors';
import { AppError, forbidden, invalidInput, notFound, unauthenticated } from '../errors';
import type { AppDeps } from '../deps';

/** What a handler is given: the checked input and, for the rare handler that needs them, req and res. */
export interface HandlerInput<E extends Endpoint> {
  user: E['access'] extends 'public' ? SessionUser | undefined : SessionUser;
  params: ParamsOf<E>;
  query: QueryOf<E>;
  body: BodyOf<E>;
  req: Request;
  res: Response;
}

/** An answer with a status other than the entry's success status (health's 503), still in the entry's shape. */
export class Reply<T> {
  constructor(
    readonly status: number,
    readonly body: T,
  ) {}
}

type Answer<E extends Endpoint> = ReplyOf<E> | Reply<ReplyOf<E>>;
export type Handler<E extends Endpoint> = (input: HandlerInput<E>) => Promise<Answer<E>> | Answer<E>;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function checkAccess(e: Endpoint, req: Request): void {
  if (e.access === 'public') return;
  if (!req.user) throw unauthenticated();
  if (e.access !== 'signed-in' && !can(req.user.role, e.access)) throw forbidden();
}

/** Path parameters: by the entry's schema, else each a UUID. Anything malformed is simply not found. */
function readParams(e: Endpoint, req: Request): Record<string, unknown> {
  const raw = req.params as Record<string, string>;
  if (e.params) {
    const r = e.params.safeParse(raw);
    if (!r.success) throw notFound();
    return r.data as Record<string, unknown>;
  }
  for (const name of paramNames(e.path)) if (!UUID.test(raw[name] ?? '')) throw notFound();
  return { ...raw };
}

function readInput(schema: z.ZodType | undefined, input: unknown): unknown {
  if (!schema) return undefined;
  const r = schema.safeParse(input ?? {});
  if (!r.success) throw invalidInput(zodFieldErrors(r.error));
  return r.data;
}

export interface MountOptions {
  /** Middleware run after the access check and before the input is read (an upload parser, a rate limit). */
  before?: RequestHandler[];
}

/**
 * Mounts the handler of one contract entry: access (401/403) → path parameters (404) → query
 * and body (400 naming each field) → handler → the response, checked against the entry's
 * schema when `checkResponses` is on (tests and development), so a handler cannot drift from
 * what the contract promises.
 */
export function mountEndpoint<E extends Endpoint>(router: Router, deps: AppDeps, e: E, handler: Handler<E>, options: MountOptions = {}): void {
  const method = e.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
  const guard = (req: Request, _res: Response, next: NextFunction) => {
    checkAccess(e, req);
    next();
  };
  const run = async (req: Request, res: Response) => {
    const params = readParams(e, req);
    const query = readInput(e.query, req.query);
    const body = isSchema(e.body) ? readInput(e.body, req.body) : undefined;
    const answer = await handler({ user: req.user, params, query, body, req, res } as unknown as HandlerInput<E>);
    if (isRawResponse(e.response) || res.headersSent) return;
    const status = answer instanceof Reply ? answer.status : successStatus(e);
    const reply = answer instanceof Reply ? answer.body : answer;
    if (e.response === null) {
      res.status(status).end();
      return;
    }
    if (deps.config.checkResponses) {
      const r = e.response.safeParse(reply);
      if (!r.success) {
        throw new AppError(500, 'contract_broken', `${e.method} ${e.path} answered outside its contract: ${JSON.stringify(zodFieldErrors(r.error))}`);
      }
    }
    res.status(status).json(reply);
  };
  router[method](e.path, guard, ...(options.before ?? []), run);
}

/** The mount function of one router, so a domain's routes file reads as a list of entries and handlers. */
export function endpointsOf(router: Router, deps: AppDeps) {
  return <E extends Endpoint>(e: E, handler: Handler<E>, options?: MountOptions) => mountEndpoint(router, deps, e, handler, options);
}
