import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { startTestApp, type TestContext } from '../../helpers/context';
import { makeBusiness, signIn, type Session } from '../../helpers/factories';
import { DOCUMENTED_REQUEST, DOCUMENTED_RESPONSE } from '../../helpers/costing-examples';

const clone = () => structuredClone(DOCUMENTED_REQUEST) as Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any

let ctx: TestContext;
let owner: Session;
let barista: Session;
let bookkeeper: Session;
let businessId: string;

beforeAll(async () => {
  ctx = await startTestApp();
  const biz = await makeBusiness(ctx.db);
  businessId = biz.businessId;
  owner = await signIn(ctx.app, biz.users.owner.email);
  barista = await signIn(ctx.app, biz.users.barista.email);
  bookkeeper = await signIn(ctx.app, biz.users.bookkeeper.email);
});
afterAll(() => ctx.close());

test('returns exactly the documented response for the documented request', async () => {
  const res = await owner.post('/api/costing/preview', DOCUMENTED_REQUEST);
  expect(res.status).toBe(200);
  expect(res.body).toStrictEqual(DOCUMENTED_RESPONSE);
});

test('the bookkeeper may preview; a barista may not; anonymous is 401', async () => {
  expect((await bookkeeper.post('/api/costing/preview', DOCUMENTED_REQUEST)).status).toBe(200);
  const b = await barista.post('/api/costing/preview', DOCUMENTED_REQUEST);
  expect(b.status).toBe(403);
  expect(b.body.error.code).toBe('forbidden');
});

test('atCurrent is null without a current price', async () => {
  const r = clone();
  delete r.sizes[0].currentPrice;
  const res = await owner.post('/api/costing/preview', r);
  expect(res.status).toBe(200);
  expect(res.body.sizes[0].atCurrent).toBeNull();
  expect(res.body.sizes[0].cost).toBe('0.7102');
});

test('a pack price of 0 is allowed (a free sample): that line costs nothing', async () => {
  const r = clone();
  r.ingredients[3].pack.price = '0';
  const res = await owner.post('/api/costing/preview', r);
  expect(res.status).toBe(200);
  expect(res.body.sizes[0].lines[3].cost).toBe('0.0000');
  // 0.7102 − 0.0615 of cup, from the unrounded lines: 0.40125 + 0.23315… + 0.01428 = 0.6487
  expect(res.body.sizes[0].cost).toBe('0.6487');
});

test('saves nothing', async () => {
  const count = async () => Number((await ctx.db('ingredients').where({ business_id: businessId }).count<{ n: string }[]>('* as n'))[0].n);
  const before = await count();
  await owner.post('/api/costing/preview', DOCUMENTED_REQUEST);
  expect(await count()).toBe(before);
  expect(before).toBe(0);
});

type Mutate = (r: Record<string, any>) => void; // eslint-disable-line @typescript-eslint/no-explicit-any
const refusals: [string, Mutate, string, RegExp][] = [
  ['a mass line on a volume ingredient with no density', (r) => { delete r.ingredients[0].densityGPerMl; r.sizes[0].lines[1] = { item: 'milk', quantity: '268', unit: 'g' }; }, 'sizes[0].lines[1].unit', /density/],
  ['a volume line on a mass ingredient with no density', (r) => { r.sizes[0].lines[0] = { item: 'beans', quantity: '20', unit: 'ml' }; }, 'sizes[0].lines[0].unit', /density/],
  ['an unknown unit on a line', (r) => { r.sizes[0].lines[1].unit = 'pint'; }, 'sizes[0].lines[1].unit', /Unknown unit or measure "pint"/],
  ['an unknown measure', (r) => { r.sizes[0].lines[0].unit = 'scoop'; }, 'sizes[0].lines[0].unit', /scoop/],
  ['an unknown item', (r) => { r.sizes[0].lines[1].item = 'cream'; }, 'sizes[0].lines[1].item', /Unknown item "cream"/],
  ['an unknown pack unit', (r) => { r.ingredients[0].pack.unit = 'jug'; }, 'ingredients[0].pack.unit', /Unknown unit "jug"/],
  ['a pack count of 0', (r) => { r.ingredients[0].pack.count = '0'; }, 'ingredients[0].pack.count', /more than 0/],
  ['a negative pack count', (r) => { r.ingredients[0].pack.count = '-6'; }, 'ingredients[0].pack.count', /more than 0/],
  ['a pack quantity of 0', (r) => { r.ingredients[1].pack.quantity = '0'; }, 'ingredients[1].pack.quantity', /more than 0/],
  ['a negative pack price', (r) => { r.ingredients[1].pack.price = '-1'; }, 'ingredients[1].pack.price', /0 or more/],
  ['a yield of 0', (r) => { r.ingredients[0].yieldPct = '0'; }, 'ingredients[0].yieldPct', /yield/],
  ['a yield above 100', (r) => { r.ingredients[0].yieldPct = '100.01'; }, 'ingredients[0].yieldPct', /yield/],
  ['a margin of 100', (r) => { r.policy.targetMarginPct = '100'; }, 'policy.targetMarginPct', /below 100/],
  ['a negative margin', (r) => { r.policy.targetMarginPct = '-1'; }, 'policy.targetMarginPct', /at least 0/],
  ['a quantity that is not a decimal', (r) => { r.sizes[0].lines[1].quantity = '2e2'; }, 'sizes[0].lines[1].quantity', /plain decimal/],
  ['a number instead of a decimal string', (r) => { r.ingredients[0].pack.price = 9.9; }, 'ingredients[0].pack.price', /plain decimal/],
  ['a price with a thousands separator', (r) => { r.sizes[0].currentPrice = '1,000'; }, 'sizes[0].currentPrice', /plain decimal/],
  ['a preparation cycle', (r) => {
    r.preparations.push({ key: 'b', yield: { quantity: '1', unit: 'l' }, lines: [{ item: 'house-syrup', quantity: '1', unit: 'ml' }] });
    r.preparations[0].lines.push({ item: 'b', quantity: '1', unit: 'ml' });
  }, 'preparations[1].lines[0].item', /cycle: house-syrup → b → house-syrup/],
  ['a price step finer than the currency allows', (r) => { r.policy.priceStep = '0.005'; }, 'policy.priceStep', /smallest unit/],
  ['an unknown allergen', (r) => { r.ingredients[0].allergens = ['dairy']; }, 'ingredients[0].allergens[0]', /Unknown allergen/],
];

describe('refusals: 400 invalid_input naming the field', () => {
  test.each(refusals)('%s', async (_what, mutate, field, message) => {
    const r = clone();
    mutate(r);
    const res = await owner.post('/api/costing/preview', r);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(typeof res.body.error.message).toBe('string');
    expect(Object.keys(res.body.error.fields)).toContain(field);
    expect(res.body.error.fields[field]).toMatch(message);
  });
});
