import type { TestProject } from 'vitest/node';
import { startThrowawayCluster } from '../../scripts/lib/postgres.mjs';
import { createDb, migrateLatest, runSeeds } from '../../server/platform/db';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
    /** A second database holding the demo seed, for the browser journeys. */
    e2eDatabaseUrl: string;
    /** A database of its own for the hostile-input walk, which checks that nothing at all changed. */
    hostileDatabaseUrl: string;
  }
}

/** One throwaway cluster for the whole run, migrated once (and a seeded copy for browser tests); always stopped. */
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
    cluster.createDatabase('tamp_hostile');
    const hostileUrl = cluster.urlFor('tamp_hostile');
    const hostile = createDb(hostileUrl);
    await migrateLatest(hostile);
    await hostile.destroy();
    project.provide('hostileDatabaseUrl', hostileUrl);
    cluster.createDatabase('tamp_e2e');
    const e2eUrl = cluster.urlFor('tamp_e2e');
    const e2e = createDb(e2eUrl);
    await migrateLatest(e2e);
    await runSeeds(e2e);
    await e2e.destroy();
    project.provide('e2eDatabaseUrl', e2eUrl);
  } catch (err) {
    stop();
    throw err;
  }
  return async () => {
    stop();
  };
}
