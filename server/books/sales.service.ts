import { createHash } from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import type { z } from 'zod';
import { monthBounds, monthOf } from '../../src/shared/books';
import type { acceptImportSchema, ColumnMapping, ManualDay, manualDayInSchema, SalesDay, SalesImport, UploadResult } from '../../src/shared/contract/books';
import { formatFieldPath } from '../../src/shared/schemas/field-errors';
import { hasControlCharacters } from '../../src/shared/schemas/fields';
import type { AppDeps } from '../platform/deps';
import { AppError, badRequest, conflict, invalidInput, notFound } from '../platform/errors';
import { assertOwnedIds } from '../platform/ownership';
import { currencyOf } from './books.repo';
import { assertMonthOpen, assertRangeOpen, isMonthClosed } from './periods.service';
import { presentDays, presentImport, presentManualDay } from './sales.presenter';
import {
  acceptedRepeat, dayTotals, deleteManualLines, drinkSizeChoices, findImport, importedLineCount, insertPendingImport, insertSalesLines, itemMappings,
  listImportRows, lockImport, manualLines, markAccepted, markDiscarded, pendingTextSlices, rememberColumns, rememberedColumns, rememberItemMapping,
} from './sales.repo';
import { siteFromInput } from './sites';
import { guessMapping, readHeader, TillFileError } from './till-csv';
import { runInWorker } from './till-pool';
import { ERRORS_SHOWN, itemKey, type TillTaskInput } from './till-task';

type Knex = AppDeps['db'];

/**
 * The upload must be text: not a known binary format (by its magic bytes), no NUL byte, and
 * valid UTF-8 (a byte-order mark is dropped). Returns the text.
 */
async function readTextFile(buffer: Buffer): Promise<string> {
  if (!buffer.length) throw badRequest('empty_file', 'The file is empty.');
  const type = await fileTypeFromBuffer(buffer);
  if (type) throw badRequest('not_csv', `This file is a ${type.ext.toUpperCase()} file, not a CSV. Export the sales from the till as CSV and try again.`);
  if (buffer.includes(0)) throw badRequest('not_csv', 'This file is not text. Export the sales from the till as CSV and try again.');
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    throw badRequest('not_csv', 'This file is not UTF-8 text. Export the sales as CSV (UTF-8) and try again.');
  }
  return text.replace(/^\uFEFF/, '');
}

function fileError(e: { code: 'not_csv' | 'invalid_input'; message: string; field?: string }): AppError {
  return e.code === 'invalid_input' && e.field ? invalidInput({ [e.field]: e.message }) : badRequest(e.code, e.message);
}

/** The header and the first rows, read from the file's first 64 KB (the rest is the worker's). */
function headerOf(text: string) {
  try {
    return readHeader(text.slice(0, 64 * 1024));
  } catch (e) {
    if (e instanceof TillFileError) throw fileError(e);
    throw e;
  }
}

/** Runs a till task in a worker thread; a file that cannot be read becomes the API's 400. */
async function inWorker(input: TillTaskInput) {
  const r = await runInWorker(input);
  if (!r.ok) throw fileError(r);
  return r;
}

/** 409 when an accepted file of the site already holds this file (its bytes) or its sales (its rows), naming that file. */
async function refuseRepeat(db: Knex, businessId: string, siteId: string, match: { sha256?: string; rowsSha256?: string | null }): Promise<void> {
  const prior = await acceptedRepeat(db, businessId, siteId, match);
  if (prior) {
    const when = new Date(prior.accepted_at).toISOString().slice(0, 10);
    throw conflict('already_imported', `These sales were already imported for this site in "${prior.filename}" on ${when}; they are counted once.`);
  }
}

/**
 * Step 1: a till file arrives. Checked to be CSV text, refused when an accepted file of the site
 * already holds it (the same bytes, or — read with the remembered columns — the same rows), and
 * kept as a pending import (no sales are saved yet). Answers with the columns, a few rows and
 * the mapping remembered from last time (or a guess).
 */
export async function uploadImport({ db }: AppDeps, businessId: string, userId: string, siteId: string, file: { originalname: string; buffer: Buffer }): Promise<UploadResult> {
  await siteFromInput(db, businessId, siteId);
  const text = await readTextFile(file.buffer);
  const { headers, sample } = headerOf(text);
  const sha = createHash('sha256').update(file.buffer).digest('hex');
  await refuseRepeat(db, businessId, siteId, { sha256: sha });
  const saved = await rememberedColumns(db, businessId);
  const fits = Boolean(saved && [saved.date, saved.item, saved.quantity, saved.netSales, saved.size, saved.tax].every((h) => !h || headers.includes(h)));
  const columns = fits ? (saved as ColumnMapping) : guessMapping(headers);
  if (fits) {
    const read = await inWorker({ textParts: [text], columns: columns as ColumnMapping, want: 'fingerprint' });
    await refuseRepeat(db, businessId, siteId, { rowsSha256: read.fingerprint });
  }
  const filename = [...file.originalname.normalize('NFC')].filter((ch) => !hasControlCharacters(ch, false)).join('').trim().slice(0, 200) || 'sales.csv';
  const id = await db.transaction((trx) => insertPendingImport(trx, businessId, siteId, sha, filename, userId, text));
  return { import: presentImport(await findImport(db, businessId, id)), headers, sample, columns, columnsRemembered: fits };
}

async function pendingFile(db: Knex, businessId: string, id: string, lock = false) {
  const imp = await lockImport(db, businessId, id, lock);
  if (!imp) throw notFound('That import');
  if (imp.status !== 'pending') throw conflict('import_not_pending', imp.status === 'accepted' ? 'This import is already accepted.' : 'This import was discarded: upload the file again.');
  const textParts = await pendingTextSlices(db, id);
  if (textParts === undefined) throw conflict('import_not_pending', 'The file of this import is gone: upload it again.');
  return { imp, textParts };
}

/**
 * Step 2: the file read with a column mapping: line-numbered errors, totals and the till's
 * items. Saves nothing. The file is read from the database in slices and everything else —
 * reading, matching, presenting, checking against the contract, writing the JSON — happens in
 * a worker thread, so the answer comes back as the JSON text to send.
 */
export async function previewImport({ db, config }: AppDeps, businessId: string, id: string, columns: ColumnMapping): Promise<string> {
  const { imp, textParts } = await pendingFile(db, businessId, id);
  const [known, choices, currency] = await Promise.all([itemMappings(db, businessId), drinkSizeChoices(db, businessId), currencyOf(db, businessId)]);
  const read = await inWorker({ textParts, columns, want: 'preview', known, choices, currency, checkResponse: config.checkResponses });
  await refuseRepeat(db, businessId, imp.site_id, { rowsSha256: read.fingerprint });
  return read.previewJson as string;
}

/**
 * Step 3: the owner accepts. In ONE transaction: the file read again, refused whole if any row
 * cannot be read, any item is not mapped, any day is in a closed month or an accepted file of
 * the site already holds the same rows; then every line inserted, the mappings remembered and
 * the import marked accepted. Any failure on the way leaves nothing of the file saved.
 */
export async function acceptImport({ db }: AppDeps, businessId: string, id: string, input: z.output<typeof acceptImportSchema>): Promise<SalesImport> {
  if (!(await lockImport(db, businessId, id, false))) throw notFound('That import');
  await assertOwnedIds(db, businessId, 'drink_sizes', input.items.map((m, i) => ({ field: formatFieldPath(['items', i, 'drinkSizeId']), id: m.drinkSizeId })), 'Choose one of your drinks and sizes.');
  try {
    return await db.transaction(async (trx) => {
      const { imp, textParts } = await pendingFile(trx, businessId, id, true);
      const read = await inWorker({ textParts, columns: input.columns, want: 'rows' });
      const rows = read.rows!;
      if (read.errorCount) {
        const fields: Record<string, string> = {};
        for (const e of read.errors.slice(0, ERRORS_SHOWN)) fields[`line ${e.line}`] = e.message;
        throw new AppError(400, 'import_errors', `${read.errorCount} line${read.errorCount === 1 ? '' : 's'} of the file cannot be read; nothing was saved. Fix them and upload again.`, fields);
      }
      if (!rows.length) throw badRequest('empty_file', 'The file has no sales lines.');
      const chosen = new Map(input.items.map((m) => [itemKey(m.tillItem, m.tillSize), m.drinkSizeId]));
      const unmapped = new Set<string>();
      for (const r of rows) if (!chosen.has(itemKey(r.item, r.size))) unmapped.add(r.size ? `${r.item} (${r.size})` : r.item);
      if (unmapped.size) throw badRequest('unmapped_items', `Choose the drink and size for: ${[...unmapped].slice(0, 20).join(', ')}.`);
      await assertRangeOpen(trx, businessId, read.firstDay as string, read.lastDay as string);
      await refuseRepeat(trx, businessId, imp.site_id, { sha256: imp.file_sha256, rowsSha256: read.fingerprint });

      await insertSalesLines(trx, rows.map((r) => ({
        business_id: businessId, site_id: imp.site_id, import_id: id, sold_on: r.soldOn,
        drink_size_id: chosen.get(itemKey(r.item, r.size)) as string, quantity: r.quantity, net_sales: r.netSales, tax: r.tax,
      })));
      const seen = new Set<string>();
      for (const m of input.items) {
        const k = itemKey(m.tillItem, m.tillSize);
        if (seen.has(k)) continue;
        seen.add(k);
        await rememberItemMapping(trx, businessId, m.tillItem, m.tillSize, m.drinkSizeId);
      }
      await rememberColumns(trx, businessId, input.columns);
      await markAccepted(trx, id, { rowCount: rows.length, firstDay: read.firstDay as string, lastDay: read.lastDay as string, columns: input.columns, rowsSha256: read.fingerprint });
      return presentImport(await findImport(trx, businessId, id));
    });
  } catch (e) {
    // Two accepts of the same file at once: the unique indexes let one through.
    const constraint = (e as { constraint?: string }).constraint;
    if (constraint === 'sales_imports_once' || constraint === 'sales_imports_rows_once') throw conflict('already_imported', 'These sales were already imported for this site; they are counted once.');
    throw e;
  }
}

/** Discards a pending import, or takes back an accepted one (its sales go) while its months are open. */
export async function discardImport({ db }: AppDeps, businessId: string, id: string): Promise<void> {
  await db.transaction(async (trx) => {
    const imp = await lockImport(trx, businessId, id, true);
    if (!imp) throw notFound('That import');
    if (imp.status === 'discarded') return;
    if (imp.status === 'accepted') await assertRangeOpen(trx, businessId, imp.first_day as string, imp.last_day as string);
    await markDiscarded(trx, id, imp.status === 'accepted');
  });
}

export async function listImports({ db }: AppDeps, businessId: string, siteId: string | undefined): Promise<SalesImport[]> {
  if (siteId) await siteFromInput(db, businessId, siteId);
  return (await listImportRows(db, businessId, siteId ?? null)).map(presentImport);
}

/**
 * One day at a site as the hand-entry form loads it: the lines typed in by hand (in the order
 * they were saved), how many lines came from till files that day, and whether its month is
 * closed (then saving is refused). One query after another: inside a save this runs on the
 * transaction's one connection.
 */
async function readManualDay(db: Knex, businessId: string, siteId: string, soldOn: string): Promise<ManualDay> {
  const currency = await currencyOf(db, businessId);
  const closed = await isMonthClosed(db, businessId, monthOf(soldOn));
  const lines = await manualLines(db, businessId, siteId, soldOn);
  const imported = await importedLineCount(db, businessId, siteId, soldOn);
  return presentManualDay(siteId, soldOn, closed, currency, lines, imported);
}

export async function manualDay({ db }: AppDeps, businessId: string, siteId: string, soldOn: string): Promise<ManualDay> {
  await siteFromInput(db, businessId, siteId);
  return readManualDay(db, businessId, siteId, soldOn);
}

/**
 * A day's sales typed in by hand (when there is no till file): replaces that day's hand-entered
 * lines, and answers with the day as `manualDay` reads it and how many lines were replaced.
 */
export async function saveManualDay({ db }: AppDeps, businessId: string, input: z.output<typeof manualDayInSchema>): Promise<ManualDay & { replaced: number }> {
  return db.transaction(async (trx) => {
    await siteFromInput(trx, businessId, input.siteId);
    await assertOwnedIds(trx, businessId, 'drink_sizes', input.lines.map((l, i) => ({ field: formatFieldPath(['lines', i, 'drinkSizeId']), id: l.drinkSizeId })), 'Choose one of your drinks and sizes.');
    await assertMonthOpen(trx, businessId, input.soldOn);
    const replaced = await deleteManualLines(trx, businessId, input.siteId, input.soldOn);
    if (input.lines.length) {
      await insertSalesLines(trx, input.lines.map((l) => ({ business_id: businessId, site_id: input.siteId, sold_on: input.soldOn, drink_size_id: l.drinkSizeId, quantity: l.quantity, net_sales: l.netSales, tax: l.tax ?? null })));
    }
    return { ...(await readManualDay(trx, businessId, input.siteId, input.soldOn)), replaced };
  });
}

/** Each day of a month at a site: cups and net sales, from till files and typed in. */
export async function salesDays({ db }: AppDeps, businessId: string, q: { siteId: string; month: string }): Promise<{ month: string; currency: string; days: SalesDay[] }> {
  await siteFromInput(db, businessId, q.siteId);
  const { first, last } = monthBounds(q.month);
  const [rows, currency] = await Promise.all([dayTotals(db, businessId, q.siteId, first, last), currencyOf(db, businessId)]);
  return { month: q.month, currency, days: presentDays(rows, currency) };
}
