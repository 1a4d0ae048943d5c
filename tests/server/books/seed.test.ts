import { afterAll, beforeAll, expect, test } from 'vitest';
import { inject } from 'vitest';
import type { Knex } from 'knex';
import { createDb, migrateLatest, runSeeds } from '../../../server/platform/db';
import { DEMO } from '../../../seeds/01_tenancy';
import { seed as seedBooks } from '../../../seeds/04_books';
import { addMonths } from '../../../src/shared/books';
import { cogsReport } from '../../../server/books/cogs.service';
import { stockLevels } from '../../../server/stock/stock.service';
import { suffix } from '../../helpers/factories';

// The seeds truncate the businesses table: they run in a database of their own.
let admin: Knex;
let db: Knex;
let name: string;
const current = new Date().toISOString().slice(0, 7);
const months = [addMonths(current, -3), addMonths(current, -2), addMonths(current, -1)];

beforeAll(async () => {
  const url = inject('databaseUrl');
  admin = createDb(url);
  name = `seed_books_${suffix().replace(/-/g, '')}`;
  await admin.raw(`create database ${name}`);
  db = createDb(url.replace(/\/[^/?]+(\?|$)/, `/${name}$1`));
  await migrateLatest(db);
  await runSeeds(db);
}, 120_000);
afterAll(async () => {
  await db?.destroy();
  await admin.raw(`drop database if exists ${name}`);
  await admin.destroy();
});

test('three complete months at both sites, the oldest closed, actual a little above theoretical', async () => {
  for (const [i, month] of months.entries()) {
    for (const siteId of Object.values(DEMO.siteIds)) {
      const r = await cogsReport(db, DEMO.businessId, month, siteId);
      expect(r.closed).toBe(i === 0);
      expect(r.notes).toEqual([]);
      expect(Number(r.totals.netSales)).toBeGreaterThan(1000);
      expect(Number(r.totals.opening)).toBeGreaterThan(0);
      expect(Number(r.totals.purchases)).toBeGreaterThan(0);
      // Invented scenario: actual within a few per cent above theoretical, cost of goods a plausible share of sales
      // (beverage cost of coffee drinks is commonly 15–30 % of net price: common practice, no source).
      const over = Number(r.totals.variancePct);
      expect(over).toBeGreaterThan(0);
      expect(over).toBeLessThan(25);
      expect(Number(r.totals.cogsPctOfSales)).toBeGreaterThan(10);
      expect(Number(r.totals.cogsPctOfSales)).toBeLessThan(45);
      expect(Number(r.totals.waste)).toBeGreaterThan(0);
    }
  }
  const periods = await db('periods').where({ business_id: DEMO.businessId }).select('month', 'status');
  expect(periods).toEqual([{ month: `${months[0]}-01`, status: 'closed' }]);
});

test('running the books seed again gives the same books, and leaves stock on hand as the orders seed made it', async () => {
  const site = DEMO.siteIds.market;
  const before = await cogsReport(db, DEMO.businessId, months[2], site);
  const levels = (await stockLevels(db, DEMO.businessId, site)).levels.map((l) => [l.item.pack_id, l.onHand.toFixed(4)]);
  const t0 = Date.now();
  await seedBooks(db);
  expect(Date.now() - t0).toBeLessThan(30_000);
  const after = await cogsReport(db, DEMO.businessId, months[2], site);
  expect(after.totals).toEqual(before.totals);
  expect(after.rows).toEqual(before.rows);
  expect((await stockLevels(db, DEMO.businessId, site)).levels.map((l) => [l.item.pack_id, l.onHand.toFixed(4)])).toEqual(levels);
});
