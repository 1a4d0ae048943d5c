// Shapes of the costing API's bodies as the client reads them (see the costing API contract).
import type { AllergenCode } from '../../../shared/allergens';
import { INGREDIENT_CATEGORIES, type IngredientCategory } from '../../../shared/categories';
import type { PriceFigures, PricingPolicy } from '../../../shared/pricing';
import type { BaseUnit, UnitCode } from '../../../shared/units';

export type { AllergenCode, BaseUnit, PriceFigures, PricingPolicy, UnitCode };

export { INGREDIENT_CATEGORIES, type IngredientCategory };
export const categoryLabels: Record<IngredientCategory, string> = {
  coffee: 'Coffee',
  dairy: 'Dairy',
  'plant-milk': 'Plant milk',
  'syrup-sauce': 'Syrup and sauce',
  powder: 'Powder',
  tea: 'Tea',
  extras: 'Bakery-side extras',
  packaging: 'Packaging',
  other: 'Other',
};

export type Temperature = 'hot' | 'iced';

export interface CupSize {
  id: string;
  name: string;
  volumeMl: string;
  position: number;
}

export interface Supplier {
  id: string;
  name: string;
}

export interface MeasureOut {
  id: string;
  name: string;
  quantity: string;
  unit: UnitCode;
  cost?: string | null;
}

export interface IngredientSummary {
  id: string;
  name: string;
  category: IngredientCategory;
  baseUnit: BaseUnit;
  densityGPerMl: string | null;
  yieldPct: string | null;
  unitCost: string | null;
  costingPack: { id: string; description: string; price: string | null; supplierName: string | null } | null;
  allergens: AllergenCode[];
  measures: MeasureOut[];
  problem: string | null;
}

export interface Pack {
  id: string;
  supplierId: string | null;
  supplierName: string | null;
  description: string;
  supplierCode: string | null;
  count: string;
  quantity: string;
  unit: UnitCode;
  purchaseTaxPct: string | null;
  price: string | null;
  priceFrom: string | null;
  plannedPrices: { price: string; effectiveFrom: string }[];
  isCostingPack: boolean;
}

export interface IngredientDetail extends IngredientSummary {
  notes: string | null;
  costingPackId: string | null;
  packs: Pack[];
}

/** A line as the API takes it: one item and one of unit / measure. */
export interface LineIn {
  ingredientId?: string | null;
  preparationId?: string | null;
  quantity: string;
  unit?: UnitCode | null;
  measureId?: string | null;
}

export interface LineOut {
  id: string;
  ingredientId: string | null;
  preparationId: string | null;
  itemName: string;
  quantity: string;
  unit: UnitCode | null;
  measureId: string | null;
  measureName: string | null;
}

export interface PreparationSummary {
  id: string;
  name: string;
  yield: { quantity: string; unit: UnitCode };
  baseUnit: BaseUnit;
  batchCost: string | null;
  unitCost: string | null;
  allergens: AllergenCode[];
  problem: string | null;
}

export interface PreparationDetail extends PreparationSummary {
  densityGPerMl: string | null;
  method: string | null;
  lines: (LineOut & { quantityInBaseUnit: string | null; baseUnit: BaseUnit | null; cost: string | null })[];
  measures: MeasureOut[];
}

export interface DrinkSummary {
  id: string;
  name: string;
  category: string;
  temperature: Temperature;
  sizes: { sizeId: string; name: string; currentPrice: string | null }[];
}

export interface Drink {
  id: string;
  name: string;
  category: string;
  temperature: Temperature;
  notes: string | null;
  expectedWeeklyCups: number | null;
  sizes: { id: string; sizeId: string; name: string; volumeMl: string; currentPrice: string | null; priceVersion: number; lines: LineOut[] }[];
}

export interface DrinkIn {
  name: string;
  category: string;
  temperature: Temperature;
  notes?: string | null;
  sizes: { sizeId: string; currentPrice?: string | null; lines: LineIn[] }[];
}

export interface SizeCosting {
  drinkSizeId: string;
  sizeId: string;
  name: string;
  cost: string | null;
  lines: { lineId: string; item: string; itemName: string; quantityInBaseUnit: string; baseUnit: BaseUnit; cost: string }[];
  suggestedPrice: string | null;
  atSuggested: PriceFigures | null;
  atCurrent: PriceFigures | null;
  problem: string | null;
}

export interface DrinkCosting {
  drinkId: string;
  name: string;
  category: string;
  currency: string;
  policy: PricingPolicy;
  sizes: SizeCosting[];
  allergens: AllergenCode[];
  allergenCaution: string;
}

export interface MenuCostingSize {
  drinkSizeId: string;
  sizeId: string;
  name: string;
  cost: string | null;
  currentPrice: string | null;
  marginPct: string | null;
  suggestedPrice: string | null;
  belowTarget: boolean;
  problem: string | null;
}

export interface MenuCosting {
  currency: string;
  asOf: string;
  drinks: { id: string; name: string; category: string; temperature: Temperature; targetMarginPct: string; sizes: MenuCostingSize[] }[];
}

export interface CardSummary {
  id: string;
  name: string;
  category: string;
  temperature: Temperature;
  sizes: string[];
}

export interface RecipeCard {
  id: string;
  name: string;
  category: string;
  temperature: Temperature;
  notes: string | null;
  sizes: { sizeId: string; name: string; volumeMl: string; lines: { itemName: string; quantity: string; unit: string | null; unitLabel: string }[] }[];
  allergens: AllergenCode[];
  modifiers: { id: string; name: string; allergens: AllergenCode[] }[];
  allergenCaution: string;
}

export interface PolicyOverride extends PricingPolicy {
  category: string;
}

export interface PricingPolicyBody {
  currency: string;
  policy: PricingPolicy;
  isSet: boolean;
  overrides: PolicyOverride[];
  caution: string;
}

export type ModifierKind = 'add' | 'swap';

/** A modifier's figures for one cup size: costDelta = cost of what it puts in − cost of what it takes out. */
export interface ModifierSize {
  sizeId: string;
  name: string;
  lines: (LineOut & { action: 'add' | 'remove' })[];
  costDelta: string | null;
  suggestedUpcharge: string | null;
  problem: string | null;
}

export interface Modifier {
  id: string;
  name: string;
  kind: ModifierKind;
  upcharge: string | null;
  sizes: ModifierSize[];
  allergens: AllergenCode[];
}

export interface ModifierIn {
  name: string;
  kind: ModifierKind;
  upcharge?: string | null;
  lines: (LineIn & { sizeId: string; action: 'add' | 'remove' })[];
}
