import { afterAll, beforeAll, expect, test } from 'vitest';
import { inject } from 'vitest';
import type { Knex } from 'knex';
import { createDb, migrateLatest } from '../../../server/platform/db';
import { seed as seedTenancy, DEMO } from '../../../seeds/01_tenancy';
import { seed as seedMenu } from '../../../seeds/02_menu';
import { menuCosting } from '../../../server/costing/menu.service';
import { loadCostModel } from '../../../server/costing/cost-model.service';
import { suffix } from '../../helpers/factories';

// The seeds truncate the businesses table, so they run in a database of their own on the
// throwaway cluster, never in the one the other test files share.
let admin: Knex;
let db: Knex;
let name: string;

beforeAll(async () => {
  const url = inject('databaseUrl');
  admin = createDb(url);
  name = `seed_${suffix().replace(/-/g, '')}`;
  await admin.raw(`create database ${name}`);
  db = createDb(url.replace(/\/[^/?]+(\?|$)/, `/${name}$1`));
  await migrateLatest(db);
  await seedTenancy(db);
  await seedMenu(db);
});
afterAll(async () => {
  await db?.destroy();
  await admin.raw(`drop database if exists ${name}`);
  await admin.destroy();
});

test('the demo menu costs every drink and size, some below target; running it again gives the same menu', async () => {
  const menu = await menuCosting(db, DEMO.businessId);
  expect(menu.currency).toBe('GBP');
  expect(menu.drinks.length).toBeGreaterThanOrEqual(20);
  const sizes = menu.drinks.flatMap((d) => d.sizes);
  expect(sizes.every((s) => s.problem === null && s.cost !== null)).toBe(true);
  expect(sizes.some((s) => s.belowTarget)).toBe(true);
  expect(sizes.some((s) => !s.belowTarget)).toBe(true);
  const model = await loadCostModel(db, DEMO.businessId);
  expect(model.ingredients.size).toBeGreaterThanOrEqual(40);
  expect(model.preparations.size).toBe(3);
  expect([...model.ingredients.values()].every((i) => i.problem === null)).toBe(true);

  await seedMenu(db);
  const again = await menuCosting(db, DEMO.businessId);
  expect(again.drinks.map((d) => [d.name, d.sizes.map((s) => s.cost)])).toStrictEqual(menu.drinks.map((d) => [d.name, d.sizes.map((s) => s.cost)]));
});

test('the second business has a small USD menu priced with tax on top', async () => {
  const menu = await menuCosting(db, DEMO.otherBusinessId);
  expect(menu.currency).toBe('USD');
  expect(menu.drinks.length).toBe(4);
  expect(menu.drinks.flatMap((d) => d.sizes).every((s) => s.cost !== null)).toBe(true);
});
