import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import zlib from 'node:zlib';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import request from 'supertest';
import { startTestApp, type TestContext } from '../helpers/context';
import { BUDGET, bundleReport } from '../../scripts/bundle/budget';

// These read the built client (npm test builds it before the tests run).
const dist = path.resolve(import.meta.dirname, '../../dist');

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(() => ctx.close());

/** A GET over a real socket, the body as the wire carried it (supertest would decompress it). */
async function rawGet(urlPath: string, encoding: string): Promise<{ status: number; headers: http.IncomingHttpHeaders; body: Buffer }> {
  const server = ctx.app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const { port } = server.address() as AddressInfo;
  try {
    return await new Promise((resolve, reject) => {
      http.get({ host: '127.0.0.1', port, path: urlPath, headers: { 'accept-encoding': encoding } }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
      }).on('error', reject);
    });
  } finally {
    server.close();
  }
}

describe('the built client within its budgets', () => {
  test(`the sign-in page needs at most ${BUDGET.signInKb} kB of gzipped JavaScript, and no page's own chunk more than ${BUDGET.routeChunkKb} kB`, () => {
    const report = bundleReport(dist);
    expect(report.routes.length).toBeGreaterThan(20);
    expect(report.signInKb).toBeLessThanOrEqual(BUDGET.signInKb);
    expect(report.routes.filter((r) => r.ownKb > BUDGET.routeChunkKb)).toEqual([]);
  });
});

describe('serving the client', () => {
  const anAsset = () => fs.readdirSync(path.join(dist, 'assets')).find((f) => f.endsWith('.js') && fs.statSync(path.join(dist, 'assets', f)).size > 20_000)!;

  test('hashed assets are compressed (brotli when asked, else gzip) and cached as immutable for a year', async () => {
    const file = anAsset();
    const original = fs.readFileSync(path.join(dist, 'assets', file));
    const br = await rawGet(`/assets/${file}`, 'br');
    expect(br.status).toBe(200);
    expect(br.headers['content-encoding']).toBe('br');
    expect(br.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(zlib.brotliDecompressSync(br.body).equals(original)).toBe(true);
    const gz = await rawGet(`/assets/${file}`, 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(zlib.gunzipSync(gz.body).equals(original)).toBe(true);
  });

  test('index.html is compressed and never cached without asking again; a missing asset is 404, not the page', async () => {
    const page = await request(ctx.app).get('/sign-in').set('Accept-Encoding', 'gzip');
    expect(page.status).toBe(200);
    expect(page.headers['content-type']).toMatch(/text\/html/);
    expect(page.headers['cache-control']).toBe('no-cache');
    expect((await request(ctx.app).get('/assets/gone-0000.js')).status).toBe(404);
  });

  test('API answers are compressed too', async () => {
    const res = await request(ctx.app).get('/api/config').set('Accept-Encoding', 'gzip');
    expect(res.status).toBe(200);
    // Below the threshold a body is sent as it is; the header says the answer varies by encoding.
    expect(res.headers.vary).toMatch(/Accept-Encoding/);
  });
});
