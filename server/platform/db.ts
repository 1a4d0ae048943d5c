import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import knexFactory, { type Knex } from 'knex';
import pg from 'pg';

// numeric and bigint columns arrive as strings (decimal strings in the API);
// dates (type 1082) stay 'YYYY-MM-DD' strings instead of becoming local-midnight Dates.
pg.types.setTypeParser(1082, (v: string) => v);

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
export const migrationsDir = path.join(root, 'migrations');
export const seedsDir = path.join(root, 'seeds');

/**
 * Loads .ts migrations through our own import() so they work under tsx and
 * vitest alike (knex's own loader bypasses the TypeScript transform).
 */
class FolderSource {
  constructor(private dir: string) {}
  async getMigrations() {
    return fs.readdirSync(this.dir).filter((f) => /\.(ts|js|mjs)$/.test(f) && !f.endsWith('.d.ts')).sort();
  }
  getMigrationName(name: string) {
    return name;
  }
  async getMigration(name: string) {
    return import(pathToFileURL(path.join(this.dir, name)).href);
  }
}

export function createDb(databaseUrl: string, pool: { min?: number; max?: number } = {}): Knex {
  return knexFactory({
    client: 'pg',
    connection: databaseUrl,
    pool: { min: pool.min ?? 0, max: pool.max ?? 10 },
    migrations: { migrationSource: new FolderSource(migrationsDir), tableName: 'knex_migrations' },
  });
}

export async function migrateLatest(db: Knex) {
  await db.migrate.latest();
}

/** Runs the numbered seeds in order; each seed resets its own tables. */
export async function runSeeds(db: Knex) {
  const files = fs.readdirSync(seedsDir).filter((f) => /\.(ts|js)$/.test(f) && !f.endsWith('.d.ts')).sort();
  for (const f of files) {
    const mod = await import(pathToFileURL(path.join(seedsDir, f)).href);
    await mod.seed(db);
  }
}
