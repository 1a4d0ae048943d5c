import { useState } from 'react';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useNavigate } from 'react-router-dom';
import { Button, TextLink } from '../../../components/ui/button';
import { CardSection } from '../../../components/ui/card';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input, Select } from '../../../components/ui/input';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { formatDate, formatMoney } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { ALLERGEN_CAUTION, ALLERGEN_CODES, ALLERGENS } from '../../../shared/allergens';
import { UNIT_CODES } from '../../../shared/units';
import { useCreateIngredient, useUpdateIngredient, type IngredientValues } from '../api/save-ingredient';
import type { IngredientDetail } from '../../../shared/contract/costing';
import type { Supplier } from '../../../shared/contract/suppliers';
import { bracketToDots, ingredientFormSchema, type IngredientFormValues } from '../schemas';
import { AllergenCaution } from './allergens';
import { CategoryOptions, UnitOptions } from './options';
import { BASE_UNIT_LABELS, unitsFor } from './units';

function initial(i?: IngredientDetail): IngredientFormValues {
  const costingIndex = i?.costingPackId ? i.packs.findIndex((p) => p.id === i.costingPackId) : -1;
  return {
    name: i?.name ?? '',
    category: i?.category ?? 'other',
    baseUnit: i?.baseUnit ?? 'g',
    densityGPerMl: i?.densityGPerMl ?? '',
    yieldPct: i?.yieldPct ?? '100',
    allergens: i?.allergens ?? [],
    notes: i?.notes ?? '',
    costingPack: costingIndex >= 0 ? String(costingIndex) : '',
    packs: (i?.packs ?? []).map((p) => ({
      id: p.id,
      supplierId: p.supplierId ?? '',
      description: p.description,
      supplierCode: p.supplierCode ?? '',
      count: p.count,
      quantity: p.quantity,
      unit: p.unit,
      purchaseTaxPct: p.purchaseTaxPct ?? '0',
      price: p.price ?? '',
    })),
    measures: (i?.measures ?? []).map((m) => ({ id: m.id, name: m.name, quantity: m.quantity, unit: m.unit })),
  };
}

function toValues(v: IngredientFormValues): IngredientValues {
  return {
    name: v.name.trim(),
    category: v.category,
    baseUnit: v.baseUnit,
    densityGPerMl: v.densityGPerMl || null,
    yieldPct: v.yieldPct,
    allergens: v.allergens,
    notes: v.notes.trim() || null,
    costingPackIndex: v.costingPack === '' ? null : Number(v.costingPack),
    packs: v.packs.map((p) => ({ ...p, supplierId: p.supplierId || null, supplierCode: p.supplierCode.trim() || null })),
    measures: v.measures,
  };
}

/** Add or edit an ingredient with its packs (what each supplier sells, at what price), measures and allergens. */
export function IngredientForm({ ingredient, suppliers, currency, canEdit }: { ingredient?: IngredientDetail; suppliers: Supplier[]; currency: string; canEdit: boolean }) {
  const navigate = useNavigate();
  const { notify } = useToast();
  const create = useCreateIngredient();
  const update = useUpdateIngredient();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, reset, formState: { errors } } = useForm<IngredientFormValues>({
    resolver: zodResolver(ingredientFormSchema),
    defaultValues: initial(ingredient),
  });
  const packs = useFieldArray({ control, name: 'packs' });
  const measures = useFieldArray({ control, name: 'measures' });
  const baseUnit = useWatch({ control, name: 'baseUnit' });
  const density = useWatch({ control, name: 'densityGPerMl' });
  const packValues = useWatch({ control, name: 'packs' });
  const units = unitsFor(baseUnit, density);

  const onSubmit = handleSubmit(async (v) => {
    // Enter in a field while a save is under way would send it again (a page's other Save is not the busy one).
    if (create.isPending || update.isPending) return;
    setFormError(null);
    try {
      const saved = ingredient ? await update.mutateAsync({ original: ingredient, values: toValues(v) }) : await create.mutateAsync(toValues(v));
      notify(`${saved.ingredient.name} saved.`);
      if (!ingredient) navigate(paths.ingredient.href(saved.ingredient.id), { replace: true });
      else reset(initial(saved.ingredient));
    } catch (err) {
      if (!isApiError(err)) return setFormError('Something went wrong. Try again.');
      const entries = Object.entries(err.fields);
      entries.forEach(([path, message], i) => setError(bracketToDots(path) as never, { type: 'server', message }, { shouldFocus: i === 0 }));
      if (entries.length === 0) setFormError(err.status === 409 ? 'An ingredient with that name already exists.' : err.message);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-6" id="ingredient-form">
      <FormMessage>{formError}</FormMessage>
      <fieldset disabled={!canEdit} className="contents">
        <CardSection title="The ingredient">
          <div className="grid gap-4 md:grid-cols-2">
            <Field label="Name" error={errors.name?.message}>
              <Input autoComplete="off" {...register('name')} />
            </Field>
            <Field label="Category" error={errors.category?.message}>
              <Select {...register('category')}>
                <CategoryOptions />
              </Select>
            </Field>
            <Field label="Measured in" hint="Costs are worked out per gram, millilitre or item." error={errors.baseUnit?.message}>
              <Select {...register('baseUnit')}>
                {(['g', 'ml', 'each'] as const).map((u) => (
                  <option key={u} value={u}>
                    {BASE_UNIT_LABELS[u]}
                  </option>
                ))}
              </Select>
            </Field>
            <Field label="Density (optional)" unit="g per ml" hint="Lets builds use it by weight and by volume." error={errors.densityGPerMl?.message}>
              <Input inputMode="decimal" autoComplete="off" {...register('densityGPerMl')} />
            </Field>
            <Field label="Yield" unit="%" hint="The usable share after waste: milk left in the pitcher, purge, residue." error={errors.yieldPct?.message}>
              <Input inputMode="decimal" autoComplete="off" {...register('yieldPct')} />
            </Field>
            <Field label="Notes" error={errors.notes?.message}>
              <Input autoComplete="off" {...register('notes')} />
            </Field>
          </div>
        </CardSection>

        <CardSection title="Allergens">
          <div className="grid gap-6 lg:grid-cols-[1fr_22rem]">
            <fieldset>
              <legend className="mb-2 text-sm text-muted">Tick each of the 14 listed allergens this ingredient contains, from the supplier’s specification.</legend>
              <div className="grid gap-2 sm:grid-cols-2">
                {ALLERGEN_CODES.map((code) => (
                  <label key={code} className="flex items-start gap-2 text-ink">
                    <input type="checkbox" value={code} className="mt-1 h-4 w-4 shrink-0 accent-copper" {...register('allergens')} />
                    {ALLERGENS[code]}
                  </label>
                ))}
              </div>
            </fieldset>
            <AllergenCaution text={ALLERGEN_CAUTION} />
          </div>
        </CardSection>

        <CardSection title="Packs and prices">
          <p className="mb-4 text-sm text-muted">
            What each supplier sells: how many in the case, how much in each, and the price before tax. A changed price is kept as a new dated price.
            {suppliers.length === 0 && (
              <>
                {' '}No suppliers yet: <TextLink to={paths.suppliers.href()}>add one</TextLink>, or leave the supplier blank.
              </>
            )}
          </p>
          <ol className="flex flex-col gap-4">
            {packs.fields.map((f, i) => {
              const e = errors.packs?.[i];
              const old = ingredient?.packs.find((p) => p.id === packValues?.[i]?.id);
              return (
                <li key={f.id} className="rounded-md border border-rule bg-paper/50 p-3" aria-label={`Pack ${i + 1}`}>
                  <div className="grid gap-3 md:grid-cols-[2fr_1fr_1fr]">
                    <Field label="Description" error={e?.description?.message}>
                      <Input autoComplete="off" {...register(`packs.${i}.description`)} />
                    </Field>
                    <Field label="Supplier" error={e?.supplierId?.message}>
                      <Select {...register(`packs.${i}.supplierId`)}>
                        <option value="">No supplier</option>
                        {suppliers.map((s) => (
                          <option key={s.id} value={s.id}>
                            {s.name}
                          </option>
                        ))}
                      </Select>
                    </Field>
                    <Field label="Supplier’s code" error={e?.supplierCode?.message}>
                      <Input autoComplete="off" {...register(`packs.${i}.supplierCode`)} />
                    </Field>
                  </div>
                  <div className="mt-3 grid items-start gap-3 sm:grid-cols-2 md:grid-cols-[7rem_auto_8rem_9rem_9rem_9rem]">
                    <Field label="Count" error={e?.count?.message}>
                      <Input inputMode="decimal" autoComplete="off" {...register(`packs.${i}.count`)} />
                    </Field>
                    <span aria-hidden="true" className="hidden pt-8 text-muted md:block">
                      ×
                    </span>
                    <Field label="Quantity each" error={e?.quantity?.message}>
                      <Input inputMode="decimal" autoComplete="off" {...register(`packs.${i}.quantity`)} />
                    </Field>
                    <Field label="Unit" error={e?.unit?.message}>
                      <Select {...register(`packs.${i}.unit`)}>
                        <UnitOptions units={units} />
                      </Select>
                    </Field>
                    <Field label="Price before tax" unit={currency} error={e?.price?.message}>
                      <Input inputMode="decimal" autoComplete="off" {...register(`packs.${i}.price`)} />
                    </Field>
                    <Field label="Purchase tax" unit="%" error={e?.purchaseTaxPct?.message}>
                      <Input inputMode="decimal" autoComplete="off" {...register(`packs.${i}.purchaseTaxPct`)} />
                    </Field>
                  </div>
                  <div className="mt-2 flex flex-wrap items-center justify-between gap-2 text-sm text-muted">
                    <span>
                      {old?.priceFrom && old.price ? `Price in force since ${formatDate(old.priceFrom)}.` : 'New pack: priced from today.'}
                      {old?.plannedPrices.map((p) => ` Planned: ${formatMoney(p.price, currency)} from ${formatDate(p.effectiveFrom)}.`)}
                    </span>
                    <Button variant="quiet" size="sm" onClick={() => packs.remove(i)}>
                      Remove pack {i + 1}
                    </Button>
                  </div>
                </li>
              );
            })}
          </ol>
          <div className="mt-4 flex flex-wrap items-end gap-4">
            <Button
              variant="secondary"
              onClick={() => packs.append({ supplierId: '', description: '', supplierCode: '', count: '1', quantity: '', unit: baseUnit === 'each' ? 'each' : baseUnit === 'ml' ? 'l' : 'kg', purchaseTaxPct: '0', price: '' })}
            >
              Add a pack
            </Button>
            {packs.fields.length > 1 && (
              <Field label="Pack that sets the cost" className="w-72">
                <Select {...register('costingPack')}>
                  <option value="">The most recently priced</option>
                  {packs.fields.map((f, i) => (
                    <option key={f.id} value={String(i)}>
                      Pack {i + 1}: {packValues?.[i]?.description || 'not described yet'}
                    </option>
                  ))}
                </Select>
              </Field>
            )}
          </div>
        </CardSection>

        <CardSection title="Measures">
          <p className="mb-4 text-sm text-muted">Named portions that builds can use, such as a shot of 9 g or a pump of 7.5 ml.</p>
          <ol className="flex flex-col gap-3">
            {measures.fields.map((f, i) => {
              const e = errors.measures?.[i];
              return (
                <li key={f.id} className="grid items-start gap-3 sm:grid-cols-[1fr_8rem_8rem_auto]" aria-label={`Measure ${i + 1}`}>
                  <Field label="Measure name" error={e?.name?.message}>
                    <Input autoComplete="off" {...register(`measures.${i}.name`)} />
                  </Field>
                  <Field label="Quantity" error={e?.quantity?.message}>
                    <Input inputMode="decimal" autoComplete="off" {...register(`measures.${i}.quantity`)} />
                  </Field>
                  <Field label="Unit" error={e?.unit?.message}>
                    <Select {...register(`measures.${i}.unit`)}>
                      <UnitOptions units={units.length ? units : UNIT_CODES} />
                    </Select>
                  </Field>
                  <Button variant="quiet" size="sm" className="sm:mt-7" onClick={() => measures.remove(i)}>
                    Remove<span className="sr-only"> measure {i + 1}</span>
                  </Button>
                </li>
              );
            })}
          </ol>
          <Button variant="secondary" className="mt-4" onClick={() => measures.append({ name: '', quantity: '', unit: baseUnit })}>
            Add a measure
          </Button>
        </CardSection>
      </fieldset>
      {canEdit && (
        <div>
          <Button type="submit" busy={create.isPending || update.isPending}>
            Save ingredient
          </Button>
        </div>
      )}
    </form>
  );
}
