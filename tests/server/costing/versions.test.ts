import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BOOKS_TABLES, COSTING_TABLES } from '../../../migrations/20261204000000_costing_versions';
import { menuCosting } from '../../../server/costing/menu.service';
import { costingVersion, dataVersion } from '../../../server/platform/versions';
import { startTestApp, type TestContext } from '../../helpers/context';
import { makeBusiness, signIn } from '../../helpers/factories';
import { makeDrink, makeIngredient, makeSize } from '../../helpers/costing-factories';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(() => ctx.close());

describe('costing versions', () => {
  it('has a deferred trigger on every table costs and menu prices are worked out from, and on every table of the books the report reads', async () => {
    const tables = async (kind: string) => (await ctx.db.raw(
      `select tgrelid::regclass::text as t from pg_trigger where tgname like '%\\_${kind}\\_version' and tgdeferrable and tginitdeferred order by 1`,
    )).rows.map((r: { t: string }) => r.t);
    expect(await tables('costing')).toEqual([...COSTING_TABLES, 'businesses'].sort());
    expect(await tables('books')).toEqual([...BOOKS_TABLES].sort());
  });

  it('keeps the books version apart from the costing version', async () => {
    const f = await makeBusiness(ctx.db);
    const [site] = f.siteIds;
    const before = { costing: await costingVersion(ctx.db, f.businessId), books: await dataVersion(ctx.db, f.businessId, 'books') };
    await ctx.db('stock_counts').insert({ business_id: f.businessId, site_id: site, count_date: '2026-10-31' });
    expect(await dataVersion(ctx.db, f.businessId, 'books')).toBe(String(Number(before.books) + 1));
    expect(await costingVersion(ctx.db, f.businessId)).toBe(before.costing);
    await makeSize(ctx.db, f.businessId);
    expect(await costingVersion(ctx.db, f.businessId)).toBe(String(Number(before.costing) + 1));
    expect(await dataVersion(ctx.db, f.businessId, 'books')).toBe(String(Number(before.books) + 1));
  });

  it('moves on once per committed transaction and business, never for a rolled-back one or another business', async () => {
    const a = await makeBusiness(ctx.db);
    const b = await makeBusiness(ctx.db);
    expect(await costingVersion(ctx.db, a.businessId)).toBe('0');

    await makeSize(ctx.db, a.businessId);
    expect(await costingVersion(ctx.db, a.businessId)).toBe('1');

    // Several rows in several tables, one transaction: one step.
    await ctx.db.transaction(async (trx) => {
      await trx('cup_sizes').insert([{ business_id: a.businessId, name: 'Tall one', volume_ml: '400' }, { business_id: a.businessId, name: 'Short one', volume_ml: '200' }]);
      await trx('suppliers').insert({ business_id: a.businessId, name: 'Brightwater Dairy' });
      // Inside the transaction the version has not moved yet: it moves at commit.
      expect(await costingVersion(trx, a.businessId)).toBe('1');
    });
    expect(await costingVersion(ctx.db, a.businessId)).toBe('2');

    await expect(ctx.db.transaction(async (trx) => {
      await trx('suppliers').insert({ business_id: a.businessId, name: 'Never saved' });
      throw new Error('rolled back');
    })).rejects.toThrow('rolled back');
    expect(await costingVersion(ctx.db, a.businessId)).toBe('2');

    // Deletes and updates count; another business's change does not.
    await ctx.db('suppliers').where({ business_id: a.businessId, name: 'Brightwater Dairy' }).update({ name: 'Brightwater Dairy Co' });
    await ctx.db('cup_sizes').where({ business_id: a.businessId, name: 'Tall one' }).delete();
    await makeSize(ctx.db, b.businessId);
    expect(await costingVersion(ctx.db, a.businessId)).toBe('4');
    expect(await costingVersion(ctx.db, b.businessId)).toBe('1');

    // The business's currency changes how prices are written; its name does not.
    await ctx.db('businesses').where({ id: a.businessId }).update({ name: 'Renamed café' });
    expect(await costingVersion(ctx.db, a.businessId)).toBe('4');
    await ctx.db('businesses').where({ id: a.businessId }).update({ currency: 'EUR' });
    expect(await costingVersion(ctx.db, a.businessId)).toBe('5');
  });

  it('keeps the costed menu while nothing changes, and costs it again after any change, however it was made', async () => {
    const f = await makeBusiness(ctx.db);
    const sizeId = await makeSize(ctx.db, f.businessId);
    // 1 kg of beans at 20.00: 18 g cost 0.36; 1 l of milk at 1.20: 200 ml cost 0.24.
    const beans = await makeIngredient(ctx.db, f.businessId, { category: 'coffee', baseUnit: 'g', pack: { quantity: '1', unit: 'kg', price: '20.00' } });
    const milk = await makeIngredient(ctx.db, f.businessId, { category: 'dairy', baseUnit: 'ml', pack: { quantity: '1', unit: 'l', price: '1.20' } });
    await makeDrink(ctx.db, f.businessId, { name: 'Flat white', sizes: [{ sizeId, price: '3.20', lines: [
      { ingredientId: beans.id, quantity: '18', unit: 'g' },
      { ingredientId: milk.id, quantity: '200', unit: 'ml' },
    ] }] });

    const once = await menuCosting(ctx.db, f.businessId, { asOf: '2026-12-01' });
    const again = await menuCosting(ctx.db, f.businessId, { asOf: '2026-12-01' });
    expect(again).toBe(once);
    expect(once.drinks[0].sizes[0].cost).toBe('0.6000');

    // A price change written straight to the table (as a seed or an import would) is seen.
    await ctx.db('pack_prices').where({ pack_id: milk.packId }).update({ price: '1.50' });
    const after = await menuCosting(ctx.db, f.businessId, { asOf: '2026-12-01' });
    expect(after).not.toBe(once);
    // 0.36 + 200 × 0.0015 = 0.66
    expect(after.drinks[0].sizes[0].cost).toBe('0.6600');

    // And through the route, for the owner.
    const owner = await signIn(ctx.app, f.users.owner.email);
    const res = await owner.get('/api/menu/costing?asOf=2026-12-01');
    expect(res.status).toBe(200);
    expect(res.body.drinks[0].sizes[0].cost).toBe('0.6600');
    await ctx.db('build_lines').where({ ingredient_id: milk.id }).update({ quantity: '100' });
    const res2 = await owner.get('/api/menu/costing?asOf=2026-12-01');
    // 0.36 + 100 × 0.0015 = 0.51
    expect(res2.body.drinks[0].sizes[0].cost).toBe('0.5100');
  });
});
