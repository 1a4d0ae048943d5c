import { suffix } from '../../helpers/factories';
import { makeDrink, makeIngredient, makeModifier, makePreparation, makeSize, makeSupplier } from '../../helpers/costing-factories';
import { DOCUMENTED_REQUEST } from '../../helpers/costing-examples';
import { statuses, type RouteCase, type RouteFixture } from './types';

// Statuses come from each entry's capability (see route-table.test.ts); a row gives its own only
// where the fixture leads elsewhere. `fullBody` holds every field of the body's schema, optional
// ones too, for the hostile-input walk.
const write = (ok: number, other: number) => statuses({ owner: ok, manager: ok, barista: 403, bookkeeper: 403, other });

/** Rows of the fixture's business shared by the non-destructive rows, made once. */
const cache = new WeakMap<RouteFixture, Promise<Base>>();
interface Base {
  sizeId: string;
  sizeId2: string;
  ingredientId: string;
  packId: string;
  preparationId: string;
  drinkId: string;
  modifierId: string;
  supplierId: string;
  /** A measure (a 9 g shot) of the ingredient. */
  shotId: string;
}
const ready = new WeakMap<RouteFixture, Base>();
/** Bodies are built synchronously: a row's `url` makes sure the shared rows exist first. */
const made = (f: RouteFixture) => ready.get(f) as Base;
const after = (path: string) => async (f: RouteFixture) => {
  await base(f);
  return path;
};
function base(f: RouteFixture): Promise<Base> {
  let p = cache.get(f);
  if (!p) {
    p = (async () => {
      const b = f.biz.businessId;
      const sizeId = await makeSize(f.db, b, { name: `Regular ${suffix()}` });
      const sizeId2 = await makeSize(f.db, b, { name: `Large ${suffix()}`, volumeMl: '455', position: 1 });
      const supplierId = await makeSupplier(f.db, b);
      const ing = await makeIngredient(f.db, b, { pack: { quantity: '1', unit: 'kg', price: '20', supplierId }, measures: [{ name: 'shot', quantity: '9', unit: 'g' }] });
      const prep = await makePreparation(f.db, b, { yieldQuantity: '1', yieldUnit: 'kg', lines: [{ ingredientId: ing.id, quantity: '500', unit: 'g' }] });
      const drink = await makeDrink(f.db, b, { sizes: [{ sizeId, price: '3.00', lines: [{ ingredientId: ing.id, quantity: '18', unit: 'g' }] }] });
      const modifierId = await makeModifier(f.db, b, { lines: [{ sizeId, ingredientId: ing.id, quantity: '9', unit: 'g' }] });
      const out = { sizeId, sizeId2, ingredientId: ing.id, packId: ing.packId as string, preparationId: prep.id, drinkId: drink.id, modifierId, supplierId, shotId: ing.measures.shot };
      ready.set(f, out);
      return out;
    })();
    cache.set(f, p);
  }
  return p;
}

const freshSize = (f: RouteFixture) => makeSize(f.db, f.biz.businessId, { name: `S ${suffix()}` });
const freshIngredient = (f: RouteFixture) => makeIngredient(f.db, f.biz.businessId);
const freshPrep = async (f: RouteFixture) => {
  const ing = await freshIngredient(f);
  return (await makePreparation(f.db, f.biz.businessId, { yieldQuantity: '1', yieldUnit: 'kg', lines: [{ ingredientId: ing.id, quantity: '1', unit: 'kg' }] })).id;
};
const freshDrink = async (f: RouteFixture) => {
  const { sizeId, ingredientId } = await base(f);
  return (await makeDrink(f.db, f.biz.businessId, { sizes: [{ sizeId, lines: [{ ingredientId, quantity: '18', unit: 'g' }] }] })).id;
};
const freshMeasure = async (f: RouteFixture) => (await makeIngredient(f.db, f.biz.businessId, { measures: [{ name: 'scoop', quantity: '28', unit: 'g' }] })).measures.scoop;

const drinkBody = (f: RouteFixture) => {
  const { sizeId, sizeId2, ingredientId } = made(f);
  return {
    name: `Drink ${suffix()}`,
    category: 'Espresso',
    temperature: 'hot',
    sizes: [
      { sizeId, currentPrice: '3.20', lines: [{ ingredientId, quantity: '18', unit: 'g' }] },
      { sizeId: sizeId2, currentPrice: '3.60', lines: [{ ingredientId, quantity: '27', unit: 'g' }] },
    ],
  };
};
/** A line with every field: the ingredient by a measure of it (the other item and the unit left empty). */
const fullLine = (f: RouteFixture) => ({ ingredientId: made(f).ingredientId, preparationId: null, quantity: '2', unit: null, measureId: made(f).shotId });
const fullDrinkBody = (f: RouteFixture) => ({
  name: `Drink ${suffix()}`, category: 'Espresso', temperature: 'iced', notes: 'Over ice.', expectedWeeklyCups: 120,
  sizes: [{ sizeId: made(f).sizeId, currentPrice: '3.20', lines: [fullLine(f)] }],
});
const prepBody = (f: RouteFixture) => ({ name: `Prep ${suffix()}`, yield: { quantity: '1', unit: 'kg' }, lines: [{ ingredientId: made(f).ingredientId, quantity: '100', unit: 'g' }] });
const fullPrepBody = (f: RouteFixture) => ({
  name: `Prep ${suffix()}`, yield: { quantity: '1', unit: 'kg' }, densityGPerMl: '1.2', method: 'Stir until smooth.', lines: [fullLine(f)], measures: [{ name: 'spoon', quantity: '10', unit: 'g' }],
});
const modifierBody = (f: RouteFixture) => {
  const { sizeId, ingredientId } = made(f);
  return { name: `Extra ${suffix()}`, kind: 'add', lines: [{ sizeId, action: 'add', ingredientId, quantity: '9', unit: 'g' }] };
};
const fullModifierBody = (f: RouteFixture) => ({ name: `Extra ${suffix()}`, kind: 'swap', upcharge: '0.50', lines: [{ sizeId: made(f).sizeId, action: 'remove', ...fullLine(f) }] });
const policyBody = { policy: { targetMarginPct: '72', taxMode: 'inclusive', taxRatePct: '20', priceStep: '0.05', rounding: 'up' }, overrides: [{ category: 'Tea', targetMarginPct: '75', taxMode: 'inclusive', taxRatePct: '20', priceStep: '0.05', rounding: 'up' }] };
const sizeBody = () => ({ name: `Size ${suffix()}`, volumeMl: '341', position: 2 });
const fullPack = (f: RouteFixture) => ({
  supplierId: made(f).supplierId, description: `Case ${suffix()}`, supplierCode: 'OAT-6', count: '6', quantity: '1', unit: 'kg', purchaseTaxPct: '20', price: '10.80', effectiveFrom: '2026-01-01',
});
const fullIngredientBody = (f: RouteFixture) => ({
  name: `Oat drink ${suffix()}`, category: 'plant-milk', baseUnit: 'g', densityGPerMl: '1.03', yieldPct: '95', allergens: ['cereals-containing-gluten'], notes: 'Shake well.',
  packs: [fullPack(f)], measures: [{ name: 'splash', quantity: '30', unit: 'g' }],
});
/** A pack's own fields (its price changes through its prices). */
const fullPackPatch = (f: RouteFixture) => {
  const p: Partial<ReturnType<typeof fullPack>> = fullPack(f);
  delete p.price;
  delete p.effectiveFrom;
  return p;
};
/** The documented request with every optional field in the first ingredient, preparation and size. */
const fullPreview = () => {
  const r = structuredClone(DOCUMENTED_REQUEST) as unknown as Record<string, Record<string, unknown>[]>;
  r.ingredients[0].measures = { jug: { quantity: '500', unit: 'ml' } };
  r.preparations[0].densityGPerMl = '1.3';
  return r;
};

const supplierBody = () => ({
  name: `Supplier ${suffix()}`, contactName: 'Ada Greaves', orderEmail: `orders-${suffix()}@supplier.test`, phone: '0100 000000', accountNumber: 'ACC-1', notes: 'Rings before delivering.',
});

export const routes: RouteCase[] = [
  { method: 'post', path: '/api/costing/preview', body: () => DOCUMENTED_REQUEST, fullBody: fullPreview },

  { method: 'get', path: '/api/sizes' },
  { method: 'post', path: '/api/sizes', body: sizeBody },
  { method: 'patch', path: '/api/sizes/:id', url: async (f) => `/api/sizes/${await freshSize(f)}`, body: () => ({ name: `Renamed ${suffix()}` }), fullBody: sizeBody },
  { method: 'delete', path: '/api/sizes/:id', url: async (f) => `/api/sizes/${await freshSize(f)}` },

  { method: 'get', path: '/api/suppliers' },
  { method: 'get', path: '/api/suppliers/:id', url: async (f) => `/api/suppliers/${(await base(f)).supplierId}` },
  { method: 'post', path: '/api/suppliers', body: () => ({ name: `Supplier ${suffix()}`, orderEmail: `orders-${suffix()}@supplier.test` }), fullBody: supplierBody },
  { method: 'patch', path: '/api/suppliers/:id', url: async (f) => `/api/suppliers/${(await base(f)).supplierId}`, body: () => ({ phone: '0100 000000' }), fullBody: supplierBody },
  { method: 'delete', path: '/api/suppliers/:id', url: async (f) => `/api/suppliers/${await makeSupplier(f.db, f.biz.businessId)}` },

  { method: 'get', path: '/api/ingredients' },
  { method: 'get', path: '/api/ingredients/:id', url: async (f) => `/api/ingredients/${(await base(f)).ingredientId}` },
  {
    method: 'post', path: '/api/ingredients', url: after('/api/ingredients'),
    body: () => ({ name: `Oat drink ${suffix()}`, category: 'plant-milk', baseUnit: 'ml', allergens: ['cereals-containing-gluten'], packs: [{ description: '6 × 1 l', count: '6', quantity: '1', unit: 'l', price: '10.80' }] }),
    fullBody: fullIngredientBody,
  },
  {
    method: 'patch', path: '/api/ingredients/:id', url: async (f) => `/api/ingredients/${(await base(f)).ingredientId}`, body: () => ({ notes: `Note ${suffix()}` }),
    fullBody: (f) => ({ name: `Beans ${suffix()}`, category: 'coffee', baseUnit: 'g', densityGPerMl: '0.4', yieldPct: '96', allergens: [], notes: 'Keep sealed.', costingPackId: made(f).packId }),
  },
  { method: 'delete', path: '/api/ingredients/:id', url: async (f) => `/api/ingredients/${(await freshIngredient(f)).id}` },
  { method: 'post', path: '/api/ingredients/:id/packs', url: async (f) => `/api/ingredients/${(await base(f)).ingredientId}/packs`, body: () => ({ description: `Sack ${suffix()}`, quantity: '5', unit: 'kg', price: '95' }), fullBody: fullPack },
  { method: 'patch', path: '/api/packs/:id', url: async (f) => `/api/packs/${(await base(f)).packId}`, body: () => ({ supplierCode: `C-${suffix()}` }), fullBody: fullPackPatch },
  { method: 'delete', path: '/api/packs/:id', url: async (f) => `/api/packs/${(await freshIngredient(f)).packId}` },
  { method: 'get', path: '/api/packs/:id/prices', url: async (f) => `/api/packs/${(await base(f)).packId}/prices` },
  {
    method: 'post', path: '/api/packs/:id/prices', url: async (f) => `/api/packs/${(await base(f)).packId}/prices`, body: () => ({ price: '21.00', effectiveFrom: '2099-01-01' }),
    fullBody: () => ({ price: '21.00', effectiveFrom: '2099-01-01', note: 'New price list from the roaster.' }),
  },
  { method: 'post', path: '/api/ingredients/:id/measures', url: async (f) => `/api/ingredients/${(await freshIngredient(f)).id}/measures`, body: () => ({ name: 'shot', quantity: '9', unit: 'g' }) },
  { method: 'post', path: '/api/preparations/:id/measures', url: async (f) => `/api/preparations/${await freshPrep(f)}/measures`, body: () => ({ name: 'spoon', quantity: '10', unit: 'g' }) },
  { method: 'patch', path: '/api/measures/:id', url: async (f) => `/api/measures/${await freshMeasure(f)}`, body: () => ({ quantity: '30' }), fullBody: () => ({ name: 'heaped scoop', quantity: '30', unit: 'g' }) },
  { method: 'delete', path: '/api/measures/:id', url: async (f) => `/api/measures/${await freshMeasure(f)}` },

  { method: 'get', path: '/api/preparations' },
  { method: 'get', path: '/api/preparations/:id', url: async (f) => `/api/preparations/${(await base(f)).preparationId}` },
  // Another business's owner naming this business's ingredient: refused as a bad field.
  { method: 'post', path: '/api/preparations', url: after('/api/preparations'), body: prepBody, fullBody: fullPrepBody, expect: write(201, 400) },
  { method: 'put', path: '/api/preparations/:id', url: async (f) => `/api/preparations/${await freshPrep(f)}`, body: prepBody, fullBody: fullPrepBody },
  { method: 'delete', path: '/api/preparations/:id', url: async (f) => `/api/preparations/${await freshPrep(f)}` },

  { method: 'get', path: '/api/drinks' },
  { method: 'get', path: '/api/drinks/:id', url: async (f) => `/api/drinks/${(await base(f)).drinkId}` },
  { method: 'post', path: '/api/drinks', url: after('/api/drinks'), body: drinkBody, fullBody: fullDrinkBody, expect: write(201, 400) },
  { method: 'put', path: '/api/drinks/:id', url: async (f) => `/api/drinks/${await freshDrink(f)}`, body: drinkBody, fullBody: fullDrinkBody },
  { method: 'delete', path: '/api/drinks/:id', url: async (f) => `/api/drinks/${await freshDrink(f)}` },
  { method: 'post', path: '/api/drinks/:id/copy-build', url: async (f) => `/api/drinks/${await freshDrink(f)}/copy-build`, body: (f) => ({ fromSizeId: made(f).sizeId, toSizeId: made(f).sizeId2 }) },
  { method: 'get', path: '/api/drinks/:id/costing', url: async (f) => `/api/drinks/${(await base(f)).drinkId}/costing?asOf=2026-12-01` },
  { method: 'get', path: '/api/menu/costing' },
  { method: 'get', path: '/api/cards' },
  { method: 'get', path: '/api/drinks/:id/card', url: async (f) => `/api/drinks/${(await base(f)).drinkId}/card` },

  { method: 'get', path: '/api/modifiers' },
  { method: 'get', path: '/api/modifiers/:id', url: async (f) => `/api/modifiers/${(await base(f)).modifierId}` },
  { method: 'post', path: '/api/modifiers', url: after('/api/modifiers'), body: modifierBody, fullBody: fullModifierBody, expect: write(201, 400) },
  { method: 'put', path: '/api/modifiers/:id', url: async (f) => `/api/modifiers/${(await base(f)).modifierId}`, body: modifierBody, fullBody: fullModifierBody },
  { method: 'delete', path: '/api/modifiers/:id', url: async (f) => `/api/modifiers/${await makeModifier(f.db, f.biz.businessId, { lines: [] })}` },

  { method: 'get', path: '/api/pricing-policy' },
  { method: 'put', path: '/api/pricing-policy', body: () => policyBody },
];
