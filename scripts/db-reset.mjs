// npm run db:reset: rebuilds the product's database with the demo data.
import { bin, ensureDependencies, run, startAppCluster } from './lib/stack.mjs';

ensureDependencies();
const { cluster, databaseUrl } = startAppCluster();
try {
  cluster.dropDatabase('tamp');
  cluster.createDatabase('tamp');
  const code = run(bin('tsx'), ['scripts/db.ts', 'reset'], { DATABASE_URL: databaseUrl });
  process.exitCode = code;
} finally {
  cluster.stop();
}
