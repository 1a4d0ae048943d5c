import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Response } from 'express';
import { stringify } from 'csv-stringify';
import { neutraliseCsvCell } from '../../src/shared/books';

export interface CsvColumn {
  key: string;
  header: string;
}

export type CsvRecord = Record<string, string | null>;

/** A file name part from a site name: "North Street" → "north-street". */
export function slug(name: string): string {
  return name.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'site';
}

/**
 * Streams records as a CSV download through csv-stringify: a header row, a UTF-8 byte-order
 * mark (spreadsheets then read £ and € right), and every text cell neutralised against formula
 * injection (OWASP) while plain numbers stay numbers. Backpressure is honoured end to end, so
 * memory stays flat however many records the source yields.
 */
export async function sendCsv(res: Response, filename: string, columns: CsvColumn[], records: Iterable<CsvRecord> | AsyncIterable<CsvRecord>): Promise<void> {
  res.status(200);
  res.setHeader('content-type', 'text/csv; charset=utf-8');
  res.setHeader('content-disposition', `attachment; filename="${filename}"`);
  res.setHeader('cache-control', 'no-store');
  const stringifier = stringify({
    header: true,
    bom: true,
    columns: columns.map((c) => ({ key: c.key, header: c.header })),
    cast: { string: (value) => neutraliseCsvCell(value) },
  });
  await pipeline(Readable.from(records, { objectMode: true }), stringifier, res);
}

/**
 * Reads a query page by page in key order (keyset pagination: no OFFSET, no cursor package),
 * yielding rows one at a time: memory holds one page whatever the size of the result.
 */
export async function* pages<T>(fetchPage: (after: T | null) => Promise<T[]>, pageSize: number): AsyncGenerator<T> {
  let after: T | null = null;
  for (;;) {
    const page = await fetchPage(after);
    for (const row of page) yield row;
    if (page.length < pageSize) return;
    after = page[page.length - 1];
  }
}
