import type { Modifier } from '../../src/shared/contract/costing';
import { groupBy } from '../../src/shared/collections';
import { writeCost } from '../../src/shared/money';
import { suggestUpcharge } from '../../src/shared/pricing';
import { money } from '../platform/present';
import type { LoadedCostModel } from './cost-model.service';
import { presentLine } from './costing.presenter';
import type { ModifierLineRow, ModifierRow } from './modifiers.repo';

/**
 * A modifier per cup size: cost delta = cost of the added lines − cost of the removed ones, and
 * the upcharge that keeps the business's target margin on that delta (suggestUpcharge).
 */
export function presentModifier(loaded: LoadedCostModel, m: ModifierRow, lines: readonly ModifierLineRow[]): Modifier {
  const names = { itemName: loaded.itemName, measureName: (x: string) => loaded.measures.get(x)?.name ?? null };
  const policy = loaded.defaultPolicy;
  const sizes = [...groupBy(lines, (l) => l.size_id).values()].map((ls) => {
    const add = loaded.costStoredLines(ls.filter((l) => l.action === 'add'));
    const remove = loaded.costStoredLines(ls.filter((l) => l.action === 'remove'));
    const problem = !add.ok ? add.problem : !remove.ok ? remove.problem : null;
    const delta = add.ok && remove.ok ? add.cost.minus(remove.cost) : null;
    return {
      sizeId: ls[0].size_id,
      name: ls[0].size_name,
      lines: ls.map((l) => ({ ...presentLine(l, names), action: l.action })),
      costDelta: delta ? writeCost(delta) : null,
      suggestedUpcharge: delta ? suggestUpcharge(delta, policy, loaded.currency) : null,
      problem,
    };
  });
  return {
    id: m.id,
    name: m.name,
    kind: m.kind,
    upcharge: money(m.upcharge, loaded.currency),
    sizes,
    allergens: loaded.allergensOf(lines.filter((l) => l.action === 'add').map((l) => (l.ingredient_id ?? l.preparation_id) as string)),
  };
}
