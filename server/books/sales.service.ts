import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { z } from 'zod';
import { monthBounds, monthOf, monthString } from '../../src/shared/books';
import { D, dec } from '../../src/shared/decimal';
import { writeMoney } from '../../src/shared/money';
import { rules } from '../../src/shared/checks';
import { decimalString } from '../../src/shared/schemas/costing';
import { isoDate } from '../../src/shared/schemas/fields';
import { qty } from '../platform/present';
import { AppError, badRequest, conflict, notFound } from '../platform/errors';
import { assertMonthOpen, assertRangeOpen, isMonthClosed } from './periods.service';
import { assertSite } from './sites';
import { columnMappingSchema, guessMapping, readHeader, readRows, readTextFile, similarity, type ColumnMapping, type TillRow } from './till-csv';

export const acceptSchema = z.object({
  columns: columnMappingSchema,
  items: z.array(z.object({ tillItem: z.string().max(200), tillSize: z.string().max(200).default(''), drinkSizeId: z.uuid('Choose the drink and size.') })).max(5000),
});
export const previewSchema = z.object({ columns: columnMappingSchema });
export const manualDaySchema = z.object({
  siteId: z.uuid('Choose a site.'),
  soldOn: isoDate,
  lines: z.array(z.object({ drinkSizeId: z.uuid('Choose the drink and size.'), quantity: decimalString(rules.nonNegative), netSales: decimalString(rules.nonNegative), tax: decimalString(rules.nonNegative).nullish() })).max(500),
});
export const salesDaysQuery = z.object({ siteId: z.uuid(), month: monthString });
export const salesDayQuery = z.object({ siteId: z.uuid('Choose a site.'), soldOn: isoDate });

const INSERT_BATCH = 1000;
/** Errors listed in a preview: enough to fix a file, never a megabyte of them. */
const ERRORS_SHOWN = 200;

interface ImportRow {
  id: string;
  site_id: string;
  file_sha256: string;
  filename: string;
  row_count: number;
  status: 'pending' | 'accepted' | 'discarded';
  first_day: string | null;
  last_day: string | null;
  created_at: Date;
  accepted_at: Date | null;
  created_by: string | null;
}

function importOut(r: ImportRow) {
  return {
    id: r.id,
    siteId: r.site_id,
    filename: r.filename,
    sha256: r.file_sha256,
    status: r.status,
    rowCount: r.row_count,
    firstDay: r.first_day,
    lastDay: r.last_day,
    createdAt: new Date(r.created_at).toISOString(),
    acceptedAt: r.accepted_at ? new Date(r.accepted_at).toISOString() : null,
    createdBy: r.created_by,
  };
}

const importQuery = (db: Knex, businessId: string) =>
  db('sales_imports as i').leftJoin('users as u', 'u.id', 'i.created_by').where('i.business_id', businessId)
    .select('i.id', 'i.site_id', 'i.file_sha256', 'i.filename', 'i.row_count', 'i.status', 'i.first_day', 'i.last_day', 'i.created_at', 'i.accepted_at', 'u.name as created_by');

async function alreadyAccepted(db: Knex, businessId: string, siteId: string, sha: string) {
  const prior = await db('sales_imports').where({ business_id: businessId, site_id: siteId, file_sha256: sha, status: 'accepted' }).first('accepted_at', 'filename');
  if (prior) {
    const when = new Date(prior.accepted_at).toISOString().slice(0, 10);
    throw conflict('already_imported', `This file was already imported for this site on ${when} (${prior.filename}); its sales are counted once.`);
  }
}

/**
 * Step 1: a till file arrives. Checked to be CSV text, recognised by its SHA-256 if it was
 * already accepted for the site, and kept as a pending import (no sales are saved yet). Answers
 * with the columns, a few rows and the mapping remembered from last time (or a guess).
 */
export async function uploadImport(db: Knex, businessId: string, userId: string, siteId: string, file: { originalname: string; buffer: Buffer }) {
  await assertSite(db, businessId, siteId);
  const text = await readTextFile(file.buffer);
  const { headers, sample } = readHeader(text);
  const sha = createHash('sha256').update(file.buffer).digest('hex');
  await alreadyAccepted(db, businessId, siteId, sha);
  const remembered = await db('till_column_mappings').where({ business_id: businessId }).first('mapping');
  const saved = remembered?.mapping as ColumnMapping | undefined;
  const fits = saved && [saved.date, saved.item, saved.quantity, saved.netSales].every((h) => headers.includes(h));
  const id = await db.transaction(async (trx) => {
    const [row] = await trx('sales_imports')
      .insert({ business_id: businessId, site_id: siteId, file_sha256: sha, filename: file.originalname.slice(0, 200) || 'sales.csv', created_by: userId })
      .returning('id');
    await trx('sales_import_files').insert({ import_id: row.id, content: text });
    return row.id as string;
  });
  return {
    import: importOut(await importQuery(db, businessId).where('i.id', id).first()),
    headers,
    sample,
    columns: fits ? saved : guessMapping(headers),
    columnsRemembered: Boolean(fits),
  };
}

async function pendingFile(db: Knex, businessId: string, id: string, lock = false) {
  const q = db('sales_imports').where({ id, business_id: businessId });
  if (lock) q.forUpdate();
  const imp = await q.first('id', 'site_id', 'status', 'file_sha256');
  if (!imp) throw notFound('That import');
  if (imp.status !== 'pending') throw conflict('import_not_pending', imp.status === 'accepted' ? 'This import is already accepted.' : 'This import was discarded: upload the file again.');
  const file = await db('sales_import_files').where({ import_id: id }).first('content');
  if (!file) throw conflict('import_not_pending', 'The file of this import is gone: upload it again.');
  return { imp, text: file.content as string };
}

interface DrinkSizeChoice {
  id: string;
  label: string;
  drink: string;
  size: string;
}

async function drinkSizeChoices(db: Knex, businessId: string): Promise<DrinkSizeChoice[]> {
  const rows = await db('drink_sizes as ds').join('drinks as d', 'd.id', 'ds.drink_id').join('cup_sizes as cs', 'cs.id', 'ds.size_id')
    .where('ds.business_id', businessId).whereNull('d.archived_at').orderBy([{ column: 'd.name' }, { column: 'cs.position' }])
    .select('ds.id', 'd.name as drink', 'cs.name as size');
  return rows.map((r) => ({ id: r.id, drink: r.drink, size: r.size, label: `${r.drink} (${r.size})` }));
}

const itemKey = (item: string, size: string) => `${item.toLowerCase()}\u0000${size.toLowerCase()}`;

interface ItemSummary {
  tillItem: string;
  tillSize: string;
  rows: number;
  quantity: string;
  netSales: string;
  drinkSizeId: string | null;
  remembered: boolean;
  suggestions: { drinkSizeId: string; label: string; score: number }[];
}

/** The till's distinct items with their remembered drink size, or the closest by name. */
async function summariseItems(db: Knex, businessId: string, rows: TillRow[]): Promise<ItemSummary[]> {
  const groups = new Map<string, { tillItem: string; tillSize: string; rows: number; quantity: InstanceType<typeof D>; net: InstanceType<typeof D> }>();
  for (const r of rows) {
    const k = itemKey(r.item, r.size);
    let g = groups.get(k);
    if (!g) groups.set(k, (g = { tillItem: r.item, tillSize: r.size, rows: 0, quantity: new D(0), net: new D(0) }));
    g.rows++;
    g.quantity = g.quantity.plus(dec(r.quantity));
    g.net = g.net.plus(dec(r.netSales));
  }
  const [mappings, choices] = await Promise.all([
    db('till_item_mappings').where({ business_id: businessId }).select('till_item', 'till_size', 'drink_size_id'),
    drinkSizeChoices(db, businessId),
  ]);
  const known = new Map(mappings.map((m) => [itemKey(m.till_item, m.till_size), m.drink_size_id as string]));
  const live = new Set(choices.map((c) => c.id));
  return [...groups.values()].map((g) => {
    const mapped = known.get(itemKey(g.tillItem, g.tillSize));
    const name = `${g.tillItem} ${g.tillSize}`;
    const suggestions = choices
      .map((c) => ({ drinkSizeId: c.id, label: c.label, score: Math.max(similarity(name, `${c.drink} ${c.size}`), (similarity(g.tillItem, c.drink) + (g.tillSize ? similarity(g.tillSize, c.size) : 0.5)) / 2) }))
      .sort((a, b) => b.score - a.score)
      .slice(0, 3)
      .map((s) => ({ ...s, score: Math.round(s.score * 100) / 100 }));
    return {
      tillItem: g.tillItem,
      tillSize: g.tillSize,
      rows: g.rows,
      quantity: qty(g.quantity.toFixed()) as string,
      netSales: g.net.toFixed(),
      drinkSizeId: mapped && live.has(mapped) ? mapped : null,
      remembered: Boolean(mapped && live.has(mapped)),
      suggestions,
    };
  });
}

function daysOf(rows: TillRow[]) {
  let first: string | null = null;
  let last: string | null = null;
  for (const r of rows) {
    if (!first || r.soldOn < first) first = r.soldOn;
    if (!last || r.soldOn > last) last = r.soldOn;
  }
  return { first, last };
}

/** Step 2: the file read with a column mapping: line-numbered errors, totals and the till's items. Saves nothing. */
export async function previewImport(db: Knex, businessId: string, id: string, columns: ColumnMapping) {
  const { text } = await pendingFile(db, businessId, id);
  const { headers } = readHeader(text);
  const { rows, errors } = readRows(text, columns, headers);
  const currency = (await db('businesses').where({ id: businessId }).first('currency')).currency as string;
  let net = new D(0);
  for (const r of rows) net = net.plus(dec(r.netSales));
  const { first, last } = daysOf(rows);
  return {
    rowCount: rows.length,
    errorCount: errors.length,
    errors: errors.slice(0, ERRORS_SHOWN),
    firstDay: first,
    lastDay: last,
    netSales: writeMoney(net, currency),
    currency,
    items: await summariseItems(db, businessId, rows),
    drinkSizes: (await drinkSizeChoices(db, businessId)).map((c) => ({ id: c.id, label: c.label })),
  };
}

/**
 * Step 3: the owner accepts. In ONE transaction: the file read again, refused whole if any row
 * cannot be read, any item is not mapped or any day is in a closed month; then every line
 * inserted, the mappings remembered and the import marked accepted. Any failure on the way
 * leaves nothing of the file saved.
 */
export async function acceptImport(db: Knex, businessId: string, userId: string, id: string, input: z.infer<typeof acceptSchema>) {
  try {
    return await db.transaction(async (trx) => {
      const { imp, text } = await pendingFile(trx, businessId, id, true);
      const { headers } = readHeader(text);
      const { rows, errors } = readRows(text, input.columns, headers);
      if (errors.length) {
        const fields: Record<string, string> = {};
        for (const e of errors.slice(0, ERRORS_SHOWN)) fields[`line ${e.line}`] = e.message;
        throw new AppError(400, 'import_errors', `${errors.length} line${errors.length === 1 ? '' : 's'} of the file cannot be read; nothing was saved. Fix them and upload again.`, fields);
      }
      if (!rows.length) throw badRequest('empty_file', 'The file has no sales lines.');
      const chosen = new Map(input.items.map((m) => [itemKey(m.tillItem, m.tillSize), m.drinkSizeId]));
      const sizeIds = [...new Set(chosen.values())];
      const valid = new Set((await trx('drink_sizes').where({ business_id: businessId }).whereIn('id', sizeIds).select('id')).map((r) => r.id as string));
      const unmapped = new Set<string>();
      for (const r of rows) {
        const ds = chosen.get(itemKey(r.item, r.size));
        if (!ds || !valid.has(ds)) unmapped.add(r.size ? `${r.item} (${r.size})` : r.item);
      }
      if (unmapped.size) throw badRequest('unmapped_items', `Choose the drink and size for: ${[...unmapped].slice(0, 20).join(', ')}.`);
      const { first, last } = daysOf(rows);
      await assertRangeOpen(trx, businessId, first as string, last as string);
      await alreadyAccepted(trx, businessId, imp.site_id, imp.file_sha256);

      for (let i = 0; i < rows.length; i += INSERT_BATCH) {
        await trx('sales_lines').insert(
          rows.slice(i, i + INSERT_BATCH).map((r) => ({
            business_id: businessId,
            site_id: imp.site_id,
            import_id: id,
            sold_on: r.soldOn,
            drink_size_id: chosen.get(itemKey(r.item, r.size)),
            quantity: r.quantity,
            net_sales: r.netSales,
            tax: r.tax,
          })),
        );
      }
      const seen = new Set<string>();
      const mappings = input.items.filter((m) => valid.has(m.drinkSizeId) && !seen.has(itemKey(m.tillItem, m.tillSize)) && seen.add(itemKey(m.tillItem, m.tillSize)));
      for (const m of mappings) {
        await trx.raw(
          `insert into till_item_mappings (business_id, till_item, till_size, drink_size_id) values (?, ?, ?, ?)
           on conflict (business_id, lower(till_item), lower(till_size)) do update set drink_size_id = excluded.drink_size_id`,
          [businessId, m.tillItem, m.tillSize, m.drinkSizeId],
        );
      }
      await trx('till_column_mappings')
        .insert({ business_id: businessId, mapping: JSON.stringify(input.columns) })
        .onConflict('business_id')
        .merge({ mapping: JSON.stringify(input.columns), updated_at: trx.fn.now() });
      await trx('sales_imports').where({ id }).update({ status: 'accepted', accepted_at: trx.fn.now(), row_count: rows.length, first_day: first, last_day: last, mapping: JSON.stringify(input.columns) });
      await trx('sales_import_files').where({ import_id: id }).del();
      return { import: importOut(await importQuery(trx, businessId).where('i.id', id).first()) };
    });
  } catch (e) {
    // Two accepts of the same file at once: the unique index lets one through.
    if ((e as { code?: string; constraint?: string }).constraint === 'sales_imports_once') throw conflict('already_imported', 'This file was already imported for this site; its sales are counted once.');
    throw e;
  }
}

/** Discards a pending import, or takes back an accepted one (its sales go) while its months are open. */
export async function discardImport(db: Knex, businessId: string, id: string) {
  await db.transaction(async (trx) => {
    const imp = await trx('sales_imports').where({ id, business_id: businessId }).forUpdate().first('status', 'first_day', 'last_day');
    if (!imp) throw notFound('That import');
    if (imp.status === 'discarded') return;
    if (imp.status === 'accepted') {
      await assertRangeOpen(trx, businessId, imp.first_day, imp.last_day);
      await trx('sales_lines').where({ import_id: id }).del();
    }
    await trx('sales_import_files').where({ import_id: id }).del();
    await trx('sales_imports').where({ id }).update({ status: 'discarded' });
  });
}

export async function listImports(db: Knex, businessId: string, siteId?: string) {
  const rows: ImportRow[] = await importQuery(db, businessId).modify((q) => (siteId ? q.where('i.site_id', siteId) : q)).orderBy('i.created_at', 'desc').limit(100);
  return { imports: rows.map(importOut) };
}

/**
 * One day at a site as the hand-entry form loads it: the lines typed in by hand (in the order
 * they were saved), how many lines came from till files that day, and whether its month is
 * closed (then saving is refused).
 */
export async function manualDay(db: Knex | Knex.Transaction, businessId: string, q: z.infer<typeof salesDayQuery>) {
  await assertSite(db, businessId, q.siteId);
  // One after another: inside a save this runs on the transaction's one connection.
  const currency = (await db('businesses').where({ id: businessId }).first('currency')).currency as string;
  const closed = await isMonthClosed(db, businessId, monthOf(q.soldOn));
  const lines = await db('sales_lines as sl')
    .join('drink_sizes as ds', 'ds.id', 'sl.drink_size_id')
    .join('drinks as d', 'd.id', 'ds.drink_id')
    .join('cup_sizes as cs', 'cs.id', 'ds.size_id')
    .where({ 'sl.business_id': businessId, 'sl.site_id': q.siteId, 'sl.sold_on': q.soldOn })
    .whereNull('sl.import_id')
    .orderBy('sl.id')
    .select('sl.drink_size_id', 'sl.quantity', 'sl.net_sales', 'sl.tax', 'd.name as drink', 'cs.name as size');
  const imported = await db('sales_lines').where({ business_id: businessId, site_id: q.siteId, sold_on: q.soldOn }).whereNotNull('import_id').count<{ n: string }[]>('* as n');
  return {
    siteId: q.siteId,
    soldOn: q.soldOn,
    closed,
    currency,
    lines: lines.map((l) => ({
      drinkSizeId: l.drink_size_id as string,
      label: `${l.drink} (${l.size})`,
      quantity: qty(l.quantity) as string,
      netSales: writeMoney(l.net_sales, currency),
      tax: l.tax === null ? null : writeMoney(l.tax, currency),
    })),
    importedLines: Number(imported[0].n),
  };
}

/**
 * A day's sales typed in by hand (when there is no till file): replaces that day's hand-entered
 * lines, and answers with the day as `manualDay` reads it and how many lines were replaced.
 */
export async function saveManualDay(db: Knex, businessId: string, input: z.infer<typeof manualDaySchema>) {
  return db.transaction(async (trx) => {
    await assertSite(trx, businessId, input.siteId);
    await assertMonthOpen(trx, businessId, input.soldOn);
    const ids = [...new Set(input.lines.map((l) => l.drinkSizeId))];
    const valid = await trx('drink_sizes').where({ business_id: businessId }).whereIn('id', ids).count<{ n: string }[]>('* as n');
    if (Number(valid[0].n) !== ids.length) throw notFound('That drink size');
    const replaced = await trx('sales_lines').where({ business_id: businessId, site_id: input.siteId, sold_on: input.soldOn }).whereNull('import_id').del();
    if (input.lines.length) {
      await trx('sales_lines').insert(input.lines.map((l) => ({ business_id: businessId, site_id: input.siteId, sold_on: input.soldOn, drink_size_id: l.drinkSizeId, quantity: l.quantity, net_sales: l.netSales, tax: l.tax ?? null })));
    }
    return { ...(await manualDay(trx, businessId, { siteId: input.siteId, soldOn: input.soldOn })), replaced };
  });
}

/** Each day of a month at a site: cups and net sales, from till files and typed in. */
export async function salesDays(db: Knex, businessId: string, q: z.infer<typeof salesDaysQuery>) {
  await assertSite(db, businessId, q.siteId);
  const { first, last } = monthBounds(q.month);
  const currency = (await db('businesses').where({ id: businessId }).first('currency')).currency as string;
  const rows = await db('sales_lines')
    .where({ business_id: businessId, site_id: q.siteId })
    .whereBetween('sold_on', [first, last])
    .groupBy('sold_on')
    .orderBy('sold_on')
    .select('sold_on', db.raw('sum(quantity) as cups'), db.raw('sum(net_sales) as net'), db.raw('count(*) filter (where import_id is null)::int as manual'), db.raw('count(*) filter (where import_id is not null)::int as imported'));
  return {
    month: q.month,
    currency,
    days: rows.map((r) => ({ day: r.sold_on as string, cups: qty(r.cups), netSales: writeMoney(r.net, currency), manualLines: r.manual as number, importedLines: r.imported as number })),
  };
}

