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

interface Cluster {
  databaseUrl: string;
  hostileDatabaseUrl: string;
  e2eDatabaseUrl: string;
  stop(): void;
}

// The server and browser projects share one cluster: the first to start makes it, the last to end stops it.
const shared = globalThis as typeof globalThis & { __tampCluster?: Promise<Cluster>; __tampClusterUsers?: number };

/** One throwaway cluster for the whole run, migrated once (and a seeded copy for browser tests); always stopped. */
export default async function setup(project: TestProject) {
  shared.__tampClusterUsers = (shared.__tampClusterUsers ?? 0) + 1;
  shared.__tampCluster ??= startCluster();
  const c = await shared.__tampCluster;
  project.provide('databaseUrl', c.databaseUrl);
  project.provide('hostileDatabaseUrl', c.hostileDatabaseUrl);
  project.provide('e2eDatabaseUrl', c.e2eDatabaseUrl);
  return async () => {
    shared.__tampClusterUsers = (shared.__tampClusterUsers ?? 1) - 1;
    if (shared.__tampClusterUsers === 0) c.stop();
  };
}

async function startCluster(): Promise<Cluster> {
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
    cluster.createDatabase('tamp_hostile');
    const hostileUrl = cluster.urlFor('tamp_hostile');
    const hostile = createDb(hostileUrl);
    await migrateLatest(hostile);
    await hostile.destroy();
    cluster.createDatabase('tamp_e2e');
    const e2eUrl = cluster.urlFor('tamp_e2e');
    const e2e = createDb(e2eUrl);
    await migrateLatest(e2e);
    await runSeeds(e2e);
    await e2e.destroy();
    return { databaseUrl: url, hostileDatabaseUrl: hostileUrl, e2eDatabaseUrl: e2eUrl, stop };
  } catch (err) {
    stop();
    throw err;
  }
}
