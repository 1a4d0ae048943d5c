import { z } from 'zod';
import type { Capability } from '../capabilities';

/**
 * One API endpoint, declared once: the server mounts its handler from it, the client's fetchers
 * take their types from it, and the route table, the hostile-input walk and the README's API
 * section are read from it.
 */
export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/** Who may call: a capability of the role table, any signed-in user, or anyone. */
export type Access = Capability | 'signed-in' | 'public';

/** A response that is not JSON: a file, a CSV stream, a PDF. The handler writes it itself. */
export interface RawResponse {
  readonly raw: string;
}

export type ResponseSpec = z.ZodType | RawResponse | null;

/** How the body arrives: JSON checked by a schema, a multipart upload, or raw bytes (a signed webhook). */
export type BodySpec = z.ZodType | 'multipart' | 'raw';

export interface Endpoint {
  readonly method: Method;
  readonly path: `/api/${string}`;
  readonly access: Access;
  /** One line for the README: what the endpoint does. */
  readonly summary: string;
  /** Path parameters; by default each `:name` is a UUID (a malformed one is 404, like an unknown one). */
  readonly params?: z.ZodObject;
  readonly query?: z.ZodObject;
  readonly body?: BodySpec;
  /** The JSON answered on success; `null` for 204; a RawResponse for files and streams. */
  readonly response: ResponseSpec;
  /** The success status (200 unless said). */
  readonly status?: 200 | 201 | 202 | 204;
  /** Statuses other than the usual 400/401/403/404 it may answer, with why, for the README. */
  readonly errors?: Readonly<Record<number, string>>;
}

/** Declares an endpoint; `const` keeps its literal types for the handler and the client. */
export function endpoint<const E extends Endpoint>(e: E): E {
  return e;
}

export const raw = (contentType: string): RawResponse => ({ raw: contentType });

export function isRawResponse(r: ResponseSpec): r is RawResponse {
  return r !== null && typeof r === 'object' && 'raw' in r && typeof (r as RawResponse).raw === 'string';
}

export function isSchema(x: unknown): x is z.ZodType {
  return x instanceof z.ZodType;
}

type ParamNames<P extends string> = P extends `${string}:${infer Name}/${infer Rest}`
  ? Name | ParamNames<`/${Rest}`>
  : P extends `${string}:${infer Name}`
    ? Name
    : never;

/** The path parameters an endpoint takes, by name. */
export type ParamsOf<E extends Endpoint> = E['params'] extends z.ZodObject
  ? z.output<E['params']>
  : [ParamNames<E['path']>] extends [never]
    ? Record<string, never>
    : Record<ParamNames<E['path']>, string>;

export type QueryOf<E extends Endpoint> = E['query'] extends z.ZodObject ? z.output<E['query']> : Record<string, never>;
export type QueryInOf<E extends Endpoint> = E['query'] extends z.ZodObject ? z.input<E['query']> : Record<string, never>;
export type BodyOf<E extends Endpoint> = E['body'] extends z.ZodType ? z.output<E['body']> : undefined;
export type BodyInOf<E extends Endpoint> = E['body'] extends z.ZodType ? z.input<E['body']> : undefined;
/** What the handler returns: what the response schema accepts. */
export type ReplyOf<E extends Endpoint> = E['response'] extends z.ZodType ? z.input<E['response']> : void;
/** What the client receives. */
export type ResponseOf<E extends Endpoint> = E['response'] extends z.ZodType ? z.output<E['response']> : void;

export function paramNames(path: string): string[] {
  return [...path.matchAll(/:([A-Za-z0-9_]+)/g)].map((m) => m[1]);
}

/** The URL of an endpoint with its parameters filled in (each encoded) and its query appended. */
export function urlOf(e: Pick<Endpoint, 'path'>, params: Record<string, string> = {}, query: Record<string, unknown> = {}): string {
  const path = e.path.replace(/:([A-Za-z0-9_]+)/g, (_m, name: string) => {
    const v = params[name];
    if (v === undefined) throw new Error(`${e.path}: missing parameter ${name}`);
    return encodeURIComponent(v);
  });
  const qs = new URLSearchParams();
  for (const [k, v] of Object.entries(query)) {
    if (v === undefined || v === null || v === '') continue;
    if (Array.isArray(v)) for (const x of v) qs.append(k, String(x));
    else qs.set(k, String(v));
  }
  const s = qs.toString();
  return s ? `${path}?${s}` : path;
}

/** The success status of an endpoint. */
export function successStatus(e: Endpoint): number {
  return e.status ?? (e.response === null ? 204 : 200);
}
