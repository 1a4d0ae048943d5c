// The bench: seeds large data sets into a scratch cluster and prints timings
// measured in the same run, with the ratios the issues set as targets.
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import request from 'supertest';
import { startThrowawayCluster } from '../lib/postgres.mjs';
import { createApp } from '../../server/app';
import { systemClock } from '../../server/platform/clock';
import { loadConfig } from '../../server/platform/config';
import { createDb, migrateLatest } from '../../server/platform/db';
import { createLogger } from '../../server/platform/logger';
import { createMailer } from '../../server/platform/mailer';
import { hashPassword } from '../../server/auth/passwords';
import { loadCostRows, loadMenuRows } from '../../server/costing/cost-model.repo';
import { buildLoadedCostModel } from '../../server/costing/cost-model.service';
import { menuCostingFrom } from '../../server/costing/menu.presenter';
import { seedLargeMenu } from './large-menu';
import { measure, ms, row } from './measure';
import { touchCosting } from './touch';

// `npm run bench -- client` runs the client section alone (sizes and Lighthouse).
if (process.argv.slice(2).includes('client')) {
  const { run } = await import('./client.section');
  await run();
  process.exit(0);
}

const cluster = await startThrowawayCluster();
const stop = () => cluster.stop();
process.once('SIGINT', () => { stop(); process.exit(130); });
try {
  cluster.createDatabase('bench');
  const url = cluster.urlFor('bench');
  const db = createDb(url, { max: 10 });
  await migrateLatest(db);
  const menu = await seedLargeMenu(db);
  await db.raw('analyze');
  console.log(`\nLarge menu: ${menu.drinks} drinks × 4 sizes = ${menu.sizes} sizes, ${menu.lines} build lines, ${menu.preparations} preparations nested 3 deep\n`);

  // 1. The engine alone: rows already in memory, build the model and cost every size.
  const asOf = '2026-12-01';
  const [costRows, menuRows] = await Promise.all([loadCostRows(db, menu.businessId, asOf), loadMenuRows(db, menu.businessId)]);
  const engine = await measure(() => menuCostingFrom(buildLoadedCostModel(costRows, { asOf }), menuRows), 30, 5);
  row('engine: cost the whole menu (no I/O)', engine, engine.p50 < 50 ? '(target < 50 ms: met)' : '(target < 50 ms: NOT met)');

  // 2. PostgreSQL alone: the same rows the route reads.
  const bare = await measure(() => Promise.all([loadCostRows(db, menu.businessId, asOf), loadMenuRows(db, menu.businessId)]), 30, 5);
  row('PostgreSQL alone: the rows of the menu', bare);

  // 3. The HTTP route over loopback.
  const [owner] = await db('users').insert({ business_id: menu.businessId, email: 'bench@example.test', name: 'Bench', role: 'owner', password_hash: await hashPassword('bench-password') }).returning('id');
  void owner;
  const config = loadConfig({ NODE_ENV: 'test', DATABASE_URL: url, LOG_LEVEL: 'silent', LOGIN_MAX_FAILURES_PER_ADDRESS: '1000' });
  const app = createApp({ db, config, mailer: createMailer({ host: '127.0.0.1', port: 1, from: 'bench@example.test' }), logger: createLogger('silent'), clock: systemClock });
  const server = await new Promise<Server>((resolve) => { const s = app.listen(0, '127.0.0.1', () => resolve(s)); });
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const agent = request.agent(base);
  await agent.post('/api/auth/login').send({ email: 'bench@example.test', password: 'bench-password' }).expect(200);
  // Timed with Node's own fetch (a browser-like client with keep-alive), not supertest's agent.
  const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'bench@example.test', password: 'bench-password' }) });
  const cookie = String(login.headers.get('set-cookie')).split(';')[0];
  const http = await measure(async () => {
    const res = await fetch(`${base}/api/menu/costing`, { headers: { cookie } });
    if (res.status !== 200) throw new Error(`menu costing answered ${res.status}`);
    await res.text();
  }, 30, 5);
  const ratio = http.p50 / bare.p50;
  row('GET /api/menu/costing over loopback', http, `${ratio.toFixed(2)}× the bare row fetch (target ≤ 2×: ${ratio <= 2 ? 'met' : 'NOT met'})`);
  // After a change the menu is costed again: the business's costing version is moved on
  // (untimed) before each request, so every timed request reads the rows and runs the engine.
  const cold = await measure(async () => {
    const res = await fetch(`${base}/api/menu/costing`, { headers: { cookie } });
    if (res.status !== 200) throw new Error(`menu costing answered ${res.status}`);
    await res.text();
  }, 30, 5, () => touchCosting(db, menu.businessId));
  row('  … the first read after a change', cold, `${(cold.p50 / bare.p50).toFixed(2)}× the bare row fetch (costed again: rows + engine)`);

  // Later sections (repricing impact, books) register here.
  for (const section of await loadSections()) await section({ db, url, agent, businessId: menu.businessId, baseUrl: base, engineMs: engine.p50 });

  await new Promise((r) => server.close(r));
  await app.locals.shutdown();
  await db.destroy();
  console.log(`\nDone. (${ms(engine.p50)} engine, ${ms(http.p50)} route, ${ms(bare.p50)} rows)`);
} finally {
  stop();
}

type Section = (ctx: { db: ReturnType<typeof createDb>; url: string; agent: ReturnType<typeof request.agent>; businessId: string; baseUrl: string; engineMs: number }) => Promise<void>;

/** Sections other domains add as scripts/bench/<name>.section.ts exporting `run`. */
async function loadSections(): Promise<Section[]> {
  const fs = await import('node:fs');
  const path = await import('node:path');
  const dir = path.dirname(new URL(import.meta.url).pathname);
  const files = fs.readdirSync(dir).filter((f) => f.endsWith('.section.ts')).sort();
  return Promise.all(files.map(async (f) => (await import(path.join(dir, f))).run as Section));
}
