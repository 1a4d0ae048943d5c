import type { z } from 'zod';
import type { Role } from '../../src/shared/capabilities';
import type { countInSchema, countLineSchema, CountSheet, StockCount } from '../../src/shared/contract/books';
import { dec } from '../../src/shared/decimal';
import { conversionFactor, UnitConversionError } from '../../src/shared/units';
import type { AppDeps } from '../platform/deps';
import { conflict, invalidInput, notFound } from '../platform/errors';
import { audienceOf } from './audience';
import { currencyOf } from './books.repo';
import { presentCount, presentSheet } from './counts.presenter';
import { countTotals, deleteCountRow, findCountRow, findPack, insertCount, listCountRows, markFinished, sheetRows, upsertCountLine, type CountedPack } from './counts.repo';
import { assertMonthOpen } from './periods.service';
import { siteFromInput } from './sites';

type Reader = { role: Role; businessId: string };
type Writer = Reader & { id: string };

export async function listCounts({ db }: AppDeps, user: Reader, siteId: string | undefined): Promise<{ counts: StockCount[]; currency: string }> {
  if (siteId) await siteFromInput(db, user.businessId, siteId);
  const rows = await listCountRows(db, user.businessId, siteId ?? null);
  const [totals, audience, currency] = await Promise.all([countTotals(db, rows.map((r) => r.id)), audienceOf(db, user), currencyOf(db, user.businessId)]);
  return { counts: rows.map((r) => presentCount(r, totals.get(r.id), audience)), currency };
}

export async function startCount({ db }: AppDeps, user: Writer, input: z.output<typeof countInSchema>): Promise<StockCount> {
  const audience = await audienceOf(db, user);
  return db.transaction(async (trx) => {
    await siteFromInput(trx, user.businessId, input.siteId);
    await assertMonthOpen(trx, user.businessId, input.countDate);
    const id = await insertCount(trx, user.businessId, input.siteId, input.countDate, user.id);
    return presentCount((await findCountRow(trx, user.businessId, id))!, undefined, audience);
  });
}

async function countOf(db: AppDeps['db'], businessId: string, id: string, lock = false) {
  const count = await findCountRow(db, businessId, id, lock);
  if (!count) throw notFound('That count');
  return count;
}

export async function getCountSheet({ db }: AppDeps, user: Reader, id: string): Promise<CountSheet> {
  const count = await countOf(db, user.businessId, id);
  const [rows, audience, currency] = await Promise.all([sheetRows(db, user.businessId, count), audienceOf(db, user), currencyOf(db, user.businessId)]);
  return presentSheet(count, rows, audience, currency);
}

/** Most packs a line can hold: numeric(14, 6) keeps 8 digits before the point. */
const MAX_PACKS = dec('100000000');

/** Whole packs plus an amount on hand turned into packs of the pack's size. */
function packsCounted(pack: CountedPack, input: z.output<typeof countLineSchema>): string {
  let packs = dec(input.packs ?? '0');
  if (input.quantity !== undefined && input.unit !== undefined) {
    try {
      const density = pack.density_g_per_ml === null ? null : dec(pack.density_g_per_ml);
      const inBase = dec(input.quantity).times(conversionFactor(input.unit, pack.base_unit, density));
      const packBase = dec(pack.count).times(dec(pack.quantity)).times(conversionFactor(pack.unit, pack.base_unit, density));
      packs = packs.plus(inBase.div(packBase));
    } catch (e) {
      if (e instanceof UnitConversionError) throw invalidInput({ unit: e.message });
      throw e;
    }
  }
  packs = packs.toDecimalPlaces(6);
  if (packs.gte(MAX_PACKS)) throw invalidInput({ [input.quantity !== undefined ? 'quantity' : 'packs']: 'That is more packs than a count can hold.' });
  return packs.toFixed();
}

/** Saves one pack's count (saved as you go). Refused on a finished count or in a closed month. */
export async function saveCountLine({ db }: AppDeps, user: Writer, id: string, packId: string, input: z.output<typeof countLineSchema>): Promise<{ packId: string; packs: string }> {
  return db.transaction(async (trx) => {
    const count = await countOf(trx, user.businessId, id, true);
    if (count.status === 'finished') throw conflict('count_finished', 'This count is finished and can no longer change.');
    await assertMonthOpen(trx, user.businessId, count.count_date);
    const pack = await findPack(trx, user.businessId, packId);
    if (!pack) throw notFound('That pack');
    const packs = packsCounted(pack, input);
    await upsertCountLine(trx, user.businessId, count, packId, packs, user.id);
    return { packId, packs: dec(packs).toFixed() };
  });
}

export async function finishCount({ db }: AppDeps, user: Writer, id: string): Promise<StockCount> {
  const audience = await audienceOf(db, user);
  return db.transaction(async (trx) => {
    const count = await countOf(trx, user.businessId, id, true);
    if (count.status === 'finished') throw conflict('count_finished', 'This count is already finished.');
    await assertMonthOpen(trx, user.businessId, count.count_date);
    await markFinished(trx, id, user.id);
    const totals = await countTotals(trx, [id]);
    return presentCount(await countOf(trx, user.businessId, id), totals.get(id), audience);
  });
}

export async function deleteCount({ db }: AppDeps, businessId: string, id: string): Promise<void> {
  await db.transaction(async (trx) => {
    const count = await countOf(trx, businessId, id, true);
    await assertMonthOpen(trx, businessId, count.count_date);
    await deleteCountRow(trx, id);
  });
}
