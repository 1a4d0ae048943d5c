import type { Knex } from 'knex';
import { invalidInput } from './errors';

/**
 * Ids that arrive in a body or a query (not in the path) name something the request uses: one
 * that is not this business's, or does not exist, is the caller's mistake in that field, so it
 * is answered 400 `invalid_input` naming the field, exactly as a malformed one. (An id in the
 * path names the record itself, and is answered 404.)
 */
export async function assertOwnedIds(
  db: Knex,
  businessId: string,
  table: string,
  ids: readonly { field: string; id: string }[],
  message: string,
): Promise<void> {
  if (ids.length === 0) return;
  const wanted = [...new Set(ids.map((i) => i.id))];
  const found = new Set((await db(table).where({ business_id: businessId }).whereIn('id', wanted).pluck('id')) as string[]);
  const fields: Record<string, string> = {};
  for (const { field, id } of ids) if (!found.has(id) && !(field in fields)) fields[field] = message;
  if (Object.keys(fields).length > 0) throw invalidInput(fields);
}

/** One id of a body or query: 400 naming `field` unless it is this business's row of `table`. */
export function assertOwnedId(db: Knex, businessId: string, table: string, field: string, id: string, message: string): Promise<void> {
  return assertOwnedIds(db, businessId, table, [{ field, id }], message);
}
