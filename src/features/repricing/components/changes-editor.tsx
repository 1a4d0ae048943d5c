import { zodResolver } from '@hookform/resolvers/zod';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { Input, Select } from '../../../components/ui/input';
import { formatMoney } from '../../../lib/format';
import { priceChangeSchema } from '../../../shared/schemas/repricing';
import type { IngredientChoice } from '../api/get-ingredients';
import type { PriceChange } from '../api/types';

const formSchema = z.object({
  changes: z.array(priceChangeSchema.extend({ ingredientId: z.string().min(1, 'Choose an ingredient.') })),
  asOf: z.string().optional(),
});
type FormValues = z.input<typeof formSchema>;

interface Props {
  ingredients: IngredientChoice[];
  currency: string;
  initial: { changes: PriceChange[]; asOf?: string };
  busy?: boolean;
  onSubmit: (v: { changes: PriceChange[]; asOf?: string }) => void;
  onIngredientSeen?: (packId: string | null) => void;
}

/** The proposed pack price changes: several at once, each the new price of an ingredient's costing pack. */
export function ChangesEditor({ ingredients, currency, initial, busy, onSubmit, onIngredientSeen }: Props) {
  const form = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    values: { changes: initial.changes.length ? initial.changes : [{ ingredientId: '', newPrice: '' }], asOf: initial.asOf ?? '' },
  });
  const { fields, append, remove } = useFieldArray({ control: form.control, name: 'changes' });
  const priced = ingredients.filter((i) => i.costingPack?.price);
  const byId = new Map(ingredients.map((i) => [i.id, i]));
  const watched = useWatch({ control: form.control, name: 'changes' });

  return (
    <form
      noValidate
      onSubmit={form.handleSubmit((v) => onSubmit({ changes: v.changes as PriceChange[], asOf: v.asOf || undefined }))}
      className="flex flex-col gap-4"
    >
      <ol className="flex flex-col gap-3">
        {fields.map((f, i) => {
          const ing = byId.get(watched?.[i]?.ingredientId ?? '');
          const errors = form.formState.errors.changes?.[i];
          return (
            <li key={f.id} className="grid gap-3 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)_auto] sm:items-start">
              <Field label="Ingredient" error={errors?.ingredientId?.message} hint={ing?.costingPack ? `${ing.costingPack.description}${ing.costingPack.supplierName ? ` from ${ing.costingPack.supplierName}` : ''}: now ${formatMoney(ing.costingPack.price ?? '0', currency)} a pack` : 'The price of its costing pack changes.'}>
                <Select
                  {...form.register(`changes.${i}.ingredientId`, { onChange: (e) => onIngredientSeen?.(byId.get(e.target.value)?.costingPack?.id ?? null) })}
                >
                  <option value="">Choose an ingredient…</option>
                  {priced.map((x) => (
                    <option key={x.id} value={x.id}>
                      {x.name}
                    </option>
                  ))}
                </Select>
              </Field>
              <Field label="New pack price" unit={`${currency} a pack, before tax`} error={errors?.newPrice?.message}>
                <Input inputMode="decimal" autoComplete="off" {...form.register(`changes.${i}.newPrice`)} />
              </Field>
              <div className="sm:pt-7">
                <Button variant="quiet" size="sm" onClick={() => remove(i)} disabled={fields.length === 1} aria-label={`Remove change ${i + 1}`}>
                  Remove
                </Button>
              </div>
            </li>
          );
        })}
      </ol>
      <div className="flex flex-wrap items-end gap-4">
        <Button variant="secondary" size="sm" onClick={() => append({ ingredientId: '', newPrice: '' })}>
          Add another change
        </Button>
        <Field label="Cost with pack prices in force on" hint="Leave empty for today; a later date includes planned prices." className="w-64">
          <Input type="date" {...form.register('asOf')} />
        </Field>
        <Button type="submit" busy={busy}>
          See the impact
        </Button>
      </div>
    </form>
  );
}
