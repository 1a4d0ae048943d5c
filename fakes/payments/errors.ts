/**
 * Error bodies in the shape the payments API answers and the SDK parses:
 * `{error: {type, code, decline_code, message, param, doc_url, ...}}`.
 */

export type ErrorType = 'invalid_request_error' | 'idempotency_error' | 'card_error' | 'api_error';

export interface RawApiError {
  type: ErrorType;
  message: string;
  code?: string;
  decline_code?: string;
  param?: string;
  doc_url?: string;
  charge?: string;
  payment_intent?: unknown;
  payment_method?: unknown;
}

/**
 * `stored: false` marks errors raised before the endpoint started working
 * (authentication, parameter validation, in-flight conflicts): the
 * idempotency layer does not save them, so a retry with the same key runs anew.
 */
export class FakeApiError extends Error {
  constructor(
    readonly status: number,
    readonly raw: RawApiError,
    readonly stored: boolean,
  ) {
    super(raw.message);
  }

  body(): { error: RawApiError } {
    return { error: this.raw };
  }
}

export function docUrl(code: string): string {
  return `https://stripe.com/docs/error-codes/${code.replace(/_/g, '-')}`;
}

function invalid(
  status: number,
  message: string,
  opts: { code?: string; param?: string; stored: boolean },
): FakeApiError {
  const raw: RawApiError = { type: 'invalid_request_error', message };
  if (opts.code) {
    raw.code = opts.code;
    raw.doc_url = docUrl(opts.code);
  }
  if (opts.param) raw.param = opts.param;
  return new FakeApiError(status, raw, opts.stored);
}

/** A request whose parameters are wrong: 400, never saved for idempotency. */
export function paramError(message: string, param?: string, code?: string): FakeApiError {
  return invalid(400, message, { code, param, stored: false });
}

export function missingParam(param: string): FakeApiError {
  return paramError(`Missing required param: ${param}.`, param, 'parameter_missing');
}

/** A lookup of an object named in a parameter that does not exist: 400 resource_missing. */
export function noSuchParam(kind: string, id: string, param: string): FakeApiError {
  return invalid(400, `No such ${kind}: '${id}'`, { code: 'resource_missing', param, stored: true });
}

/** The object named in the URL does not exist: 404 resource_missing. */
export function notFound(kind: string, id: string, param = 'id'): FakeApiError {
  return invalid(404, `No such ${kind}: '${id}'`, { code: 'resource_missing', param, stored: true });
}

/** The request is well formed but the object's state forbids it; saved for idempotency. */
export function stateError(status: number, message: string, code: string, param?: string): FakeApiError {
  return invalid(status, message, { code, param, stored: true });
}

export function authError(message: string): FakeApiError {
  return new FakeApiError(401, { type: 'invalid_request_error', message }, false);
}

export function idempotencyMismatch(message: string): FakeApiError {
  return new FakeApiError(400, { type: 'idempotency_error', message }, false);
}

export function keyInUse(key: string): FakeApiError {
  return invalid(
    409,
    `There is currently another in-progress request using this idempotent key (that probably means you submitted twice, and the other request is still going through): ${key}. Please try again later.`,
    { code: 'idempotency_key_in_use', stored: false },
  );
}

export function internalError(message = 'An unknown error occurred in the local payments fake.'): FakeApiError {
  return new FakeApiError(500, { type: 'api_error', message }, false);
}
