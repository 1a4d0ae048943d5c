import type { Knex } from 'knex';

/** Kinds of data with a version each (see the migration costing_versions). */
export type DataKind = 'costing' | 'books';

/**
 * The business's version of a kind of data: a number that goes up with every committed change
 * to it (kept by triggers). 'costing' covers anything costs and menu prices are worked out
 * from; 'books' the counts, deliveries, waste and sites of the cost-of-goods report. '0' until
 * the first change.
 *
 * Read it BEFORE reading the data a result is computed from: a change committed in between
 * then leaves newer data under an older version, which the next read recomputes, never older
 * data under a newer one.
 */
export async function dataVersion(db: Knex, businessId: string, kind: DataKind): Promise<string> {
  const row = await db('data_versions').where({ business_id: businessId, kind }).first('version');
  return row ? String(row.version) : '0';
}

/** The business's costing version ({@link dataVersion} of 'costing'). */
export function costingVersion(db: Knex, businessId: string): Promise<string> {
  return dataVersion(db, businessId, 'costing');
}

interface Entry<T> {
  version: string;
  value: Promise<T>;
}

/**
 * Results worked out from a business's costing data, kept while its version is unchanged.
 * Least recently used entries go first past `limit`. Concurrent readers of one key share one
 * computation; a failed computation is not kept.
 */
export class VersionedCache<T> {
  private readonly entries = new Map<string, Entry<T>>();
  constructor(private readonly limit: number) {}

  get(key: string, version: string, compute: () => Promise<T>): Promise<T> {
    const hit = this.entries.get(key);
    if (hit && hit.version === version) {
      // Re-inserted: the Map's order is the order of use.
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit.value;
    }
    const value = compute();
    const entry = { version, value };
    this.entries.delete(key);
    this.entries.set(key, entry);
    while (this.entries.size > this.limit) this.entries.delete(this.entries.keys().next().value as string);
    value.catch(() => {
      if (this.entries.get(key) === entry) this.entries.delete(key);
    });
    return value;
  }

  get size() {
    return this.entries.size;
  }

  clear() {
    this.entries.clear();
  }
}

const caches = new WeakMap<Knex, Map<string, VersionedCache<unknown>>>();

/**
 * The cache named `name` for one database handle: two databases (a test's and the demo's) may
 * hold the same business id at the same version number with different data, so entries never
 * cross handles.
 */
export function cacheFor<T>(db: Knex, name: string, limit: number): VersionedCache<T> {
  let byName = caches.get(db);
  if (!byName) caches.set(db, (byName = new Map()));
  let cache = byName.get(name);
  if (!cache) byName.set(name, (cache = new VersionedCache<unknown>(limit)));
  return cache as VersionedCache<T>;
}
