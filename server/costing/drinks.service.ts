import type { Knex } from 'knex';
import { z } from 'zod';
import { rules } from '../../src/shared/checks';
import { dec } from '../../src/shared/decimal';
import { writeMoney } from '../../src/shared/money';
import { invalidInput, notFound } from '../platform/errors';
import { foldDuePrices } from '../repricing/schedule.repo';
import { loadMenuRows } from './cost-model.repo';
import { checkLines, lineColumns, lineInSchema, presentLine, throwIfFields } from './lines';
import { decimalString, name, optionalText, today } from './shared';
import { groupBy } from '../../src/shared/collections';
import { guardWrite } from '../platform/db-errors';
import { qty } from '../platform/present';

export const drinkInSchema = z.object({
  name: name('drink'),
  category: z.string({ error: 'Choose a category.' }).trim().min(1, 'Choose a category.').max(60),
  temperature: z.enum(['hot', 'iced'], { error: 'Choose hot or iced.' }),
  notes: optionalText(),
  expectedWeeklyCups: z.number().int().min(0).max(1_000_000).nullish(),
  sizes: z
    .array(z.object({ sizeId: z.uuid('Choose a cup size.'), currentPrice: decimalString(rules.positive).nullish(), lines: z.array(lineInSchema).max(200) }))
    .min(1, 'Offer at least one cup size.')
    .max(20),
});
export type DrinkIn = z.output<typeof drinkInSchema>;
export const copyBuildSchema = z.object({ fromSizeId: z.uuid('Choose a cup size.'), toSizeId: z.uuid('Choose a cup size.') });

export async function getDrink(db: Knex, businessId: string, id: string) {
  const drink = await db('drinks').where({ business_id: businessId, id }).whereNull('archived_at').first('id', 'name', 'category', 'temperature', 'notes', 'expected_weekly_cups');
  if (!drink) throw notFound('That drink');
  const [{ sizes, lines }, business, items, measures] = await Promise.all([
    loadMenuRows(db, businessId, id),
    db('businesses').where({ id: businessId }).first('currency'),
    db.raw(
      `select id, name from ingredients where id in (select ingredient_id from build_lines bl join drink_sizes ds on ds.id = bl.drink_size_id where ds.drink_id = :id)
       union all select id, name from preparations where id in (select preparation_id from build_lines bl join drink_sizes ds on ds.id = bl.drink_size_id where ds.drink_id = :id)`,
      { id },
    ),
    db('measures as m').join('build_lines as bl', 'bl.measure_id', 'm.id').join('drink_sizes as ds', 'ds.id', 'bl.drink_size_id').where('ds.drink_id', id).distinct('m.id', 'm.name'),
  ]);
  const itemNames = new Map<string, string>(items.rows.map((r: { id: string; name: string }) => [r.id, r.name]));
  const measureNames = new Map<string, string>(measures.map((m: { id: string; name: string }) => [m.id, m.name]));
  const names = { itemName: (i: string) => itemNames.get(i) ?? '', measureName: (m: string) => measureNames.get(m) ?? null };
  const bySize = groupBy(lines, (l) => l.drink_size_id);
  return {
    drink: {
      id: drink.id,
      name: drink.name,
      category: drink.category,
      temperature: drink.temperature,
      notes: drink.notes,
      expectedWeeklyCups: drink.expected_weekly_cups,
      sizes: sizes.map((s) => ({
        id: s.id,
        sizeId: s.size_id,
        name: s.size_name,
        volumeMl: qty(s.volume_ml),
        currentPrice: s.price === null ? null : writeMoney(s.price, business.currency),
        priceVersion: s.price_version,
        lines: (bySize.get(s.id) ?? []).map((l) => presentLine(l, names)),
      })),
    },
  };
}

export async function listDrinks(db: Knex, businessId: string) {
  const [{ drinks, sizes }, business] = await Promise.all([loadMenuRows(db, businessId), db('businesses').where({ id: businessId }).first('currency')]);
  const byDrink = groupBy(sizes, (s) => s.drink_id);
  return {
    drinks: drinks.map((d) => ({
      ...d,
      sizes: (byDrink.get(d.id) ?? []).map((s) => ({ sizeId: s.size_id, name: s.size_name, currentPrice: s.price === null ? null : writeMoney(s.price, business.currency) })),
    })),
  };
}

async function validate(db: Knex, businessId: string, input: DrinkIn) {
  const fields: Record<string, string> = {};
  const sizeIds = input.sizes.map((s) => s.sizeId);
  const known = new Set((await db('cup_sizes').where({ business_id: businessId }).whereIn('id', sizeIds).select('id')).map((r) => r.id as string));
  const seen = new Set<string>();
  input.sizes.forEach((s, i) => {
    if (!known.has(s.sizeId)) fields[`sizes[${i}].sizeId`] = 'That cup size was not found.';
    else if (seen.has(s.sizeId)) fields[`sizes[${i}].sizeId`] = 'This cup size is listed twice.';
    seen.add(s.sizeId);
  });
  for (const [i, s] of input.sizes.entries()) Object.assign(fields, await checkLines(db, businessId, s.lines, (j) => `sizes[${i}].lines[${j}]`));
  throwIfFields(fields);
}

/** Writes the whole drink (its row, sizes, build lines, price changes) inside `trx`. */
async function writeDrink(trx: Knex, businessId: string, userId: string, drinkId: string, input: DrinkIn) {
  const existing = await trx('drink_sizes').where({ business_id: businessId, drink_id: drinkId }).forUpdate().select('id', 'size_id', 'price');
  await foldDuePrices(trx, businessId, existing); // planned menu prices now due go in first (repricing)
  const bySize = new Map(existing.map((e) => [e.size_id as string, e]));
  const keep = new Set(input.sizes.map((s) => s.sizeId));
  const gone = existing.filter((e) => !keep.has(e.size_id)).map((e) => e.id);
  if (gone.length) await trx('drink_sizes').whereIn('id', gone).delete();
  for (const s of input.sizes) {
    const price = s.currentPrice ?? null;
    const old = bySize.get(s.sizeId);
    let dsId: string;
    if (old) {
      dsId = old.id;
      const changed = (old.price === null) !== (price === null) || (old.price !== null && price !== null && !dec(old.price).eq(dec(price)));
      if (changed) {
        await trx('drink_sizes').where({ id: dsId }).update({ price, price_version: trx.raw('price_version + 1'), updated_at: trx.fn.now() });
        if (price !== null) {
          await trx('menu_price_history').insert({ business_id: businessId, drink_size_id: dsId, old_price: old.price, new_price: price, effective_from: today(), reason: 'Edited in the drink editor', changed_by: userId });
        }
      }
      await trx('build_lines').where({ business_id: businessId, drink_size_id: dsId }).delete();
    } else {
      const [row] = await trx('drink_sizes').insert({ business_id: businessId, drink_id: drinkId, size_id: s.sizeId, price }).returning('id');
      dsId = row.id;
      if (price !== null) {
        await trx('menu_price_history').insert({ business_id: businessId, drink_size_id: dsId, old_price: null, new_price: price, effective_from: today(), reason: 'First price', changed_by: userId });
      }
    }
    if (s.lines.length) await trx('build_lines').insert(s.lines.map((l, i) => ({ business_id: businessId, drink_size_id: dsId, ...lineColumns(l, i) })));
  }
}

function drinkColumns(input: DrinkIn) {
  return { name: input.name, category: input.category, temperature: input.temperature, notes: input.notes ?? null, expected_weekly_cups: input.expectedWeeklyCups ?? null };
}

export async function createDrink(db: Knex, businessId: string, userId: string, input: DrinkIn) {
  await validate(db, businessId, input);
  const id = await guardWrite('A drink', () =>
    db.transaction(async (trx) => {
      const [row] = await trx('drinks').insert({ business_id: businessId, ...drinkColumns(input) }).returning('id');
      await writeDrink(trx, businessId, userId, row.id, input);
      return row.id as string;
    }),
  );
  return getDrink(db, businessId, id);
}

/** PUT: the whole drink, its sizes and their lines replaced in one transaction. */
export async function replaceDrink(db: Knex, businessId: string, userId: string, id: string, input: DrinkIn) {
  if (!(await db('drinks').where({ business_id: businessId, id }).whereNull('archived_at').first('id'))) throw notFound('That drink');
  await validate(db, businessId, input);
  await guardWrite('A drink', () =>
    db.transaction(async (trx) => {
      await trx('drinks').where({ business_id: businessId, id }).update({ ...drinkColumns(input), updated_at: trx.fn.now() });
      await writeDrink(trx, businessId, userId, id, input);
    }),
  );
  return getDrink(db, businessId, id);
}

/** Archived, not deleted: its price history and past sales keep pointing at it. */
export async function archiveDrink(db: Knex, businessId: string, id: string) {
  const n = await db('drinks').where({ business_id: businessId, id }).whereNull('archived_at').update({ archived_at: db.fn.now() });
  if (!n) throw notFound('That drink');
}

/** Copies one size's build onto another (adding the size if the drink does not offer it yet). */
export async function copyBuild(db: Knex, businessId: string, userId: string, id: string, from: string, to: string) {
  const { drink } = await getDrink(db, businessId, id);
  const source = drink.sizes.find((s) => s.sizeId === from);
  if (!source) throw invalidInput({ fromSizeId: 'This drink does not offer that cup size.' });
  if (from === to) throw invalidInput({ toSizeId: 'Choose a different cup size to copy to.' });
  type LineIn = DrinkIn['sizes'][number]['lines'][number];
  const asInput = (lines: typeof source.lines): LineIn[] =>
    lines.map((l) => ({ ingredientId: l.ingredientId, preparationId: l.preparationId, quantity: l.quantity, unit: l.unit as LineIn['unit'], measureId: l.measureId }));
  const sizes: DrinkIn['sizes'] = drink.sizes.map((s) => ({ sizeId: s.sizeId, currentPrice: s.currentPrice, lines: asInput(s.lines) }));
  const target = sizes.find((s) => s.sizeId === to);
  if (target) target.lines = asInput(source.lines);
  else sizes.push({ sizeId: to, currentPrice: null, lines: asInput(source.lines) });
  const input: DrinkIn = { name: drink.name, category: drink.category, temperature: drink.temperature, notes: drink.notes, expectedWeeklyCups: drink.expectedWeeklyCups, sizes };
  return replaceDrink(db, businessId, userId, id, input);
}
