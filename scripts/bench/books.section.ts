import type { Knex } from 'knex';
import { hashPassword } from '../../server/auth/passwords';
import { cogsReport } from '../../server/books/cogs.service';
import { bareAggregate, LINES_PER_DAY, sampleMemory, seedBooks, type MemoryProfile } from './books';
import { measure, measureTogether, ms, row } from './measure';
import { touchCosting } from './touch';

const MONTH = '2026-06';
const RUNS = 25;
const TARGET = 1.5;

const verdict = (ratio: number) => `${ratio.toFixed(2)}× the bare aggregate (target ≤ ${TARGET}×: ${ratio <= TARGET ? 'met' : 'NOT met'})`;

/** Bench section: the month's cost of goods and its CSV export over a year of till sales at three sites. */
export async function run(ctx: { db: Knex; businessId: string; baseUrl: string }) {
  const { db, businessId, baseUrl } = ctx;
  const seed = await seedBooks(db, businessId, MONTH);
  const [site] = seed.siteIds;
  console.log(`\nBooks: ${seed.salesLines.toLocaleString('en-GB')} till lines (3 sites × ${LINES_PER_DAY}/day × 365 days, ${seed.imports} accepted imports), ${seed.counts} month-end counts, ${seed.receipts} deliveries, ${seed.waste} waste entries; seeded in ${seed.seconds.toFixed(1)} s`);
  const monthLines = await db('sales_lines').where({ business_id: businessId, site_id: site }).whereBetween('sold_on', [`${MONTH}-01`, `${MONTH}-30`]).count<{ n: string }[]>('* as n');
  console.log(`  report: ${MONTH}, open; one site has ${Number(monthLines[0].n).toLocaleString('en-GB')} lines that month, the three ${(3 * Number(monthLines[0].n)).toLocaleString('en-GB')}`);

  // A bookkeeper signs in over HTTP (Node's fetch, keep-alive), as the export's reader would.
  await db('users').insert({ business_id: businessId, email: 'bench-books@example.test', name: 'Bench Books', role: 'bookkeeper', password_hash: await hashPassword('bench-password') });
  const login = await fetch(`${baseUrl}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'bench-books@example.test', password: 'bench-password' }) });
  if (login.status !== 200) throw new Error(`bookkeeper login answered ${login.status}`);
  const cookie = String(login.headers.get('set-cookie')).split(';')[0];
  const get = async (path: string) => {
    const res = await fetch(`${baseUrl}${path}`, { headers: { cookie } });
    if (res.status !== 200) throw new Error(`${path} answered ${res.status}: ${await res.text()}`);
    return res;
  };
  const q = (siteId: string | null) => `month=${MONTH}${siteId ? `&siteId=${siteId}` : ''}`;

  // The first report builds the month's recipe costs (the cache); every timing below is warm.
  const first = await cogsReport(db, businessId, MONTH, site);
  console.log(`  one site: ${first.cups} cups, net sales £${first.totals.netSales}, actual £${first.totals.actual}, theoretical £${first.totals.theoretical}, ${first.rows.length} categories, ${first.notes.length} notes`);

  // The month's report of the business (all its sites: the report's default) carries the
  // target; one site's is shown beside it, where the report's fixed cost (reading its state and
  // versions, the theoretical cost's join, HTTP) weighs more against fewer lines. Warm: the
  // month's recipe costs, cost models and the report's other figures (counts, deliveries,
  // waste) are kept while nothing changes; the sales aggregate is worked out every time.
  const all = await measureTogether({
    bare: () => bareAggregate(db, businessId, MONTH, null),
    service: () => cogsReport(db, businessId, MONTH, null),
    http: async () => (await get(`/api/reports/cogs?${q(null)}`)).json(),
    csv: () => readCsv(get, `/api/reports/cogs.csv?${q(null)}`),
  }, RUNS, 3);
  const one = await measureTogether({
    bare: () => bareAggregate(db, businessId, MONTH, site),
    service: () => cogsReport(db, businessId, MONTH, site),
    http: async () => (await get(`/api/reports/cogs?${q(site)}`)).json(),
    csv: () => readCsv(get, `/api/reports/cogs.csv?${q(site)}`),
  }, RUNS, 3);
  const [bareAll, serviceAll, httpAll, csvAll] = [all.bare, all.service, all.http, all.csv];
  const [bare, service, http, csv] = [one.bare, one.service, one.http, one.csv];

  console.log(`\n  the month's report, all three sites, ${MONTH} (warm, ${RUNS} runs each, taken in turns)`);
  row('SQL alone: sum by drink size', bareAll);
  row('service: cost-of-goods report', serviceAll, verdict(serviceAll.p50 / bareAll.p50));
  row('GET /api/reports/cogs over loopback', httpAll, verdict(httpAll.p50 / bareAll.p50));
  row('GET /api/reports/cogs.csv (streamed)', csvAll, verdict(csvAll.p50 / bareAll.p50));
  const beside = (t: { p50: number }) => `${(t.p50 / bare.p50).toFixed(2)}× the bare aggregate (+${ms(t.p50 - bare.p50)})`;
  console.log(`\n  one site, ${MONTH}, for comparison`);
  row('SQL alone: sum by drink size', bare);
  row('service: cost-of-goods report', service, beside(service));
  row('GET /api/reports/cogs over loopback', http, beside(http));
  row('GET /api/reports/cogs.csv (streamed)', csv, beside(csv));

  // The server's memory during the export (the app runs in this process): peak − resident set before.
  const memOne = await peakOf(() => readCsv(get, `/api/reports/cogs.csv?${q(site)}`));
  const memAll = await peakOf(() => readCsv(get, `/api/reports/cogs.csv?${q(null)}`));
  console.log('\n  server memory during the CSV export (rss sampled every 10 ms, peak − baseline, worst of 5)');
  memoryRow(`one site (${Number(monthLines[0].n).toLocaleString('en-GB')} lines)`, memOne);
  memoryRow(`three sites (${(3 * Number(monthLines[0].n)).toLocaleString('en-GB')} lines)`, memAll);
  const growth = (memAll.peakMb - memAll.baselineMb) - (memOne.peakMb - memOne.baselineMb);
  console.log(`  memory growth with 3× the lines: ${growth.toFixed(1)} MB (target flat: ${growth < 8 ? 'met' : 'NOT met'})`);

  // After a change: the business's costing version is moved on (untimed) before each run, so
  // the report rebuilds the month's cost models and recipe costs with the costing engine.
  const cold = await measure(() => cogsReport(db, businessId, MONTH, site), 5, 1, () => touchCosting(db, businessId));
  console.log('\n  the first report after a change to prices or recipes (recipe costs rebuilt by the costing engine)');
  row('service: cost-of-goods report, after a change', cold, `${(cold.p50 / service.p50).toFixed(1)}× the report; rebuild ≈ ${ms(cold.p50 - service.p50)}`);
  const rc = await db('recipe_costs').where({ business_id: businessId, month: `${MONTH}-01` }).count<{ n: string }[]>('* as n');
  console.log(`  recipe_costs rows for ${MONTH}: ${rc[0].n}`);
}

/** Reads a streamed download to the end, chunk by chunk, and returns its size in bytes. */
async function readCsv(get: (path: string) => Promise<Response>, path: string): Promise<number> {
  const res = await get(path);
  if (!String(res.headers.get('content-type')).startsWith('text/csv')) throw new Error(`${path} is not CSV`);
  let bytes = 0;
  for await (const chunk of res.body as unknown as AsyncIterable<Uint8Array>) bytes += chunk.byteLength;
  return bytes;
}

/** The worst of five exports' peak − baseline. */
async function peakOf(fn: () => Promise<number>): Promise<MemoryProfile> {
  let worst: MemoryProfile | null = null;
  for (let i = 0; i < 5; i++) {
    const m = await sampleMemory(fn);
    if (!worst || m.peakMb - m.baselineMb > worst.peakMb - worst.baselineMb) worst = m;
  }
  return worst!;
}

function memoryRow(label: string, m: MemoryProfile) {
  console.log(`  ${label.padEnd(46)} +${(m.peakMb - m.baselineMb).toFixed(1).padStart(5)} MB  (rss ${m.baselineMb.toFixed(0)} → ${m.peakMb.toFixed(0)} MB, ${m.bytes} bytes in ${ms(m.ms)})`);
}
