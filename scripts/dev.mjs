// npm run dev: Vite's dev server with hot reload on :5173, proxying /api to the
// Express server under tsx watch, with PostgreSQL and the fakes as for npm start.
import fs from 'node:fs';
import path from 'node:path';
import { bin, ensureDependencies, onStop, root, run, startAppCluster, startChild, stopAll, stopOnSignals } from './lib/stack.mjs';

ensureDependencies();
stopOnSignals();
const { cluster, databaseUrl } = startAppCluster();
onStop(() => cluster.stop());
const port = process.env.PORT ?? '3000';
const env = { DATABASE_URL: process.env.DATABASE_URL ?? databaseUrl, PORT: port, APP_URL: process.env.APP_URL ?? 'http://127.0.0.1:5173', NODE_ENV: 'development' };
if (run(bin('tsx'), ['scripts/db.ts', 'seed-once'], env) !== 0) await stopAll(1);
for (const fake of ['mail', 'payments']) {
  const main = path.join(root, 'fakes', fake, 'main.ts');
  if (fs.existsSync(main)) startChild(`${fake} fake`, bin('tsx'), [main], { ...env, PAYMENTS_WEBHOOK_SECRET: process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_tamp_and_tally_local_secret', PAYMENTS_WEBHOOK_URL: `http://127.0.0.1:${port}/api/webhooks/payments` });
}
startChild('server', bin('tsx'), ['watch', 'server/index.ts'], env);
startChild('vite', bin('vite'), [], env);
console.log('Dev: http://127.0.0.1:5173 (Ctrl-C stops everything)');
