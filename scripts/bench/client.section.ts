import { spawnSync } from 'node:child_process';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import * as chromeLauncher from 'chrome-launcher';
import lighthouse from 'lighthouse';
import { startThrowawayCluster } from '../lib/postgres.mjs';
import { createApp } from '../../server/app';
import { systemClock } from '../../server/platform/clock';
import { loadConfig } from '../../server/platform/config';
import { createDb, migrateLatest, runSeeds } from '../../server/platform/db';
import { createLogger } from '../../server/platform/logger';
import { createMailer } from '../../server/platform/mailer';
import { BUDGET, bundleReport } from '../bundle/budget';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/**
 * Bench section: the client as a café's phone gets it. The built client's sizes (the entry, the
 * sign-in page, each page's own chunk), then Lighthouse (its default mobile settings: a
 * mid-range phone's CPU, slow 4G, simulated) on the sign-in, menu costing and month-end pages
 * of the demo café, served by the real server with compression.
 */
export async function run() {
  // Built as it ships: the bench runs with NODE_ENV=test, which would give React's development build.
  spawnSync(path.join(root, 'node_modules/.bin/vite'), ['build', '--logLevel', 'error'], { cwd: root, stdio: 'inherit', env: { ...process.env, NODE_ENV: 'production' } });
  const report = bundleReport(path.join(root, 'dist'));
  console.log('\nClient: gzipped JavaScript (kB)');
  console.log(`  entry ${report.entryKb}; sign-in page in all ${report.signInKb} (budget ${BUDGET.signInKb}: ${report.signInKb <= BUDGET.signInKb ? 'met' : 'NOT met'})`);
  const worst = Math.max(...report.routes.map((r) => r.ownKb));
  console.log(`  each page's own chunk (budget ${BUDGET.routeChunkKb}: ${worst <= BUDGET.routeChunkKb ? 'met' : 'NOT met'}), and the page in all:`);
  for (const r of report.routes) console.log(`    ${r.page.padEnd(22)} ${String(r.ownKb).padStart(6)} ${String(r.totalKb).padStart(7)}`);

  const cluster = await startThrowawayCluster();
  const chrome = await chromeLauncher.launch({
    chromePath: '/usr/bin/chromium',
    chromeFlags: ['--headless=new', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  try {
    cluster.createDatabase('lighthouse');
    const url = cluster.urlFor('lighthouse');
    const db = createDb(url);
    await migrateLatest(db);
    await runSeeds(db);
    const config = loadConfig({ NODE_ENV: 'development', DATABASE_URL: url, LOG_LEVEL: 'silent', LOGIN_MAX_FAILURES_PER_ADDRESS: '1000' });
    const app = createApp({ db, config, mailer: createMailer({ host: '127.0.0.1', port: 1, from: 'bench@example.test' }), logger: createLogger('silent'), clock: systemClock });
    const server = await new Promise<Server>((resolve) => {
      const s = app.listen(0, '127.0.0.1', () => resolve(s));
    });
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'owner@demo.test', password: 'tamp-and-tally-demo' }) });
    if (login.status !== 200) throw new Error(`demo sign-in answered ${login.status}`);
    const cookie = String(login.headers.get('set-cookie')).split(';')[0];

    console.log('\nLighthouse (mobile): performance / accessibility, and first paint, largest paint, blocking time, layout shift');
    for (const [name, page, signedIn] of [['sign-in', '/sign-in', false], ['menu costing', '/menu-costing', true], ['month end', '/month-end', true]] as const) {
      const result = await lighthouse(`${base}${page}`, {
        port: chrome.port,
        output: 'json',
        logLevel: 'error',
        onlyCategories: ['performance', 'accessibility'],
        extraHeaders: signedIn ? { Cookie: cookie } : undefined,
      });
      if (!result) throw new Error(`Lighthouse gave no result for ${page}`);
      const { categories, audits } = result.lhr;
      const score = (c: string) => Math.round((categories[c]?.score ?? 0) * 100);
      const metric = (a: string) => audits[a]?.displayValue ?? '?';
      const perf = score('performance');
      console.log(
        `  ${name.padEnd(13)} ${String(perf).padStart(3)} / ${String(score('accessibility')).padStart(3)}   FCP ${metric('first-contentful-paint')}, LCP ${metric('largest-contentful-paint')}, TBT ${metric('total-blocking-time')}, CLS ${metric('cumulative-layout-shift')}  (target performance ≥ 90: ${perf >= 90 ? 'met' : 'NOT met'})`,
      );
    }
    await new Promise((r) => server.close(r));
    await app.locals.shutdown();
    await db.destroy().catch(() => undefined);
  } finally {
    chrome.kill();
    cluster.stop();
  }
}
