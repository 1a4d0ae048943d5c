import type { UnitCode } from '../../../shared/units';
import { categoryLabels, INGREDIENT_CATEGORIES } from '../api/types';
import { unitSymbol } from './units';

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
