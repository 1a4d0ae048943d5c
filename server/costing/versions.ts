import type { Knex } from 'knex';

/**
 * The business's costing version: a number that goes up with every committed change to
 * anything costs and menu prices are worked out from (kept by triggers; see the migration
 * costing_versions). '0' until the first change.
 *
 * Read it BEFORE reading the data a result is computed from: a change committed in between
 * then leaves newer data under an older version, which the next read recomputes, never older
 * data under a newer one.
 */
export async function costingVersion(db: Knex, businessId: string): Promise<string> {
  const row = await db('costing_versions').where({ business_id: businessId }).first('version');
  return row ? String(row.version) : '0';
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
