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
