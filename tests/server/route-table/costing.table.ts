import { suffix } from '../../helpers/factories';
import { makeDrink, makeIngredient, makeModifier, makePreparation, makeSize, makeSupplier } from '../../helpers/costing-factories';
import { DOCUMENTED_REQUEST } from '../../helpers/costing-examples';
import { statuses, type RouteCase, type RouteFixture } from './types';

const read = (ok = 200, other = ok) => statuses({ owner: ok, manager: ok, barista: 403, bookkeeper: ok, other });
const write = (ok: number, other = ok) => statuses({ owner: ok, manager: ok, barista: 403, bookkeeper: 403, other });
const everyRole = (other = 200) => statuses({ owner: 200, manager: 200, barista: 200, bookkeeper: 200, other });

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
      const ing = await makeIngredient(f.db, b, { pack: { quantity: '1', unit: 'kg', price: '20', supplierId } });
      const prep = await makePreparation(f.db, b, { yieldQuantity: '1', yieldUnit: 'kg', lines: [{ ingredientId: ing.id, quantity: '500', unit: 'g' }] });
      const drink = await makeDrink(f.db, b, { sizes: [{ sizeId, price: '3.00', lines: [{ ingredientId: ing.id, quantity: '18', unit: 'g' }] }] });
      const modifierId = await makeModifier(f.db, b, { lines: [{ sizeId, ingredientId: ing.id, quantity: '9', unit: 'g' }] });
      const out = { sizeId, sizeId2, ingredientId: ing.id, packId: ing.packId as string, preparationId: prep.id, drinkId: drink.id, modifierId, supplierId };
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
const prepBody = (f: RouteFixture) => ({ name: `Prep ${suffix()}`, yield: { quantity: '1', unit: 'kg' }, lines: [{ ingredientId: made(f).ingredientId, quantity: '100', unit: 'g' }] });
const modifierBody = (f: RouteFixture) => {
  const { sizeId, ingredientId } = made(f);
  return { name: `Extra ${suffix()}`, kind: 'add', lines: [{ sizeId, action: 'add', ingredientId, quantity: '9', unit: 'g' }] };
};
const policyBody = { policy: { targetMarginPct: '72', taxMode: 'inclusive', taxRatePct: '20', priceStep: '0.05', rounding: 'up' }, overrides: [{ category: 'Tea', targetMarginPct: '75', taxMode: 'inclusive', taxRatePct: '20', priceStep: '0.05', rounding: 'up' }] };

const supplierBody = () => ({
  name: `Supplier ${suffix()}`, contactName: 'Ada Greaves', orderEmail: `orders-${suffix()}@supplier.test`, phone: '0100 000000', accountNumber: 'ACC-1', notes: 'Rings before delivering.',
});

export const routes: RouteCase[] = [
  { method: 'post', path: '/api/costing/preview', body: () => DOCUMENTED_REQUEST, expect: read() },

  { method: 'get', path: '/api/sizes', expect: read() },
  { method: 'post', path: '/api/sizes', body: () => ({ name: `Size ${suffix()}`, volumeMl: '341' }), expect: write(201) },
  { method: 'patch', path: '/api/sizes/:id', url: async (f) => `/api/sizes/${await freshSize(f)}`, body: () => ({ name: `Renamed ${suffix()}` }), expect: write(200, 404) },
  { method: 'delete', path: '/api/sizes/:id', url: async (f) => `/api/sizes/${await freshSize(f)}`, expect: write(204, 404) },

  { method: 'get', path: '/api/suppliers' },
  { method: 'get', path: '/api/suppliers/:id', url: async (f) => `/api/suppliers/${(await base(f)).supplierId}` },
  { method: 'post', path: '/api/suppliers', body: () => ({ name: `Supplier ${suffix()}`, orderEmail: `orders-${suffix()}@supplier.test` }), fullBody: supplierBody },
  { method: 'patch', path: '/api/suppliers/:id', url: async (f) => `/api/suppliers/${(await base(f)).supplierId}`, body: () => ({ phone: '0100 000000' }), fullBody: supplierBody },
  { method: 'delete', path: '/api/suppliers/:id', url: async (f) => `/api/suppliers/${await makeSupplier(f.db, f.biz.businessId)}` },

  { method: 'get', path: '/api/ingredients', expect: read() },
  { method: 'get', path: '/api/ingredients/:id', url: async (f) => `/api/ingredients/${(await base(f)).ingredientId}`, expect: read(200, 404) },
  { method: 'post', path: '/api/ingredients', body: () => ({ name: `Oat drink ${suffix()}`, category: 'plant-milk', baseUnit: 'ml', allergens: ['cereals-containing-gluten'], packs: [{ description: '6 × 1 l', count: '6', quantity: '1', unit: 'l', price: '10.80' }] }), expect: write(201) },
  { method: 'patch', path: '/api/ingredients/:id', url: async (f) => `/api/ingredients/${(await base(f)).ingredientId}`, body: () => ({ notes: `Note ${suffix()}` }), expect: write(200, 404) },
  { method: 'delete', path: '/api/ingredients/:id', url: async (f) => `/api/ingredients/${(await freshIngredient(f)).id}`, expect: write(204, 404) },
  { method: 'post', path: '/api/ingredients/:id/packs', url: async (f) => `/api/ingredients/${(await base(f)).ingredientId}/packs`, body: () => ({ description: `Sack ${suffix()}`, quantity: '5', unit: 'kg', price: '95' }), expect: write(201, 404) },
  { method: 'patch', path: '/api/packs/:id', url: async (f) => `/api/packs/${(await base(f)).packId}`, body: () => ({ supplierCode: `C-${suffix()}` }), expect: write(200, 404) },
  { method: 'delete', path: '/api/packs/:id', url: async (f) => `/api/packs/${(await freshIngredient(f)).packId}`, expect: write(204, 404) },
  { method: 'get', path: '/api/packs/:id/prices', url: async (f) => `/api/packs/${(await base(f)).packId}/prices`, expect: read(200, 404) },
  { method: 'post', path: '/api/packs/:id/prices', url: async (f) => `/api/packs/${(await base(f)).packId}/prices`, body: () => ({ price: '21.00', effectiveFrom: '2099-01-01' }), expect: write(201, 404) },
  { method: 'post', path: '/api/ingredients/:id/measures', url: async (f) => `/api/ingredients/${(await freshIngredient(f)).id}/measures`, body: () => ({ name: 'shot', quantity: '9', unit: 'g' }), expect: write(201, 404) },
  { method: 'post', path: '/api/preparations/:id/measures', url: async (f) => `/api/preparations/${await freshPrep(f)}/measures`, body: () => ({ name: 'spoon', quantity: '10', unit: 'g' }), expect: write(201, 404) },
  { method: 'patch', path: '/api/measures/:id', url: async (f) => `/api/measures/${await freshMeasure(f)}`, body: () => ({ quantity: '30' }), expect: write(200, 404) },
  { method: 'delete', path: '/api/measures/:id', url: async (f) => `/api/measures/${await freshMeasure(f)}`, expect: write(204, 404) },

  { method: 'get', path: '/api/preparations', expect: read() },
  { method: 'get', path: '/api/preparations/:id', url: async (f) => `/api/preparations/${(await base(f)).preparationId}`, expect: read(200, 404) },
  // Another business's owner naming this business's ingredient: refused as a bad field.
  { method: 'post', path: '/api/preparations', url: after('/api/preparations'), body: prepBody, expect: write(201, 400) },
  { method: 'put', path: '/api/preparations/:id', url: async (f) => `/api/preparations/${await freshPrep(f)}`, body: prepBody, expect: write(200, 404) },
  { method: 'delete', path: '/api/preparations/:id', url: async (f) => `/api/preparations/${await freshPrep(f)}`, expect: write(204, 404) },

  { method: 'get', path: '/api/drinks', expect: read() },
  { method: 'get', path: '/api/drinks/:id', url: async (f) => `/api/drinks/${(await base(f)).drinkId}`, expect: read(200, 404) },
  { method: 'post', path: '/api/drinks', url: after('/api/drinks'), body: drinkBody, expect: write(201, 400) },
  { method: 'put', path: '/api/drinks/:id', url: async (f) => `/api/drinks/${await freshDrink(f)}`, body: drinkBody, expect: write(200, 404) },
  { method: 'delete', path: '/api/drinks/:id', url: async (f) => `/api/drinks/${await freshDrink(f)}`, expect: write(204, 404) },
  { method: 'post', path: '/api/drinks/:id/copy-build', url: async (f) => `/api/drinks/${await freshDrink(f)}/copy-build`, body: (f) => ({ fromSizeId: made(f).sizeId, toSizeId: made(f).sizeId2 }), expect: write(200, 404) },
  { method: 'get', path: '/api/drinks/:id/costing', url: async (f) => `/api/drinks/${(await base(f)).drinkId}/costing`, expect: read(200, 404) },
  { method: 'get', path: '/api/menu/costing', expect: read() },
  { method: 'get', path: '/api/cards', expect: everyRole() },
  { method: 'get', path: '/api/drinks/:id/card', url: async (f) => `/api/drinks/${(await base(f)).drinkId}/card`, expect: everyRole(404) },

  { method: 'get', path: '/api/modifiers', expect: read() },
  { method: 'get', path: '/api/modifiers/:id', url: async (f) => `/api/modifiers/${(await base(f)).modifierId}`, expect: read(200, 404) },
  { method: 'post', path: '/api/modifiers', url: after('/api/modifiers'), body: modifierBody, expect: write(201, 400) },
  { method: 'put', path: '/api/modifiers/:id', url: async (f) => `/api/modifiers/${(await base(f)).modifierId}`, body: modifierBody, expect: write(200, 404) },
  { method: 'delete', path: '/api/modifiers/:id', url: async (f) => `/api/modifiers/${await makeModifier(f.db, f.biz.businessId, { lines: [] })}`, expect: write(204, 404) },

  { method: 'get', path: '/api/pricing-policy', expect: read() },
  { method: 'put', path: '/api/pricing-policy', body: () => policyBody, expect: write(200) },
];
