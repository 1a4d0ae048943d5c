import type { Knex } from 'knex';
import type { ColumnMapping } from '../../src/shared/contract/books';
import type { DrinkSizeChoice } from './till-types';

// Plain rows for till sales: imports, their pending files, their lines and the mappings remembered.

export interface ImportRow {
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

const importQuery = (db: Knex, businessId: string) =>
  db('sales_imports as i').leftJoin('users as u', 'u.id', 'i.created_by').where('i.business_id', businessId)
    .select('i.id', 'i.site_id', 'i.file_sha256', 'i.filename', 'i.row_count', 'i.status', 'i.first_day', 'i.last_day', 'i.created_at', 'i.accepted_at', 'u.name as created_by');

export async function findImport(db: Knex, businessId: string, id: string): Promise<ImportRow> {
  return importQuery(db, businessId).where('i.id', id).first();
}

export async function listImportRows(db: Knex, businessId: string, siteId: string | null): Promise<ImportRow[]> {
  return importQuery(db, businessId).modify((q) => (siteId ? q.where('i.site_id', siteId) : q)).orderBy('i.created_at', 'desc').limit(100);
}

/** An accepted import of the site that already holds the same file (by its bytes) or the same rows (by their fingerprint). */
export async function acceptedRepeat(db: Knex, businessId: string, siteId: string, match: { sha256?: string; rowsSha256?: string | null }): Promise<{ filename: string; accepted_at: Date } | undefined> {
  if (!match.sha256 && !match.rowsSha256) return undefined;
  return db('sales_imports')
    .where({ business_id: businessId, site_id: siteId, status: 'accepted' })
    .where((q) => {
      if (match.sha256) q.orWhere('file_sha256', match.sha256);
      if (match.rowsSha256) q.orWhere('rows_sha256', match.rowsSha256);
    })
    .orderBy('accepted_at')
    .first('filename', 'accepted_at');
}

export async function rememberedColumns(db: Knex, businessId: string): Promise<ColumnMapping | undefined> {
  return (await db('till_column_mappings').where({ business_id: businessId }).first('mapping'))?.mapping as ColumnMapping | undefined;
}

export async function insertPendingImport(trx: Knex.Transaction, businessId: string, siteId: string, sha256: string, filename: string, userId: string, text: string): Promise<string> {
  const [row] = await trx('sales_imports').insert({ business_id: businessId, site_id: siteId, file_sha256: sha256, filename, created_by: userId }).returning('id');
  await trx('sales_import_files').insert({ import_id: row.id, content: text });
  return row.id as string;
}

export async function lockImport(db: Knex, businessId: string, id: string, lock: boolean): Promise<{ id: string; site_id: string; status: ImportRow['status']; file_sha256: string; first_day: string | null; last_day: string | null } | undefined> {
  const q = db('sales_imports').where({ id, business_id: businessId });
  if (lock) q.forUpdate();
  return q.first('id', 'site_id', 'status', 'file_sha256', 'first_day', 'last_day');
}

/** Characters of a pending file read per query: a few milliseconds of work on the event loop each. */
const SLICE = 512 * 1024;

/**
 * A pending file's text in slices (one query each), so a 10 MB file never arrives as one
 * message the event loop must take in at once; undefined when the file is gone.
 */
export async function pendingTextSlices(db: Knex, importId: string): Promise<string[] | undefined> {
  const row = await db('sales_import_files').where({ import_id: importId }).first(db.raw('length(content)::int as n'));
  if (!row) return undefined;
  const parts: string[] = [];
  for (let from = 1; from <= Math.max(row.n as number, 1); from += SLICE) {
    const slice = await db('sales_import_files').where({ import_id: importId }).first(db.raw('substr(content, ?, ?) as part', [from, SLICE]));
    parts.push(slice.part as string);
  }
  return parts;
}

/** The business's live drink sizes, by drink and cup size. */
export async function drinkSizeChoices(db: Knex, businessId: string): Promise<DrinkSizeChoice[]> {
  const rows = await db('drink_sizes as ds').join('drinks as d', 'd.id', 'ds.drink_id').join('cup_sizes as cs', 'cs.id', 'ds.size_id')
    .where('ds.business_id', businessId).whereNull('d.archived_at').orderBy([{ column: 'd.name' }, { column: 'cs.position' }])
    .select('ds.id', 'd.name as drink', 'cs.name as size');
  return rows.map((r: { id: string; drink: string; size: string }) => ({ id: r.id, drink: r.drink, size: r.size, label: `${r.drink} (${r.size})` }));
}

/** Till item → drink size remembered by the business, as [item, size, drinkSizeId]. */
export async function itemMappings(db: Knex, businessId: string): Promise<[string, string, string][]> {
  const rows = await db('till_item_mappings').where({ business_id: businessId }).select('till_item', 'till_size', 'drink_size_id');
  return rows.map((m: { till_item: string; till_size: string; drink_size_id: string }) => [m.till_item, m.till_size, m.drink_size_id]);
}

export interface NewSalesLine {
  business_id: string;
  site_id: string;
  import_id?: string;
  sold_on: string;
  drink_size_id: string;
  quantity: string;
  net_sales: string;
  tax: string | null;
}

const INSERT_BATCH = 1000;

export async function insertSalesLines(trx: Knex, lines: readonly NewSalesLine[]): Promise<void> {
  for (let i = 0; i < lines.length; i += INSERT_BATCH) await trx('sales_lines').insert(lines.slice(i, i + INSERT_BATCH));
}

export async function rememberItemMapping(trx: Knex, businessId: string, tillItem: string, tillSize: string, drinkSizeId: string): Promise<void> {
  await trx.raw(
    `insert into till_item_mappings (business_id, till_item, till_size, drink_size_id) values (?, ?, ?, ?)
     on conflict (business_id, lower(till_item), lower(till_size)) do update set drink_size_id = excluded.drink_size_id`,
    [businessId, tillItem, tillSize, drinkSizeId],
  );
}

export async function rememberColumns(trx: Knex, businessId: string, columns: ColumnMapping): Promise<void> {
  await trx('till_column_mappings')
    .insert({ business_id: businessId, mapping: JSON.stringify(columns) })
    .onConflict('business_id')
    .merge({ mapping: JSON.stringify(columns), updated_at: trx.fn.now() });
}

export async function markAccepted(trx: Knex, id: string, values: { rowCount: number; firstDay: string; lastDay: string; columns: ColumnMapping; rowsSha256: string | null }): Promise<void> {
  await trx('sales_imports').where({ id }).update({
    status: 'accepted', accepted_at: trx.fn.now(), row_count: values.rowCount, first_day: values.firstDay, last_day: values.lastDay,
    mapping: JSON.stringify(values.columns), rows_sha256: values.rowsSha256,
  });
  await trx('sales_import_files').where({ import_id: id }).del();
}

export async function markDiscarded(trx: Knex, id: string, deleteLines: boolean): Promise<void> {
  if (deleteLines) await trx('sales_lines').where({ import_id: id }).del();
  await trx('sales_import_files').where({ import_id: id }).del();
  await trx('sales_imports').where({ id }).update({ status: 'discarded' });
}

/** A day's hand-entered lines at a site (in the order saved), with the drink and size names. */
export async function manualLines(db: Knex, businessId: string, siteId: string, soldOn: string) {
  return db('sales_lines as sl')
    .join('drink_sizes as ds', 'ds.id', 'sl.drink_size_id')
    .join('drinks as d', 'd.id', 'ds.drink_id')
    .join('cup_sizes as cs', 'cs.id', 'ds.size_id')
    .where({ 'sl.business_id': businessId, 'sl.site_id': siteId, 'sl.sold_on': soldOn })
    .whereNull('sl.import_id')
    .orderBy('sl.id')
    .select('sl.drink_size_id', 'sl.quantity', 'sl.net_sales', 'sl.tax', 'd.name as drink', 'cs.name as size') as Promise<{ drink_size_id: string; quantity: string; net_sales: string; tax: string | null; drink: string; size: string }[]>;
}

export async function importedLineCount(db: Knex, businessId: string, siteId: string, soldOn: string): Promise<number> {
  const r = await db('sales_lines').where({ business_id: businessId, site_id: siteId, sold_on: soldOn }).whereNotNull('import_id').count<{ n: string }[]>('* as n');
  return Number(r[0].n);
}

export async function deleteManualLines(trx: Knex, businessId: string, siteId: string, soldOn: string): Promise<number> {
  return trx('sales_lines').where({ business_id: businessId, site_id: siteId, sold_on: soldOn }).whereNull('import_id').del();
}

/** Each day of a range at a site: cups, net sales and how many lines were typed in or imported. */
export async function dayTotals(db: Knex, businessId: string, siteId: string, first: string, last: string) {
  return db('sales_lines')
    .where({ business_id: businessId, site_id: siteId })
    .whereBetween('sold_on', [first, last])
    .groupBy('sold_on')
    .orderBy('sold_on')
    .select('sold_on', db.raw('sum(quantity) as cups'), db.raw('sum(net_sales) as net'), db.raw('count(*) filter (where import_id is null)::int as manual'), db.raw('count(*) filter (where import_id is not null)::int as imported')) as Promise<{ sold_on: string; cups: string; net: string; manual: number; imported: number }[]>;
}
