import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { performance } from 'node:perf_hooks';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { startTestApp, type TestContext } from '../../helpers/context';
import { makeBusiness, TEST_PASSWORD } from '../../helpers/factories';
import { makeDrink, makeSize } from '../../helpers/costing-factories';

// The hardening issue's finding: a preview of a large till file (20,000 distinct items) held the
// event loop for seconds, and /api/health with it. Its bound: health answers within 100 ms
// while a 10 MB file is previewed. The server runs in this process, so every stall of its event
// loop shows in health's latency measured here; the preview's answer is read as bytes and parsed
// only after the measuring stops, so the test's own work is not counted against the server.

const BOUND_MS = 100;
const CEILING_MS = 1000;
const ITEMS = 20_000;
const TARGET_BYTES = 10_000_000;

let ctx: TestContext;
let server: http.Server;
let base = '';
beforeAll(async () => {
  ctx = await startTestApp({ UPLOAD_MAX_BYTES: String(12 * 1024 * 1024) });
  server = http.createServer(ctx.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
  await ctx.close();
});

/** A till file of about 10 MB: 20,000 distinct items, each sold on several days. */
function bigFile(): { text: string; rows: number; cupsOfFirst: number } {
  const lines = ['date,item,size,quantity,net sales'];
  let bytes = lines[0].length + 1;
  let rows = 0;
  let cupsOfFirst = 0;
  for (let pass = 0; bytes < TARGET_BYTES; pass += 1) {
    for (let i = 0; i < ITEMS && bytes < TARGET_BYTES; i += 1) {
      const cups = 1 + ((i + pass) % 7);
      const line = `2026-11-${String(1 + (pass % 28)).padStart(2, '0')},Special blend ${i},Regular,${cups},${cups * 3}.25`;
      if (i === 0) cupsOfFirst += cups;
      lines.push(line);
      bytes += line.length + 1;
      rows += 1;
    }
  }
  return { text: `${lines.join('\n')}\n`, rows, cupsOfFirst };
}

test('health answers within 100 ms while a 10 MB till file with 20,000 items is previewed', { timeout: 300_000 }, async () => {
  const biz = await makeBusiness(ctx.db);
  // A menu of 24 drink sizes for each till item to be matched against.
  for (let d = 0; d < 8; d += 1) {
    const sizes = await Promise.all(['Small', 'Regular', 'Large'].map((name, position) => makeSize(ctx.db, biz.businessId, { name: `${name} ${d}`, position })));
    await makeDrink(ctx.db, biz.businessId, { name: `House drink ${d}`, sizes: sizes.map((sizeId) => ({ sizeId, lines: [] })) });
  }
  const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: biz.users.owner.email, password: TEST_PASSWORD }) });
  expect(login.status).toBe(200);
  const cookie = login.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  const csrf = ((await login.json()) as { csrfToken: string }).csrfToken;
  const headers = { cookie, 'x-csrf-token': csrf };

  const file = bigFile();
  expect(Buffer.byteLength(file.text)).toBeGreaterThanOrEqual(TARGET_BYTES);
  const form = new FormData();
  form.append('siteId', biz.siteIds[0]);
  form.append('file', new Blob([file.text], { type: 'text/csv' }), 'november.csv');
  const up = await fetch(`${base}/api/sales-imports`, { method: 'POST', headers, body: form });
  const upBody = (await up.json()) as { import: { id: string } };
  expect(up.status, JSON.stringify(upBody).slice(0, 300)).toBe(201);

  const columns = { date: 'date', item: 'item', size: 'size', quantity: 'quantity', netSales: 'net sales', dateFormat: 'YYYY-MM-DD' };
  let done = false;
  const chunks: Buffer[] = [];
  const preview = (async () => {
    const res = await fetch(`${base}/api/sales-imports/${upBody.import.id}/preview`, { method: 'POST', headers: { ...headers, 'content-type': 'application/json' }, body: JSON.stringify({ columns }) });
    for await (const chunk of res.body as unknown as AsyncIterable<Uint8Array>) chunks.push(Buffer.from(chunk));
    done = true;
    return res.status;
  })();
  const latencies: number[] = [];
  // Asked as a monitor would, every 25 ms or so: asking flat out would make this process's own
  // garbage (and its collection, slow on a loaded machine) part of what is measured.
  while (!done) {
    await new Promise((resolve) => setTimeout(resolve, 25));
    const t0 = performance.now();
    const res = await fetch(`${base}/api/health`);
    await res.text();
    latencies.push(performance.now() - t0);
    expect(res.status).toBe(200);
  }
  const status = await preview;
  const body = JSON.parse(Buffer.concat(chunks).toString('utf8'));
  expect(status, JSON.stringify(body).slice(0, 300)).toBe(200);
  expect(body.rowCount).toBe(file.rows);
  expect(body.errorCount).toBe(0);
  expect(body.items).toHaveLength(ITEMS);
  expect(body.items.find((i: { tillItem: string }) => i.tillItem === 'Special blend 0').quantity).toBe(String(file.cupsOfFirst));
  // Health was asked many times over while the file was read. The bound holds for 19 in
  // 20 answers; the rest may only be late by what a machine shared by several busy processes
  // does to any process (a collection of this process's garbage, slow when the CPUs are taken, or
  // its turn on a CPU coming late: 1 answer in 100 took 100–400 ms at a load of 11 on 2 cores,
  // none on a quiet machine). A pass over the file or over its answer on the event loop stalls
  // health for seconds (2.6 s in the issue), far past the ceiling.
  expect(latencies.length).toBeGreaterThan(20);
  const sorted = [...latencies].sort((a, b) => a - b);
  const slowest = `slowest health answers (ms): ${sorted.slice(-12).reverse().map((l) => l.toFixed(0)).join(' ')} of ${latencies.length}`;
  expect(sorted[Math.floor(sorted.length * 0.95)], slowest).toBeLessThan(BOUND_MS);
  expect(sorted[sorted.length - 1], slowest).toBeLessThan(CEILING_MS);
});
