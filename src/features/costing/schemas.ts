import { z } from 'zod';
import { ALLERGEN_CODES } from '../../shared/allergens';
import { rules } from '../../shared/checks';
import { pricingPolicySchema } from '../../shared/schemas/costing';
import { decimal, type DecimalColumn } from '../../shared/schemas/fields';
import { BASE_UNITS, UNIT_CODES } from '../../shared/units';
import { INGREDIENT_CATEGORIES } from '../../shared/categories';

// The forms' rules, built from the field schemas the server applies (each decimal held to the
// column it is stored in), so a field is refused here with the same words the API would use.

const line = z.object({
  item: z.string().min(1, 'Choose an ingredient or preparation from the list.'),
  quantity: decimal('quantity', rules.positive),
  unit: z.string().min(1, 'Choose a unit or measure.'),
});
export const linesSchema = z.array(line);
const looseLine = z.object({ item: z.string(), quantity: z.string(), unit: z.string() });

export const drinkFormSchema = z
  .object({
    name: z.string().trim().min(1, 'Name the drink.').max(120),
    category: z.string().trim().min(1, 'Give the drink a category, e.g. espresso or tea.').max(60),
    temperature: z.enum(['hot', 'iced'], { error: 'Choose hot or iced.' }),
    notes: z.string().max(2000),
    sizes: z.array(z.object({ sizeId: z.string(), name: z.string(), volumeMl: z.string(), offered: z.boolean(), currentPrice: z.string(), lines: z.array(looseLine) })),
  })
  .superRefine((v, ctx) => {
    if (!v.sizes.some((s) => s.offered)) ctx.addIssue({ code: 'custom', path: ['sizes'], message: 'Offer the drink in at least one cup size.' });
    v.sizes.forEach((s, i) => {
      if (!s.offered) return;
      if (s.currentPrice.trim() !== '') {
        const r = decimal('money', rules.positive).safeParse(s.currentPrice.trim());
        if (!r.success) ctx.addIssue({ code: 'custom', path: ['sizes', i, 'currentPrice'], message: r.error.issues[0].message });
      }
      if (s.lines.length === 0) ctx.addIssue({ code: 'custom', path: ['sizes', i, 'lines'], message: `Add at least one line to the ${s.name} build.` });
      s.lines.forEach((l, j) => {
        const r = line.safeParse(l);
        if (!r.success) for (const issue of r.error.issues) ctx.addIssue({ code: 'custom', path: ['sizes', i, 'lines', j, ...issue.path], message: issue.message });
      });
    });
  });
export type DrinkFormValues = z.input<typeof drinkFormSchema>;

const optionalDecimal = (column: DecimalColumn, rule: Parameters<typeof decimal>[1]) => z.union([z.literal(''), decimal(column, rule)]);

export const preparationFormSchema = z.object({
  name: z.string().trim().min(1, 'Name the preparation.').max(120),
  yieldQuantity: decimal('quantity', rules.positive),
  yieldUnit: z.enum(UNIT_CODES, 'Choose the unit of the yield.'),
  densityGPerMl: optionalDecimal('density', rules.positive),
  method: z.string().max(5000),
  lines: linesSchema.min(1, 'A preparation needs at least one line.'),
  measures: z.array(z.object({ id: z.string().optional(), name: z.string().trim().min(1, 'Name the measure.').max(120), quantity: decimal('quantity', rules.positive), unit: z.enum(UNIT_CODES, 'Choose a unit.') })),
});
export type PreparationFormValues = z.input<typeof preparationFormSchema>;

export const ingredientFormSchema = z.object({
  name: z.string().trim().min(1, 'Name the ingredient.').max(120),
  category: z.enum(INGREDIENT_CATEGORIES, 'Choose a category.'),
  baseUnit: z.enum(BASE_UNITS, 'Choose how it is measured: g, ml or each.'),
  densityGPerMl: optionalDecimal('density', rules.positive),
  yieldPct: decimal('percent', rules.yieldPct),
  allergens: z.array(z.enum(ALLERGEN_CODES)),
  notes: z.string().max(2000),
  costingPack: z.string(),
  packs: z.array(
    z.object({
      id: z.string().optional(),
      supplierId: z.string(),
      description: z.string().trim().min(1, 'Describe the pack, e.g. "Case of 6 × 2 l".').max(200),
      supplierCode: z.string().max(60),
      count: decimal('quantity', rules.positive),
      quantity: decimal('quantity', rules.positive),
      unit: z.enum(UNIT_CODES, 'Choose a unit.'),
      purchaseTaxPct: decimal('percent', rules.nonNegative),
      price: decimal('money', rules.nonNegative),
    }),
  ),
  measures: z.array(z.object({ id: z.string().optional(), name: z.string().trim().min(1, 'Name the measure, e.g. shot or pump.').max(120), quantity: decimal('quantity', rules.positive), unit: z.enum(UNIT_CODES, 'Choose a unit.') })),
});
export type IngredientFormValues = z.input<typeof ingredientFormSchema>;

export const sizeFormSchema = z.object({
  name: z.string().trim().min(1, 'Name the cup size.').max(60),
  volumeMl: decimal('quantity', rules.positive),
});

export const policyFormSchema = z.object({
  policy: pricingPolicySchema.extend({ priceStep: z.string() }),
  overrides: z.array(pricingPolicySchema.extend({ priceStep: z.string(), category: z.string().trim().min(1, 'Name the drink category.').max(60) })),
});
export type PolicyFormValues = z.input<typeof policyFormSchema>;

/** Server field paths ("sizes[0].lines[1].unit") as form field names ("sizes.0.lines.1.unit"). */
export function bracketToDots(path: string): string {
  return path.replace(/\[(\d+)\]/g, '.$1');
}

export const modifierFormSchema = z
  .object({
    name: z.string().trim().min(1, 'Name the modifier, e.g. Extra shot.').max(120),
    kind: z.enum(['add', 'swap'], { error: 'Choose an add-on or a swap.' }),
    upcharge: optionalDecimal('money', rules.nonNegative),
    sizes: z.array(z.object({ sizeId: z.string(), name: z.string(), volumeMl: z.string(), add: z.array(looseLine), remove: z.array(looseLine) })),
  })
  .superRefine((v, ctx) => {
    const counted = v.sizes.reduce((n, s) => n + s.add.length + (v.kind === 'swap' ? s.remove.length : 0), 0);
    if (counted === 0) ctx.addIssue({ code: 'custom', path: ['sizes'], message: 'Add at least one line for one cup size.' });
    v.sizes.forEach((s, i) => {
      const actions = v.kind === 'swap' ? (['remove', 'add'] as const) : (['add'] as const);
      for (const action of actions)
        s[action].forEach((l, j) => {
          const r = line.safeParse(l);
          if (!r.success) for (const issue of r.error.issues) ctx.addIssue({ code: 'custom', path: ['sizes', i, action, j, ...issue.path], message: issue.message });
        });
    });
  });
export type ModifierFormValues = z.input<typeof modifierFormSchema>;
