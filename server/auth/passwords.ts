import { createHash, randomBytes } from 'node:crypto';
import { hash, verify } from '@node-rs/argon2';

// argon2id with the library's defaults (19 MiB, 2 passes), as OWASP's
// password storage guidance recommends as a minimum.
export function hashPassword(password: string) {
  // Algorithm.Argon2id is 2 (a const enum that verbatimModuleSyntax cannot import).
  return hash(password, { algorithm: 2 });
}

export async function verifyPassword(hashed: string | null, password: string) {
  if (!hashed) return false;
  try {
    return await verify(hashed, password);
  } catch {
    return false;
  }
}

/** A random single-use token for a link; only its SHA-256 is stored. */
export function newToken() {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashToken(token) };
}

export function hashToken(token: string) {
  return createHash('sha256').update(token).digest('hex');
}
