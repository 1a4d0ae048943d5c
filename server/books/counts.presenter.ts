import { D, dec } from '../../src/shared/decimal';
import { writeMoney } from '../../src/shared/money';
import type { CountSheet, SheetItem, StockCount } from '../../src/shared/contract/books';
import { qty } from '../platform/present';
import type { Audience } from './audience';
import type { CountRow, CountTotals, SheetRow } from './counts.repo';

/**
 * A count as the API answers it. Its value (packs × price) goes only to an audience that reads
 * costs; a barista's answer has no such field at all.
 */
export function presentCount(c: CountRow, totals: CountTotals | undefined, audience: Audience): StockCount {
  const out: StockCount = {
    id: c.id,
    siteId: c.site_id,
    siteName: c.site_name,
    countDate: c.count_date,
    status: c.status,
    finishedAt: c.finished_at ? new Date(c.finished_at).toISOString() : null,
    startedBy: c.started_by,
    finishedBy: c.finished_by,
    lineCount: totals?.lines ?? 0,
  };
  if (audience.currency !== null) out.value = writeMoney(totals?.value ?? '0', audience.currency);
  return out;
}

/** The sheet by storage area (in the order the rows come), with prices and values only for an audience that reads costs. */
export function presentSheet(count: CountRow, rows: readonly SheetRow[], audience: Audience, currency: string): CountSheet {
  const areas: CountSheet['areas'] = [];
  let total = new D(0);
  let counted = 0;
  for (const r of rows) {
    let area = areas.find((a) => a.id === r.area_id);
    if (!area) areas.push((area = { id: r.area_id, name: r.area_name ?? 'Not in an area', items: [] }));
    if (r.packs !== null) counted++;
    const item: SheetItem = {
      packId: r.pack_id,
      ingredient: r.ingredient_name,
      category: r.category,
      description: r.description,
      pack: { count: qty(r.count) as string, quantity: qty(r.quantity) as string, unit: r.unit },
      baseUnit: r.base_unit,
      packs: qty(r.packs),
    };
    if (audience.currency !== null) {
      const price = r.frozen_price ?? r.price;
      const value = r.packs !== null && price !== null ? dec(r.packs).times(dec(price)) : null;
      if (value) total = total.plus(value);
      item.price = price === null ? null : writeMoney(price, audience.currency);
      item.value = value ? writeMoney(value, audience.currency) : null;
    }
    area.items.push(item);
  }
  return { count: presentCount(count, { lines: counted, value: total.toFixed() }, audience), currency, areas };
}
