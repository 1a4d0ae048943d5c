import type { UnitCode } from '../../../shared/units';
import { INGREDIENT_CATEGORIES, type IngredientCategory } from '../../../shared/categories';
import { unitSymbol } from './units';

/** The ingredient categories by their plain names. */
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

/** <option>s of the ingredient categories, by their plain names. */
export function CategoryOptions() {
  return INGREDIENT_CATEGORIES.map((c) => (
    <option key={c} value={c}>
      {categoryLabels[c]}
    </option>
  ));
}

/** <option>s of standard units, shown by their symbols. */
export function UnitOptions({ units }: { units: readonly UnitCode[] }) {
  return units.map((u) => (
    <option key={u} value={u}>
      {unitSymbol(u)}
    </option>
  ));
}
