import type { TestProject } from 'vitest/node';
import { startThrowawayCluster } from '../../scripts/lib/postgres.mjs';
import { createDb, migrateLatest } from '../../server/db/knex';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
  }
}

/** One throwaway cluster for the whole run, migrated once; always stopped. */
export default async function setup(project: TestProject) {
  const cluster = await startThrowawayCluster();
  const stop = () => cluster.stop();
  const onSignal = () => { stop(); process.exit(130); };
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);
  process.once('exit', stop);
  try {
    cluster.createDatabase('tamp_test');
    const url = cluster.urlFor('tamp_test');
    const db = createDb(url);
    await migrateLatest(db);
    await db.destroy();
    project.provide('databaseUrl', url);
  } catch (err) {
    stop();
    throw err;
  }
  return async () => {
    stop();
  };
}
