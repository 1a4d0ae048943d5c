import { createHash } from 'node:crypto';
import { D, dec, type Dec } from '../../src/shared/decimal';
import { importPreviewSchema, type ColumnMapping } from '../../src/shared/contract/books';
import { zodFieldErrors } from '../../src/shared/schemas/field-errors';
import { presentPreview } from './sales.presenter';
import { readHeader, readRows, similarity, TillFileError, type LineError, type TillRow } from './till-csv';
import type { DrinkSizeChoice, ItemSummary } from './till-types';

/**
 * The CPU-heavy part of a till import: reading every row of the file, grouping the till's items,
 * suggesting a drink for each and fingerprinting the rows. It runs in a worker thread (see
 * till-pool.ts), so a large file never holds up the server's event loop; it is plain data in,
 * plain data out.
 */

export interface TillTaskInput {
  /** The file's text, in the slices it was read in. */
  textParts: string[];
  columns: ColumnMapping;
  /** What to answer besides the rows' fingerprint: the preview, the rows themselves, or nothing more. */
  want: 'preview' | 'rows' | 'fingerprint';
  /** Till item → drink size remembered by the business: [item, size, drinkSizeId]. */
  known?: [string, string, string][];
  choices?: DrinkSizeChoice[];
  /** For a preview: the business's currency, and whether to check the answer against the contract (tests, development). */
  currency?: string;
  checkResponse?: boolean;
}

export type TillTaskResult =
  | {
      ok: true;
      fingerprint: string | null;
      errorCount: number;
      errors: LineError[];
      firstDay: string | null;
      lastDay: string | null;
      /** A preview's answer, presented and written as JSON here, off the event loop (thousands of items take a while). */
      previewJson?: string;
      rows?: TillRow[];
    }
  | { ok: false; code: 'not_csv' | 'invalid_input'; message: string; field?: string };

/** Errors listed in a preview: enough to fix a file, never a megabyte of them. */
export const ERRORS_SHOWN = 200;

/** The key of a till item: its name and size, whatever their case. */
export const itemKey = (item: string, size: string) => `${item.normalize('NFC').toLowerCase()}\u0000${size.normalize('NFC').toLowerCase()}`;

/**
 * What identifies a till file's sales whatever its bytes: each row as (day, item, size,
 * quantity, net sales), written canonically (an ISO day, the item's key, decimals without
 * trailing zeros), sorted, and hashed with SHA-256. The same sales exported with other line
 * endings, in another row order, with another date format or with "3.00" for "3" give the same
 * fingerprint; the site is the import's own. Null for a file with no readable rows.
 */
export function rowsFingerprint(rows: readonly TillRow[]): string | null {
  if (!rows.length) return null;
  const lines = rows.map((r) => JSON.stringify([r.soldOn, itemKey(r.item, r.size), dec(r.quantity).toFixed(), dec(r.netSales).toFixed()]));
  lines.sort();
  const hash = createHash('sha256');
  for (const l of lines) hash.update(l).update('\n');
  return hash.digest('hex');
}

function daysOf(rows: readonly TillRow[]) {
  let first: string | null = null;
  let last: string | null = null;
  for (const r of rows) {
    if (!first || r.soldOn < first) first = r.soldOn;
    if (!last || r.soldOn > last) last = r.soldOn;
  }
  return { first, last };
}

/** The till's distinct items with their remembered drink size, or the closest by name. */
function summariseItems(rows: readonly TillRow[], known: [string, string, string][], choices: DrinkSizeChoice[]): ItemSummary[] {
  const groups = new Map<string, { tillItem: string; tillSize: string; rows: number; quantity: Dec; net: Dec }>();
  for (const r of rows) {
    const k = itemKey(r.item, r.size);
    let g = groups.get(k);
    if (!g) groups.set(k, (g = { tillItem: r.item, tillSize: r.size, rows: 0, quantity: new D(0), net: new D(0) }));
    g.rows++;
    g.quantity = g.quantity.plus(dec(r.quantity));
    g.net = g.net.plus(dec(r.netSales));
  }
  const remembered = new Map(known.map(([item, size, id]) => [itemKey(item, size), id]));
  const live = new Set(choices.map((c) => c.id));
  return [...groups.values()].map((g) => {
    const mapped = remembered.get(itemKey(g.tillItem, g.tillSize));
    const name = `${g.tillItem} ${g.tillSize}`;
    const suggestions = choices
      .map((c) => ({ drinkSizeId: c.id, label: c.label, score: Math.max(similarity(name, `${c.drink} ${c.size}`), (similarity(g.tillItem, c.drink) + (g.tillSize ? similarity(g.tillSize, c.size) : 0.5)) / 2) }))
      .sort((a, b) => b.score - a.score)
      .slice(0, 3)
      .map((s) => ({ ...s, score: Math.round(s.score * 100) / 100 }));
    const isLive = Boolean(mapped && live.has(mapped));
    return {
      tillItem: g.tillItem,
      tillSize: g.tillSize,
      rows: g.rows,
      quantity: g.quantity.toFixed(),
      netSales: g.net.toFixed(),
      drinkSizeId: isLive ? (mapped as string) : null,
      remembered: isLive,
      suggestions,
    };
  });
}

export function runTillTask(input: TillTaskInput): TillTaskResult {
  try {
    const text = input.textParts.join('');
    const { headers } = readHeader(text);
    const { rows, errors } = readRows(text, input.columns, headers);
    const { first, last } = daysOf(rows);
    const base = { ok: true as const, fingerprint: errors.length ? null : rowsFingerprint(rows), errorCount: errors.length, errors: errors.slice(0, ERRORS_SHOWN), firstDay: first, lastDay: last };
    if (input.want === 'fingerprint') return base;
    if (input.want === 'rows') return { ...base, rows };
    let net = new D(0);
    for (const r of rows) net = net.plus(dec(r.netSales));
    const choices = input.choices ?? [];
    const items = summariseItems(rows, input.known ?? [], choices);
    const preview = presentPreview({ rowCount: rows.length, errorCount: errors.length, errors: base.errors, firstDay: first, lastDay: last, netSales: net.toFixed(), items }, input.currency ?? 'GBP', choices);
    if (input.checkResponse) {
      const checked = importPreviewSchema.safeParse(preview);
      if (!checked.success) throw new Error(`the import preview answered outside its contract: ${JSON.stringify(zodFieldErrors(checked.error))}`);
    }
    return { ...base, previewJson: JSON.stringify(preview) };
  } catch (e) {
    if (e instanceof TillFileError) return { ok: false, code: e.code, message: e.message, field: e.field };
    throw e;
  }
}
