import { parse } from 'csv-parse/sync';
import { distance } from 'fastest-levenshtein';
import type { ColumnMapping } from '../../src/shared/contract/books';
import { isDecimalString } from '../../src/shared/decimal';
import { columnProblem, hasControlCharacters, isCalendarDate } from '../../src/shared/schemas/fields';

/**
 * Reading a till's CSV export: its columns, and its rows with line numbers. Pure (no I/O, no
 * HTTP errors), so the worker thread that reads large files runs the very same code.
 */

/** A file that cannot be read: `not_csv` for the whole file, `invalid_input` for a field of the mapping. */
export class TillFileError extends Error {
  constructor(readonly code: 'not_csv' | 'invalid_input', message: string, readonly field?: string) {
    super(message);
  }
}

export type { ColumnMapping };

/** Comma, semicolon or tab: whichever the header line uses most. */
function delimiterOf(text: string): string {
  const firstLine = text.slice(0, text.search(/\r?\n|$/));
  const counts = [',', ';', '\t'].map((d) => [d, firstLine.split(d).length] as const);
  return counts.sort((a, b) => b[1] - a[1])[0][0];
}

/** The header row and the first rows, for the column mapping step. */
export function readHeader(text: string): { headers: string[]; sample: string[][] } {
  let rows: string[][];
  try {
    rows = parse(text, { delimiter: delimiterOf(text), to_line: 6, relax_column_count: true, skip_empty_lines: true, trim: true });
  } catch (e) {
    throw new TillFileError('not_csv', `The file cannot be read as CSV: ${(e as Error).message}`);
  }
  const headers = rows[0] ?? [];
  if (headers.length < 4 || headers.some((h) => !h)) throw new TillFileError('not_csv', 'The first line must name the columns (date, item, quantity, net sales at least).');
  if (new Set(headers.map((h) => h.toLowerCase())).size !== headers.length) throw new TillFileError('not_csv', 'Two columns have the same name in the first line.');
  return { headers, sample: rows.slice(1) };
}

const GUESSES: Record<keyof Omit<ColumnMapping, 'dateFormat'>, RegExp> = {
  date: /date|day/i,
  item: /item|product|name|drink/i,
  size: /size|variant|option/i,
  quantity: /qty|quantity|count|sold|units/i,
  netSales: /net/i,
  tax: /tax|vat/i,
};

/** A first guess at the mapping from the column names (the owner confirms it). */
export function guessMapping(headers: string[]): Partial<ColumnMapping> {
  const out: Partial<ColumnMapping> = {};
  const used = new Set<string>();
  for (const [key, re] of Object.entries(GUESSES) as [keyof typeof GUESSES, RegExp][]) {
    const h = headers.find((x) => !used.has(x) && re.test(x));
    if (h) {
      out[key] = h;
      used.add(h);
    }
  }
  return out;
}

export interface TillRow {
  line: number;
  soldOn: string;
  item: string;
  size: string;
  quantity: string;
  netSales: string;
  tax: string | null;
}

export interface LineError {
  line: number;
  message: string;
}

function readDate(value: string, format: ColumnMapping['dateFormat']): string | null {
  let y: string, m: string, d: string;
  const iso = /^(\d{4})-(\d{1,2})-(\d{1,2})(?:[T ].*)?$/.exec(value);
  const slashed = /^(\d{1,2})[/.](\d{1,2})[/.](\d{4})(?: .*)?$/.exec(value);
  if (format === 'YYYY-MM-DD' && iso) [, y, m, d] = iso;
  else if (format === 'DD/MM/YYYY' && slashed) [, d, m, y] = slashed;
  else if (format === 'MM/DD/YYYY' && slashed) [, m, d, y] = slashed;
  else return null;
  const out = `${y}-${m.padStart(2, '0')}-${d.padStart(2, '0')}`;
  return isCalendarDate(out) ? out : null;
}

/**
 * A money or quantity cell as a plain decimal that its column stores exactly (numeric(14, 4):
 * at most 10 digits before the point and 4 after): a leading currency sign and thousands commas
 * are dropped.
 */
function readNumber(value: string): string | null {
  let v = value.replace(/^([-]?)\s*[£$€¥]\s*/, '$1').replace(/\s/g, '');
  if (/^-?\d{1,3}(,\d{3})+(\.\d+)?$/.test(v)) v = v.replaceAll(',', '');
  if (/^-?\.\d+$/.test(v)) v = v.replace('.', '0.');
  return isDecimalString(v) && columnProblem(v, 'money') === null ? v : null;
}

/**
 * Reads every row with the mapping. A row that cannot be read is reported with its line in the
 * file (1 = the header) and why; the others are returned. A file whose quoting is broken is
 * reported at the line where reading stopped.
 */
export function readRows(text: string, mapping: ColumnMapping, headers: string[]): { rows: TillRow[]; errors: LineError[] } {
  const missing = (['date', 'item', 'quantity', 'netSales', 'size', 'tax'] as const).filter((k) => mapping[k] && !headers.includes(mapping[k] as string));
  if (missing.length) throw new TillFileError('invalid_input', `The file has no column "${mapping[missing[0]]}".`, `columns.${missing[0]}`);
  const index = (h: string | null | undefined) => (h ? headers.indexOf(h) : -1);
  const at = { date: index(mapping.date), item: index(mapping.item), size: index(mapping.size), quantity: index(mapping.quantity), net: index(mapping.netSales), tax: index(mapping.tax) };
  const rows: TillRow[] = [];
  const errors: LineError[] = [];
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parse(text, { delimiter: delimiterOf(text), from_line: 2, info: true, relax_column_count: true, skip_empty_lines: true, trim: true }) as unknown as typeof records;
  } catch (e) {
    const err = e as Error & { lines?: number };
    return { rows: [], errors: [{ line: err.lines ?? 0, message: `The file cannot be read past this line: ${err.message}` }] };
  }
  for (const { record, info } of records) {
    const line = info.lines;
    const cell = (i: number) => (i >= 0 ? (record[i] ?? '') : '');
    const problems: string[] = [];
    const soldOn = readDate(cell(at.date), mapping.dateFormat);
    if (!soldOn) problems.push(`the date "${cell(at.date)}" is not a ${mapping.dateFormat} date`);
    const item = cell(at.item);
    if (!item) problems.push('the item is empty');
    else if (hasControlCharacters(item, false) || hasControlCharacters(cell(at.size), false)) problems.push('the item or size holds control characters (such as a text-direction mark)');
    const quantity = readNumber(cell(at.quantity));
    if (quantity === null) problems.push(`the quantity "${cell(at.quantity)}" is not a number`);
    const net = readNumber(cell(at.net));
    if (net === null) problems.push(`the net sales "${cell(at.net)}" is not an amount`);
    let tax: string | null = null;
    if (at.tax >= 0 && cell(at.tax) !== '') {
      tax = readNumber(cell(at.tax));
      if (tax === null) problems.push(`the tax "${cell(at.tax)}" is not an amount`);
    }
    if (problems.length) errors.push({ line, message: `Line ${line}: ${problems.join('; ')}.` });
    else rows.push({ line, soldOn: soldOn as string, item, size: cell(at.size), quantity: quantity as string, netSales: net as string, tax });
  }
  return { rows, errors };
}

const norm = (s: string) => s.toLowerCase().replace(/[^a-z0-9]+/g, ' ').trim();

/** Similarity in [0, 1] by Levenshtein distance over the longer length (1 = the same words). */
export function similarity(a: string, b: string): number {
  const x = norm(a);
  const y = norm(b);
  const longest = Math.max(x.length, y.length);
  return longest === 0 ? 1 : 1 - distance(x, y) / longest;
}
