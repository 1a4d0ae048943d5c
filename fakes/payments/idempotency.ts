import { idempotencyMismatch, keyInUse, paramError } from './errors';

/**
 * Saved first responses per (API key, idempotency key). An entry is created
 * when the endpoint starts working and filled with its status and body, 402s
 * and 500s included. Errors raised before that point (authentication,
 * parameter validation, a key already in flight) leave nothing behind.
 */
export interface SavedResponse {
  status: number;
  body: unknown;
  requestId: string;
}

interface Entry {
  endpoint: string;
  fingerprint: string;
  saved: SavedResponse | null;
}

export const MAX_KEY_LENGTH = 255;

/** A stable rendering of parsed parameters: object keys sorted, arrays in order. */
export function fingerprint(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(fingerprint).join(',')}]`;
  if (value && typeof value === 'object') {
    const keys = Object.keys(value).sort();
    return `{${keys.map((k) => `${JSON.stringify(k)}:${fingerprint((value as Record<string, unknown>)[k])}`).join(',')}}`;
  }
  return JSON.stringify(value ?? null);
}

export type Lookup =
  | { kind: 'new'; complete(saved: SavedResponse): void; abandon(): void }
  | { kind: 'replay'; saved: SavedResponse };

export class IdempotencyStore {
  private readonly entries = new Map<string, Entry>();

  /**
   * Claims a key for a request, or answers what the first request with it got.
   * Throws 409 while the first is still running and 400 `idempotency_error`
   * when the key was used for another endpoint or other parameters.
   */
  begin(apiKey: string, key: string, endpoint: string, params: unknown): Lookup {
    if (key.length > MAX_KEY_LENGTH) {
      throw paramError(
        `Invalid Idempotency-Key: keys can be at most ${MAX_KEY_LENGTH} characters long.`,
        undefined,
        'idempotency_key_too_long',
      );
    }
    const id = `${apiKey}\u0000${key}`;
    const print = fingerprint(params);
    const existing = this.entries.get(id);
    if (existing) {
      if (!existing.saved) throw keyInUse(key);
      if (existing.endpoint !== endpoint) {
        throw idempotencyMismatch(
          `Keys for idempotent requests can only be used for the same endpoint they were first used for ('${existing.endpoint}' vs '${endpoint}'). Try using a key other than '${key}' if you meant to execute a different request.`,
        );
      }
      if (existing.fingerprint !== print) {
        throw idempotencyMismatch(
          `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
        );
      }
      return { kind: 'replay', saved: existing.saved };
    }
    const entry: Entry = { endpoint, fingerprint: print, saved: null };
    this.entries.set(id, entry);
    return {
      kind: 'new',
      complete: (saved) => {
        entry.saved = saved;
      },
      abandon: () => {
        if (this.entries.get(id) === entry) this.entries.delete(id);
      },
    };
  }

  clear(): void {
    this.entries.clear();
  }
}
