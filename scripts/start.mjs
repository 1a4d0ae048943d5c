// npm start: installs what is missing, runs PostgreSQL, the local fakes and the
// product on the demo data at http://127.0.0.1:3000, and stops it all on Ctrl-C.
import fs from 'node:fs';
import path from 'node:path';
import { bin, ensureDependencies, onStop, root, run, startAppCluster, startChild, stopAll, stopOnSignals } from './lib/stack.mjs';

ensureDependencies();
stopOnSignals();
const { cluster, databaseUrl } = startAppCluster();
onStop(() => cluster.stop());

const port = process.env.PORT ?? '3000';
const env = {
  DATABASE_URL: process.env.DATABASE_URL ?? databaseUrl,
  PORT: port,
  APP_URL: process.env.APP_URL ?? `http://127.0.0.1:${port}`,
  NODE_ENV: process.env.NODE_ENV ?? 'development',
};

if (run(bin('tsx'), ['scripts/db.ts', 'seed-once'], env) !== 0) await stopAll(1);
if (run(bin('vite'), ['build', '--logLevel', 'warn'], { NODE_ENV: 'production' }) !== 0) await stopAll(1);

for (const fake of ['mail', 'payments']) {
  const main = path.join(root, 'fakes', fake, 'main.ts');
  if (fs.existsSync(main)) startChild(`${fake} fake`, bin('tsx'), [main], { ...env, PAYMENTS_WEBHOOK_SECRET: process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_tamp_and_tally_local_secret', PAYMENTS_WEBHOOK_URL: `${env.APP_URL}/api/webhooks/payments` });
}
startChild('server', bin('tsx'), ['server/index.ts'], env);

console.log(`
Tamp & Tally is starting at ${env.APP_URL}
Demo sign-ins (password: tamp-and-tally-demo):
  owner@demo.test   manager@demo.test   barista@demo.test   bookkeeper@demo.test
  owner2@demo.test  (a second business, to see that data stays apart)
Fake mailbox: http://127.0.0.1:${process.env.MAIL_FAKE_HTTP_PORT ?? 8025}
Press Ctrl-C to stop everything.
`);
