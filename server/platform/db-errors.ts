import type { Knex } from 'knex';
import { AppError, conflict } from './errors';

interface PgError { code?: string; constraint?: string }

/**
 * Runs a write, turning PostgreSQL's unique and foreign-key refusals into 409s the client can show.
 */
export async function guardWrite<T>(what: string, fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (e) {
    if (e instanceof AppError) throw e;
    const pgErr = e as PgError;
    if (pgErr?.code === '23505') throw conflict('name_taken', `${what} with that name already exists.`);
    if (pgErr?.code === '23503') throw conflict('in_use', `${what} is still used elsewhere (a drink, preparation, modifier, pack or order). Remove it there first.`);
    throw e;
  }
}

/**
 * Runs a delete inside `trx` under a savepoint: its count, or 'referenced' when another row
 * still refers to what it deletes (PostgreSQL's foreign-key refusal), with `trx` still usable,
 * so the caller can keep the row for history (archive it) instead.
 */
export async function deleteUnlessReferenced(trx: Knex.Transaction, remove: (sp: Knex.Transaction) => Promise<number>): Promise<number | 'referenced'> {
  try {
    return await trx.transaction((sp) => remove(sp));
  } catch (e) {
    if ((e as PgError)?.code === '23503') return 'referenced';
    throw e;
  }
}
