import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestContext } from '../../helpers/context';
import { makeBusiness, signIn, suffix, type Session } from '../../helpers/factories';
import { makeBooksCafe } from './scenario';

// The till-file upload is multipart, so the hostile-input walk (JSON bodies) does not reach it:
// its hostile inputs are tried here. Each refusal is a 400 (413 for size) that names what is
// wrong, and leaves no import behind.

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp({ UPLOAD_MAX_BYTES: String(64 * 1024) });
});
afterAll(() => ctx.close());

type Cafe = Awaited<ReturnType<typeof makeBooksCafe>>;
const GOOD = 'Day,Product,Variant,Qty,Net\n03/11/2026,Latte,Reg,2,6.00\n';

describe('hostile till files', () => {
  let cafe: Cafe;
  let owner: Session;
  const imports = () => ctx.db('sales_imports').where({ business_id: cafe.biz }).count<{ n: string }[]>('* as n').then((r) => Number(r[0].n));
  const send = (fields: Record<string, string>, file?: { content: Buffer | string; name?: string }) => {
    let req = owner.agent.post('/api/sales-imports').set('X-CSRF-Token', owner.csrf);
    for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
    if (file) req = req.attach('file', Buffer.isBuffer(file.content) ? file.content : Buffer.from(file.content), { filename: file.name ?? 'till.csv', contentType: 'text/csv' });
    return req;
  };
  beforeAll(async () => {
    cafe = await makeBooksCafe(ctx.db);
    owner = await signIn(ctx.app, cafe.f.users.owner.email);
  });

  it('names a site that is missing, malformed, hostile or another business\'s, and a missing file', async () => {
    const other = await makeBusiness(ctx.db);
    const before = await imports();
    for (const siteId of [undefined, 'north', 'a\u0000b', '\u202Eevil', randomUUID(), other.siteIds[0], 'x'.repeat(2000)]) {
      const res = await send(siteId === undefined ? {} : { siteId }, { content: GOOD });
      expect(res.status, JSON.stringify(siteId)).toBe(400);
      expect(res.body.error.code).toBe('invalid_input');
      expect(Object.keys(res.body.error.fields)).toEqual(['siteId']);
    }
    const noFile = await send({ siteId: cafe.f.siteIds[0] });
    expect(noFile.status).toBe(400);
    expect(Object.keys(noFile.body.error.fields)).toEqual(['file']);
    expect(await imports()).toBe(before);
  });

  it('refuses text that is not UTF-8 (UTF-16, Latin-1), a binary file, an empty file and one over the size limit', async () => {
    const before = await imports();
    // UTF-16 LE with its byte-order mark FF FE (UNICODE in tests/SOURCES.md): every other byte is NUL.
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(GOOD, 'utf16le')]);
    // "Crème brûlée" in Latin-1: è is the lone byte E8, which is not UTF-8 (UTF8 in tests/SOURCES.md).
    const latin1 = Buffer.from('Day,Product,Variant,Qty,Net\n03/11/2026,Crème brûlée,Reg,2,6.00\n', 'latin1');
    // A PNG's signature 89 50 4E 47 0D 0A 1A 0A (PNG in tests/SOURCES.md).
    const png = Buffer.concat([Buffer.from('89504e470d0a1a0a0000000d49484452', 'hex'), Buffer.alloc(64)]);
    for (const [what, content] of [['utf-16', utf16], ['latin-1', latin1], ['png', png], ['empty', Buffer.alloc(0)]] as const) {
      const res = await send({ siteId: cafe.f.siteIds[0] }, { content });
      expect(res.status, what).toBe(400);
      expect(['not_csv', 'empty_file'], what).toContain(res.body.error.code);
    }
    const huge = await send({ siteId: cafe.f.siteIds[0] }, { content: `Day,Product,Variant,Qty,Net\n${'03/11/2026,Latte,Reg,2,6.00\n'.repeat(4000)}` });
    expect(huge.status).toBe(413);
    expect(huge.body.error.code).toBe('too_large');
    expect(await imports()).toBe(before);
  });

  it('keeps a formula in an item name as plain text, reports control characters in a row by line, and stores the file name without direction marks', async () => {
    const tag = suffix();
    const file = [
      'Day,Product,Variant,Qty,Net',
      `03/11/2026,"=HYPERLINK(""http://evil.test"",""${tag}"")",Reg,2,6.00`,
      '03/11/2026,@SUM(1+1),Reg,1,3.00',
      '03/11/2026,Latte\u202E,Reg,1,3.00',
    ].join('\n');
    const up = await send({ siteId: cafe.f.siteIds[0] }, { content: file, name: 'ventes-\u202Egpj.csv-café.csv' });
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    // The right-to-left override is dropped; the accented letter stays (the name is read as UTF-8).
    expect(up.body.import.filename).toBe('ventes-gpj.csv-café.csv');
    const columns = { date: 'Day', item: 'Product', size: 'Variant', quantity: 'Qty', netSales: 'Net', dateFormat: 'DD/MM/YYYY' };
    const preview = await owner.post(`/api/sales-imports/${up.body.import.id}/preview`, { columns });
    expect(preview.status).toBe(200);
    // Line 4 (the header is line 1) holds a text-direction override in its item.
    expect(preview.body.errors).toEqual([{ line: 4, message: expect.stringContaining('control characters') }]);
    // The formulas (OWASP-CSV in tests/SOURCES.md) are only names here: kept exactly as written, to be matched to a drink.
    expect(preview.body.items.map((i: { tillItem: string }) => i.tillItem).sort()).toEqual([`=HYPERLINK("http://evil.test","${tag}")`, '@SUM(1+1)'].sort());
  });

  it('refuses numbers its columns cannot hold and dates no calendar has, by line', async () => {
    const file = [
      'Day,Product,Variant,Qty,Net',
      '03/11/2026,Latte,Reg,99999999999,6.00',
      '03/11/2026,Latte,Reg,1,0.00001',
      '00/11/2026,Latte,Reg,1,3.00',
      '29/02/2026,Latte,Reg,1,3.00',
      '01/01/0000,Latte,Reg,1,3.00',
      '04/11/2026,Latte,Reg,1,3.00',
    ].join('\n');
    const up = await send({ siteId: cafe.f.siteIds[0] }, { content: file });
    const preview = await owner.post(`/api/sales-imports/${up.body.import.id}/preview`, { columns: { date: 'Day', item: 'Product', size: 'Variant', quantity: 'Qty', netSales: 'Net', dateFormat: 'DD/MM/YYYY' } });
    expect(preview.status).toBe(200);
    // numeric(14, 4) holds 10 digits before the point and 4 after; 2026 is not a leap year; year 0 is no café's.
    expect(preview.body.errors.map((e: { line: number }) => e.line)).toEqual([2, 3, 4, 5, 6]);
    expect(preview.body.rowCount).toBe(1);
  });
});
