import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestContext } from '../../helpers/context';
import { signIn, suffix, type Session } from '../../helpers/factories';
import { makeBooksCafe } from './scenario';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp({ UPLOAD_MAX_BYTES: String(256 * 1024) });
});
afterAll(() => ctx.close());

type Cafe = Awaited<ReturnType<typeof makeBooksCafe>>;
const columns = { date: 'Day', item: 'Product', size: 'Variant', quantity: 'Qty', netSales: 'Net', tax: 'VAT', dateFormat: 'DD/MM/YYYY' };

function upload(s: Session, siteId: string, content: string | Buffer, filename = 'till.csv') {
  return s.agent.post('/api/sales-imports').set('X-CSRF-Token', s.csrf).field('siteId', siteId).attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content), { filename, contentType: 'text/csv' });
}

async function salesOf(importId: string) {
  return ctx.db('sales_lines').where({ import_id: importId }).count<{ n: string }[]>('* as n').then((r) => Number(r[0].n));
}

describe('till sales import', () => {
  let cafe: Cafe;
  let owner: Session;
  beforeAll(async () => {
    cafe = await makeBooksCafe(ctx.db);
    owner = await signIn(ctx.app, cafe.f.users.owner.email);
  });

  it('maps columns and items, saves nothing until accepted, remembers both, and counts the same file once', async () => {
    const tag = suffix();
    const file = `Day,Product,Variant,Qty,Net,VAT\n03/11/2026,Latte ${tag},Reg,12,"£1,234.50",246.90\n04/11/2026,Latte ${tag},Reg,3,9.00,\n`;
    const up = await upload(owner, cafe.f.siteIds[0], file);
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    expect(up.body.headers).toEqual(['Day', 'Product', 'Variant', 'Qty', 'Net', 'VAT']);
    expect(up.body.columns).toMatchObject({ date: 'Day', item: 'Product', size: 'Variant', quantity: 'Qty', netSales: 'Net', tax: 'VAT' });
    const id = up.body.import.id;

    const preview = await owner.post(`/api/sales-imports/${id}/preview`, { columns });
    expect(preview.status, JSON.stringify(preview.body)).toBe(200);
    expect(preview.body).toMatchObject({ rowCount: 2, errorCount: 0, firstDay: '2026-11-03', lastDay: '2026-11-04', netSales: '1243.50' });
    expect(preview.body.items).toHaveLength(1);
    expect(preview.body.items[0]).toMatchObject({ tillItem: `Latte ${tag}`, tillSize: 'Reg', quantity: '15', drinkSizeId: null });
    // The latte is the most similar drink by name (Levenshtein, fastest-levenshtein).
    expect(preview.body.items[0].suggestions[0].drinkSizeId).toBe(cafe.latteSizeId);
    expect(await salesOf(id)).toBe(0);

    const accept = await owner.post(`/api/sales-imports/${id}/accept`, { columns, items: [{ tillItem: `Latte ${tag}`, tillSize: 'Reg', drinkSizeId: cafe.latteSizeId }] });
    expect(accept.status, JSON.stringify(accept.body)).toBe(200);
    expect(accept.body.import).toMatchObject({ status: 'accepted', rowCount: 2, firstDay: '2026-11-03', lastDay: '2026-11-04' });
    const lines = await ctx.db('sales_lines').where({ import_id: id }).orderBy('sold_on').select('sold_on', 'quantity', 'net_sales', 'tax');
    expect(lines).toEqual([
      { sold_on: '2026-11-03', quantity: '12.0000', net_sales: '1234.5000', tax: '246.9000' },
      { sold_on: '2026-11-04', quantity: '3.0000', net_sales: '9.0000', tax: null },
    ]);

    // The same file again, even under another name: recognised by its SHA-256.
    const again = await upload(owner, cafe.f.siteIds[0], file, 'renamed.csv');
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_imported');

    // A new file from the same till: the column and item mappings are remembered.
    const next = await upload(owner, cafe.f.siteIds[0], `Day,Product,Variant,Qty,Net,VAT\n05/11/2026,latte ${tag},reg,1,3.00,0.60\n`);
    expect(next.body.columnsRemembered).toBe(true);
    expect(next.body.columns).toEqual(columns);
    const p2 = await owner.post(`/api/sales-imports/${next.body.import.id}/preview`, { columns });
    expect(p2.body.items[0]).toMatchObject({ drinkSizeId: cafe.latteSizeId, remembered: true });
  });

  it('reports unreadable rows with their line numbers and saves nothing', async () => {
    const file = [
      'Day,Product,Variant,Qty,Net,VAT',
      '01/11/2026,Latte,Reg,2,6.00,1.20',
      '31/11/2026,Latte,Reg,2,6.00,1.20',
      '02/11/2026,,Reg,two,6.00,',
      '',
      '03/11/2026,Latte,Reg,1,abc,',
    ].join('\n');
    const up = await upload(owner, cafe.f.siteIds[0], file);
    const id = up.body.import.id;
    const preview = await owner.post(`/api/sales-imports/${id}/preview`, { columns });
    expect(preview.body.errorCount).toBe(3);
    expect(preview.body.errors).toEqual([
      { line: 3, message: 'Line 3: the date "31/11/2026" is not a DD/MM/YYYY date.' },
      { line: 4, message: 'Line 4: the item is empty; the quantity "two" is not a number.' },
      { line: 6, message: 'Line 6: the net sales "abc" is not an amount.' },
    ]);
    const accept = await owner.post(`/api/sales-imports/${id}/accept`, { columns, items: [{ tillItem: 'Latte', tillSize: 'Reg', drinkSizeId: cafe.latteSizeId }] });
    expect(accept.status).toBe(400);
    expect(accept.body.error.code).toBe('import_errors');
    expect(accept.body.error.fields).toMatchObject({ 'line 3': expect.stringContaining('31/11/2026'), 'line 6': expect.any(String) });
    expect(await salesOf(id)).toBe(0);
    expect((await ctx.db('sales_imports').where({ id }).first('status')).status).toBe('pending');
  });

  it('refuses an unmapped item, a binary file and a file over the size limit', async () => {
    const up = await upload(owner, cafe.f.siteIds[0], `Day,Product,Variant,Qty,Net,VAT\n01/11/2026,Mystery ${suffix()},Reg,1,1.00,\n`);
    const accept = await owner.post(`/api/sales-imports/${up.body.import.id}/accept`, { columns, items: [] });
    expect(accept.status).toBe(400);
    expect(accept.body.error.code).toBe('unmapped_items');

    // A PDF is valid UTF-8 here, yet its "%PDF-" signature (ISO 32000-1 §7.5.2) gives it away: type by content, not by name.
    const pdf = await upload(owner, cafe.f.siteIds[0], Buffer.from('%PDF-1.7\n1 0 obj\n<<>>\nendobj\n'), 'sales.csv');
    expect(pdf.status).toBe(400);
    expect(pdf.body.error).toMatchObject({ code: 'not_csv', message: expect.stringContaining('PDF') });
    // A spreadsheet workbook is a ZIP archive (local file header PK\x03\x04, APPNOTE.TXT §4.3.7).
    const zip = await upload(owner, cafe.f.siteIds[0], Buffer.concat([Buffer.from('504b0304140000000800', 'hex'), Buffer.alloc(100)]), 'sales.csv');
    expect(zip.body.error.code).toBe('not_csv');
    const nul = await upload(owner, cafe.f.siteIds[0], Buffer.from('Day,Product,Variant,Qty\u0000,Net\n'));
    expect(nul.body.error.code).toBe('not_csv');

    const big = await upload(owner, cafe.f.siteIds[0], `Day,Product,Variant,Qty,Net\n${'01/11/2026,Latte,Reg,1,1.00\n'.repeat(12000)}`);
    expect(big.status).toBe(413);
    expect(big.body.error.code).toBe('too_large');
  });

  it('leaves nothing half-saved when the import fails part way (one transaction)', async () => {
    const rows = Array.from({ length: 2500 }, (_, i) => `02/11/2026,Latte,Reg,${i === 2400 ? '777.777' : '1'},3.00,`);
    const up = await upload(owner, cafe.f.siteIds[1], `Day,Product,Variant,Qty,Net,VAT\n${rows.join('\n')}\n`);
    const id = up.body.import.id;
    // A real PostgreSQL trigger fails the 2401st row, in the third batch of 1000, after two batches went in.
    const fn = `fail_${suffix()}`;
    await ctx.db.raw(`create function ${fn}() returns trigger language plpgsql as $$ begin raise exception 'disk full (test)'; end $$`);
    await ctx.db.raw(`create trigger ${fn} before insert on sales_lines for each row when (new.quantity = 777.777 and new.import_id = '${id}') execute function ${fn}()`);
    try {
      const accept = await owner.post(`/api/sales-imports/${id}/accept`, { columns, items: [{ tillItem: 'Latte', tillSize: 'Reg', drinkSizeId: cafe.latteSizeId }] });
      expect(accept.status).toBe(500);
    } finally {
      await ctx.db.raw(`drop trigger ${fn} on sales_lines`);
      await ctx.db.raw(`drop function ${fn}()`);
    }
    expect(await salesOf(id)).toBe(0);
    const imp = await ctx.db('sales_imports').where({ id }).first('status');
    expect(imp.status).toBe('pending');
    expect(await ctx.db('till_item_mappings').where({ business_id: cafe.biz, till_item: 'Latte' }).first()).toBeUndefined();

    // Once the cause is gone the same pending import goes in whole.
    const retry = await owner.post(`/api/sales-imports/${id}/accept`, { columns, items: [{ tillItem: 'Latte', tillSize: 'Reg', drinkSizeId: cafe.latteSizeId }] });
    expect(retry.status).toBe(200);
    expect(await salesOf(id)).toBe(2500);
  });

  it('takes a day typed in by hand, replacing that day\'s hand-entered lines', async () => {
    const site = cafe.f.siteIds[1];
    const put = (lines: object[]) => owner.put('/api/sales/days', { siteId: site, soldOn: '2026-11-09', lines });
    expect((await put([{ drinkSizeId: cafe.latteSizeId, quantity: '40', netSales: '120.00' }])).status).toBe(200);
    expect((await put([{ drinkSizeId: cafe.latteSizeId, quantity: '42', netSales: '126.00', tax: '25.20' }])).status).toBe(200);
    const days = await owner.get(`/api/sales/days?siteId=${site}&month=2026-11`);
    expect(days.body.days.find((d: { day: string }) => d.day === '2026-11-09')).toEqual({ day: '2026-11-09', cups: '42', netSales: '126.00', manualLines: 1, importedLines: 0 });
  });
});

describe('the same sales imported again', () => {
  let cafe: Cafe;
  let owner: Session;
  beforeAll(async () => {
    cafe = await makeBooksCafe(ctx.db);
    owner = await signIn(ctx.app, cafe.f.users.owner.email);
  });

  async function importWhole(site: string, file: string, filename: string) {
    const up = await upload(owner, site, file, filename);
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const accept = await owner.post(`/api/sales-imports/${up.body.import.id}/accept`, { columns, items: [{ tillItem: 'Latte', tillSize: 'Reg', drinkSizeId: cafe.latteSizeId }] });
    expect(accept.status, JSON.stringify(accept.body)).toBe(200);
    return up.body.import.id as string;
  }
  const header = 'Day,Product,Variant,Qty,Net,VAT';
  const rows = ['10/11/2026,Latte,Reg,12,36.00,7.20', '11/11/2026,Latte,Reg,9,27.00,5.40', '12/11/2026,Latte,Reg,4,12.00,2.40'];

  it('is refused when only the line endings differ, naming the file that holds them', async () => {
    const site = cafe.f.siteIds[0];
    await importWhole(site, `${[header, ...rows].join('\n')}\n`, 'november-week-2.csv');
    // The same rows with CR LF line endings: other bytes (another SHA-256), the same sales.
    const crlf = `${[header, ...rows].join('\r\n')}\r\n`;
    const again = await upload(owner, site, crlf, 'november-week-2-again.csv');
    expect(again.status, JSON.stringify(again.body)).toBe(409);
    expect(again.body.error.code).toBe('already_imported');
    expect(again.body.error.message).toContain('"november-week-2.csv"');
    expect(await ctx.db('sales_imports').where({ business_id: cafe.biz, filename: 'november-week-2-again.csv' }).first()).toBeUndefined();
  });

  it('is refused when the rows come in another order (and with "36" for "36.00"), at preview and at accept', async () => {
    const site = cafe.f.siteIds[1];
    // A first file whose columns the business has not used before: nothing remembered, so the
    // repeat is found once the columns are chosen.
    await importWhole(site, `${[header, ...rows].join('\n')}\n`, 'canal-november.csv');
    await ctx.db('till_column_mappings').where({ business_id: cafe.biz }).del();
    const shuffled = [header, rows[2], rows[0].replace('36.00', '36'), rows[1]].join('\n');
    const up = await upload(owner, site, shuffled, 'canal-november-resent.csv');
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const preview = await owner.post(`/api/sales-imports/${up.body.import.id}/preview`, { columns });
    expect(preview.status).toBe(409);
    expect(preview.body.error).toMatchObject({ code: 'already_imported', message: expect.stringContaining('"canal-november.csv"') });
    const accept = await owner.post(`/api/sales-imports/${up.body.import.id}/accept`, { columns, items: [{ tillItem: 'Latte', tillSize: 'Reg', drinkSizeId: cafe.latteSizeId }] });
    expect(accept.status).toBe(409);
    expect(accept.body.error.message).toContain('"canal-november.csv"');
    // 12 + 9 + 4 cups from the first file only.
    const cups = await ctx.db('sales_lines').where({ business_id: cafe.biz, site_id: site }).whereBetween('sold_on', ['2026-11-10', '2026-11-12']).sum<{ s: string }[]>('quantity as s');
    expect(Number(cups[0].s)).toBe(25);
    // The same rows at the other site are that site's own sales.
    expect((await upload(owner, cafe.f.siteIds[0], shuffled, 'market-november.csv')).status).toBe(201);
  });

  it('takes a file that differs by one row', async () => {
    const site = cafe.f.siteIds[0];
    const other = [header, ...rows.slice(0, 2), '12/11/2026,Latte,Reg,5,15.00,3.00'].join('\n');
    const up = await upload(owner, site, other, 'corrected.csv');
    expect(up.status).toBe(201);
    expect((await owner.post(`/api/sales-imports/${up.body.import.id}/preview`, { columns })).status).toBe(200);
  });
});
