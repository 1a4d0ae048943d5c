import type { ImportPreview, ManualDay, SalesDay, SalesImport } from '../../src/shared/contract/books';
import { writeMoney } from '../../src/shared/money';
import { money, qty } from '../platform/present';
import type { ImportRow, dayTotals, manualLines } from './sales.repo';
import type { DrinkSizeChoice, TillPreview } from './till-types';

export function presentImport(r: ImportRow): SalesImport {
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

export function presentPreview(p: TillPreview, currency: string, choices: readonly DrinkSizeChoice[]): ImportPreview {
  return {
    ...p,
    netSales: writeMoney(p.netSales, currency),
    currency,
    items: p.items.map((i) => ({ ...i, quantity: qty(i.quantity) as string })),
    drinkSizes: choices.map((c) => ({ id: c.id, label: c.label })),
  };
}

export function presentManualDay(
  siteId: string,
  soldOn: string,
  closed: boolean,
  currency: string,
  lines: Awaited<ReturnType<typeof manualLines>>,
  importedLines: number,
): ManualDay {
  return {
    siteId,
    soldOn,
    closed,
    currency,
    lines: lines.map((l) => ({
      drinkSizeId: l.drink_size_id,
      label: `${l.drink} (${l.size})`,
      quantity: qty(l.quantity) as string,
      netSales: writeMoney(l.net_sales, currency),
      tax: money(l.tax, currency),
    })),
    importedLines,
  };
}

export function presentDays(rows: Awaited<ReturnType<typeof dayTotals>>, currency: string): SalesDay[] {
  return rows.map((r) => ({ day: r.sold_on, cups: qty(r.cups) as string, netSales: writeMoney(r.net, currency), manualLines: r.manual, importedLines: r.imported }));
}
