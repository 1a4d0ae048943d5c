// Invoice uploads: the type is judged by the file's first bytes (PDF "%PDF-", ISO 32000-1
// §7.5.2; PNG signature, ISO/IEC 15948 §5.2), the size by the configured limit (100 000
// bytes here); a refused upload leaves nothing on disk.
import fs from 'node:fs';
import path from 'node:path';
import PDFDocument from 'pdfkit';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn } from '../../helpers/factories';
import { makeOrderWorld, placedOrder, startOrdersApp, type OrdersContext } from './helpers';

let ctx: OrdersContext;
beforeAll(async () => {
  ctx = await startOrdersApp();
});
afterAll(() => ctx.close());

function realPdf(): Promise<Buffer> {
  return new Promise((resolve) => {
    const doc = new PDFDocument();
    const parts: Buffer[] = [];
    doc.on('data', (c: Buffer) => parts.push(c));
    doc.on('end', () => resolve(Buffer.concat(parts)));
    doc.text('Invoice 123');
    doc.end();
  });
}

const filesIn = (dir: string): string[] => (fs.existsSync(dir) ? fs.readdirSync(dir, { recursive: true, withFileTypes: true }).filter((d) => d.isFile()).map((d) => d.name) : []);

describe('invoice upload', () => {
  it('refuses a file that says .pdf but is not one, and stores nothing', async () => {
    const w = await makeOrderWorld(ctx, { terms: 'account' });
    const id = await placedOrder(w);
    const r = await w.manager.agent.post(`/api/purchase-orders/${id}/invoice`).set('X-CSRF-Token', w.manager.csrf)
      .attach('file', Buffer.from('<html>not a pdf</html>'), { filename: 'invoice.pdf', contentType: 'application/pdf' });
    expect([r.status, r.body.error.code]).toEqual([400, 'unsupported_file']);
    expect(filesIn(path.join(ctx.uploadDir, w.biz.businessId))).toEqual([]);
    expect((await w.manager.get(`/api/purchase-orders/${id}`)).body.invoice).toBeNull();
  });

  it('refuses a file over the size limit with 413, and stores nothing', async () => {
    const w = await makeOrderWorld(ctx, { terms: 'account' });
    const id = await placedOrder(w);
    const big = Buffer.concat([Buffer.from('%PDF-1.7\n'), Buffer.alloc(100_001, 0x20)]);
    const r = await w.manager.agent.post(`/api/purchase-orders/${id}/invoice`).set('X-CSRF-Token', w.manager.csrf)
      .attach('file', big, { filename: 'big.pdf', contentType: 'application/pdf' });
    expect([r.status, r.body.error.code]).toEqual([413, 'too_large']);
    expect(filesIn(path.join(ctx.uploadDir, w.biz.businessId))).toEqual([]);
  });

  it('keeps a real PDF or PNG outside the web root and serves it only to roles that read orders', async () => {
    const w = await makeOrderWorld(ctx, { terms: 'account' });
    const id = await placedOrder(w);
    const pdf = await realPdf();
    // A PDF named .png is still a PDF: the content decides.
    const r = await w.manager.agent.post(`/api/purchase-orders/${id}/invoice`).set('X-CSRF-Token', w.manager.csrf)
      .attach('file', pdf, { filename: 'scan.png', contentType: 'image/png' });
    expect(r.status).toBe(201);
    expect(r.body.invoice).toMatchObject({ contentType: 'application/pdf', name: 'scan.png', url: `/api/purchase-orders/${id}/invoice` });
    const stored = filesIn(path.join(ctx.uploadDir, w.biz.businessId));
    expect(stored).toHaveLength(1);
    expect(stored[0]).toMatch(new RegExp(`^${id}-.+\\.pdf$`));
    const got = await w.bookkeeper.get(`/api/purchase-orders/${id}/invoice`).buffer(true).parse((res, cb) => {
      const parts: Buffer[] = [];
      res.on('data', (c: Buffer) => parts.push(c));
      res.on('end', () => cb(null, Buffer.concat(parts)));
    });
    expect(got.status).toBe(200);
    expect(got.headers['content-type']).toBe('application/pdf');
    expect(Buffer.compare(got.body as Buffer, pdf)).toBe(0);
    const barista = await signIn(ctx.app, w.biz.users.barista.email);
    expect((await barista.get(`/api/purchase-orders/${id}/invoice`)).status).toBe(403);
    // PNG signature 89 50 4E 47 0D 0A 1A 0A, then anything: replaces the PDF.
    const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.from('IHDR')]);
    const p = await w.manager.agent.post(`/api/purchase-orders/${id}/invoice`).set('X-CSRF-Token', w.manager.csrf)
      .attach('file', png, { filename: 'photo.jpg', contentType: 'image/jpeg' });
    expect(p.body.invoice.contentType).toBe('image/png');
    expect(filesIn(path.join(ctx.uploadDir, w.biz.businessId))).toEqual([expect.stringMatching(/\.png$/)]);
  });
});
