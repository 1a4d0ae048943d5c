import type { Knex } from 'knex';
import { suffix } from '../../helpers/factories';
import { makeDrink, makeIngredient, makeModifier, makePolicy, makePreparation, makeSize } from '../../helpers/costing-factories';

/**
 * A small menu made for repricing tests (invented data), so that milk reaches drinks in every
 * way the impact must find:
 * - Latte, Small and Large: milk in the build (direct);
 * - Foam brew, Small: beans and "Vanilla foam", a preparation made of "Sweet cream", a
 *   preparation made of milk (milk two preparations deep);
 * - Americano and Tea: no milk at all (must NOT appear); a "Splash of milk" add-on and an
 *   "Oat swap" (removes milk, adds oat drink) use milk through modifiers; "Extra shot" does not.
 * Policy 72 % margin, prices include 20 % VAT, rounded up to 0.05 (GBP).
 */
export async function makeRepricingMenu(db: Knex, businessId: string) {
  const s = suffix();
  await makePolicy(db, businessId);
  const small = await makeSize(db, businessId, { name: `Small ${s}`, volumeMl: '227', position: 0 });
  const large = await makeSize(db, businessId, { name: `Large ${s}`, volumeMl: '455', position: 1 });
  const milk = await makeIngredient(db, businessId, { name: `Milk ${s}`, category: 'dairy', baseUnit: 'ml', density: '1.03', yieldPct: '92', allergens: ['milk'], pack: { count: '6', quantity: '2', unit: 'l', price: '9.90' } });
  const beans = await makeIngredient(db, businessId, { name: `Beans ${s}`, category: 'coffee', baseUnit: 'g', yieldPct: '96', pack: { quantity: '1', unit: 'kg', price: '21.40' }, measures: [{ name: 'shot', quantity: '9', unit: 'g' }] });
  const sugar = await makeIngredient(db, businessId, { name: `Sugar ${s}`, pack: { count: '10', quantity: '1', unit: 'kg', price: '11.90' } });
  const cup = await makeIngredient(db, businessId, { name: `Cup ${s}`, baseUnit: 'each', category: 'packaging', pack: { count: '50', quantity: '20', unit: 'each', price: '61.50' } });
  const oat = await makeIngredient(db, businessId, { name: `Oat drink ${s}`, category: 'plant-milk', baseUnit: 'ml', allergens: ['cereals-containing-gluten'], pack: { count: '6', quantity: '1', unit: 'l', price: '14.40' } });
  const tea = await makeIngredient(db, businessId, { name: `Tea bag ${s}`, category: 'tea', baseUnit: 'each', pack: { count: '1', quantity: '100', unit: 'each', price: '6.00' } });
  const sweetCream = await makePreparation(db, businessId, {
    name: `Sweet cream ${s}`,
    yieldQuantity: '0.6',
    yieldUnit: 'l',
    lines: [
      { ingredientId: milk.id, quantity: '500', unit: 'ml' },
      { ingredientId: sugar.id, quantity: '100', unit: 'g' },
    ],
  });
  const foam = await makePreparation(db, businessId, {
    name: `Vanilla foam ${s}`,
    yieldQuantity: '0.5',
    yieldUnit: 'l',
    lines: [
      { preparationId: sweetCream.id, quantity: '400', unit: 'ml' },
      { ingredientId: sugar.id, quantity: '20', unit: 'g' },
    ],
  });
  const latte = await makeDrink(db, businessId, {
    name: `Latte ${s}`,
    sizes: [
      { sizeId: small, price: '3.10', lines: [{ ingredientId: beans.id, quantity: '1', measureId: beans.measures.shot }, { ingredientId: milk.id, quantity: '200', unit: 'ml' }, { ingredientId: cup.id, quantity: '1', unit: 'each' }] },
      { sizeId: large, price: '3.60', lines: [{ ingredientId: beans.id, quantity: '2', measureId: beans.measures.shot }, { ingredientId: milk.id, quantity: '380', unit: 'ml' }, { ingredientId: cup.id, quantity: '1', unit: 'each' }] },
    ],
  });
  const foamBrew = await makeDrink(db, businessId, {
    name: `Foam brew ${s}`,
    temperature: 'iced',
    sizes: [{ sizeId: small, price: '3.80', lines: [{ ingredientId: beans.id, quantity: '18', unit: 'g' }, { preparationId: foam.id, quantity: '60', unit: 'ml' }, { ingredientId: cup.id, quantity: '1', unit: 'each' }] }],
  });
  const americano = await makeDrink(db, businessId, {
    name: `Americano ${s}`,
    sizes: [
      { sizeId: small, price: '2.50', lines: [{ ingredientId: beans.id, quantity: '2', measureId: beans.measures.shot }, { ingredientId: cup.id, quantity: '1', unit: 'each' }] },
      { sizeId: large, price: '2.90', lines: [{ ingredientId: beans.id, quantity: '3', measureId: beans.measures.shot }, { ingredientId: cup.id, quantity: '1', unit: 'each' }] },
    ],
  });
  const teaDrink = await makeDrink(db, businessId, { name: `Tea ${s}`, category: 'Tea', sizes: [{ sizeId: small, price: '2.20', lines: [{ ingredientId: tea.id, quantity: '1', unit: 'each' }, { ingredientId: cup.id, quantity: '1', unit: 'each' }] }] });
  const splash = await makeModifier(db, businessId, { name: `Splash of milk ${s}`, lines: [{ sizeId: small, ingredientId: milk.id, quantity: '30', unit: 'ml' }] });
  const oatSwap = await makeModifier(db, businessId, {
    name: `Oat swap ${s}`,
    kind: 'swap',
    lines: [
      { sizeId: small, action: 'remove', ingredientId: milk.id, quantity: '200', unit: 'ml' },
      { sizeId: small, action: 'add', ingredientId: oat.id, quantity: '200', unit: 'ml' },
    ],
  });
  const extraShot = await makeModifier(db, businessId, { name: `Extra shot ${s}`, lines: [{ sizeId: small, ingredientId: beans.id, quantity: '1', measureId: beans.measures.shot }] });
  await db('modifiers').whereIn('id', [splash, oatSwap]).update({ upcharge: '0.40' });
  return { s, small, large, milk, beans, sugar, cup, oat, tea, sweetCream, foam, latte, foamBrew, americano, teaDrink, splash, oatSwap, extraShot };
}
