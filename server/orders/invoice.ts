import { randomUUID } from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import type { NextFunction, Request, Response } from 'express';
import multer from 'multer';
import type { AppDeps } from '../platform/deps';
import type { SessionUser } from '../auth/roles';
import { badRequest, conflict, notFound, tooLarge } from '../platform/errors';
import { addEvent, findOrder } from './orders.repo';

/** The kinds of invoice we keep, told apart by the file's first bytes, never by its name. */
const KINDS = [
  { type: 'application/pdf', ext: 'pdf', magic: Buffer.from('%PDF-', 'latin1') },
  { type: 'image/jpeg', ext: 'jpg', magic: Buffer.from([0xff, 0xd8, 0xff]) },
  { type: 'image/png', ext: 'png', magic: Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]) },
] as const;

/** PDF `%PDF-` (ISO 32000-1 §7.5.2), JPEG `FF D8 FF` (JFIF/Exif SOI marker), PNG signature (ISO/IEC 15948 §5.2). */
export function sniffInvoice(buf: Buffer): (typeof KINDS)[number] | null {
  return KINDS.find((k) => buf.length >= k.magic.length && buf.subarray(0, k.magic.length).equals(k.magic)) ?? null;
}

/** multer keeping the upload in memory (up to the configured limit) so nothing touches disk until it is checked. */
export function invoiceUpload(deps: AppDeps) {
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: deps.config.UPLOAD_MAX_BYTES, files: 1, fields: 5 } }).single('file');
  return (req: Request, res: Response, next: NextFunction) => {
    upload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(tooLarge(`The invoice is larger than ${Math.floor(deps.config.UPLOAD_MAX_BYTES / 1024 / 1024)} MB. Send a smaller scan or PDF.`));
        return next(badRequest('bad_upload', `The upload could not be read (${err.code}). Send one file in the "file" field.`));
      }
      if (err) return next(err);
      next();
    });
  };
}

export function uploadRoot(deps: AppDeps): string {
  return path.resolve(deps.config.UPLOAD_DIR);
}

/** Stores a checked invoice under UPLOAD_DIR (outside the web root) and links it to the order. */
export async function storeInvoice(deps: AppDeps, user: SessionUser, orderId: string, file: Express.Multer.File | undefined) {
  if (!file) throw badRequest('no_file', 'Choose the invoice file (PDF, JPEG or PNG) to upload.');
  const kind = sniffInvoice(file.buffer);
  if (!kind) throw badRequest('unsupported_file', 'That file is not a PDF, JPEG or PNG (judged by its content, not its name). Upload the invoice as one of those.');
  const order = await findOrder(deps.db, user.businessId, orderId);
  if (!order) throw notFound('That purchase order');
  if (order.status === 'draft' || order.status === 'cancelled') throw conflict('no_invoice_yet', 'An invoice can be added once the order is placed.');
  const rel = path.join(user.businessId, `${orderId}-${randomUUID()}.${kind.ext}`);
  const full = path.join(uploadRoot(deps), rel);
  await fs.mkdir(path.dirname(full), { recursive: true });
  await fs.writeFile(full, file.buffer, { flag: 'wx' });
  const name = path.basename(file.originalname || `invoice.${kind.ext}`).slice(0, 200);
  let previous: string | null = null;
  try {
    await deps.db.transaction(async (trx) => {
      const cur = (await findOrder(trx, user.businessId, orderId, true))!;
      previous = cur.invoice_path;
      await trx('purchase_orders').where({ id: orderId })
        .update({ invoice_path: rel, invoice_content_type: kind.type, invoice_original_name: name, version: cur.version + 1, updated_at: trx.fn.now() });
      await addEvent(trx, user.businessId, orderId, user.id, 'invoice', `Supplier invoice uploaded (${name}).`);
    });
  } catch (err) {
    await fs.rm(full, { force: true });
    throw err;
  }
  if (previous) await fs.rm(path.join(uploadRoot(deps), previous), { force: true });
}

export async function invoiceFile(deps: AppDeps, businessId: string, orderId: string) {
  const order = await findOrder(deps.db, businessId, orderId);
  if (!order?.invoice_path) throw notFound('That invoice');
  const root = uploadRoot(deps);
  const full = path.resolve(root, order.invoice_path);
  if (!full.startsWith(root + path.sep)) throw notFound('That invoice');
  return { full, contentType: order.invoice_content_type ?? 'application/octet-stream', name: order.invoice_original_name ?? 'invoice' };
}
