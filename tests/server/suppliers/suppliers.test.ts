// GET /api/suppliers carries each supplier's ordering terms (issue 5's contract), read from
// the same row that PUT /api/suppliers/:id/ordering writes. Values are invented for the test.
import { afterAll, beforeAll, expect, it } from 'vitest';
import { startTestApp, type TestContext } from '../../helpers/context';
import { makeBusiness, signIn, suffix } from '../../helpers/factories';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(() => ctx.close());

it('lists suppliers with order e-mail, payment terms, minimum order and delivery days', async () => {
  const biz = await makeBusiness(ctx.db);
  const [owner, bookkeeper] = await Promise.all([signIn(ctx.app, biz.users.owner.email), signIn(ctx.app, biz.users.bookkeeper.email)]);
  const s = suffix();
  const created = await owner.post('/api/suppliers', { name: `Dairy ${s}`, orderEmail: `orders-${s}@dairy.test` });
  expect(created.status).toBe(201);
  const id = created.body.supplier.id as string;
  // A new supplier has the table's defaults: paid on account, no minimum, no delivery days yet.
  expect(created.body.supplier).toMatchObject({ paymentTerms: 'account', minimumOrder: '0.00', deliveryDays: [], orderCutoff: '12:00', leadDays: 1, deliveryCharge: '0.00' });

  const terms = { minimumOrder: '45.5', deliveryDays: [5, 2], orderCutoff: '13:30', leadDays: 2, deliveryCharge: '4', paymentTerms: 'card' };
  expect((await owner.put(`/api/suppliers/${id}/ordering`, terms)).status).toBe(200);

  const list = await bookkeeper.get('/api/suppliers');
  expect(list.status).toBe(200);
  const row = list.body.suppliers.find((x: { id: string }) => x.id === id);
  // Money in the business's currency's minor units (GBP: 2 places); days sorted Tuesday, Friday.
  expect(row).toEqual({
    id, name: `Dairy ${s}`, contactName: null, orderEmail: `orders-${s}@dairy.test`, phone: null, accountNumber: null, notes: null,
    paymentTerms: 'card', minimumOrder: '45.50', deliveryDays: [2, 5], orderCutoff: '13:30', leadDays: 2, deliveryCharge: '4.00',
  });
  expect((await owner.get(`/api/suppliers/${id}`)).body.supplier).toEqual(row);
  // Editing the basic details leaves the ordering terms as they were.
  const patched = await owner.patch(`/api/suppliers/${id}`, { phone: '0100 000 111' });
  expect(patched.body.supplier).toEqual({ ...row, phone: '0100 000 111' });
});
