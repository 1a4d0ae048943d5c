import { useMemo, useState } from 'react';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { CardSection } from '../../../components/ui/card';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input, Select, TextArea } from '../../../components/ui/input';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { formatMoney } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { ALLERGEN_CAUTION } from '../../../shared/allergens';
import type { PreparationInput } from '../../../shared/costing';
import { UNIT_CODES, baseUnitOf, type UnitCode } from '../../../shared/units';
import { useBuildDetails } from '../api/get-build-details';
import { usePreviewCosting } from '../api/preview-costing';
import { useCreatePreparation, useReplacePreparation } from '../api/mutations';
import type { IngredientSummary, PreparationDetail, PreparationSummary, PricingPolicyBody } from '../../../shared/contract/costing';
import { bracketToDots, preparationFormSchema, type PreparationFormValues } from '../schemas';
import { AllergenSummary } from './allergens';
import { LinesEditor, type LineErrors } from './lines-editor';
import { fromLineOut, itemIds, lineItems, planPreview, toLineIn } from './preview-request';
import { UnitOptions } from './options';
import { useDebouncedValue } from './use-debounced-value';

const SELF = 'preparation-being-edited';

function initial(p?: PreparationDetail): PreparationFormValues {
  return {
    name: p?.name ?? '',
    yieldQuantity: p?.yield.quantity ?? '',
    yieldUnit: p?.yield.unit ?? 'l',
    densityGPerMl: p?.densityGPerMl ?? '',
    method: p?.method ?? '',
    lines: (p?.lines ?? []).map(fromLineOut),
    measures: (p?.measures ?? []).map((m) => ({ id: m.id, name: m.name, quantity: m.quantity, unit: m.unit })),
  };
}

/** A preparation made in house: its lines and yield, with the cost per batch and per unit as you type. */
export function PreparationEditor({ preparation, ingredients, preparations, pricing, canEdit }: {
  preparation?: PreparationDetail;
  ingredients: IngredientSummary[];
  preparations: PreparationSummary[];
  pricing: PricingPolicyBody;
  canEdit: boolean;
}) {
  const navigate = useNavigate();
  const { notify } = useToast();
  const create = useCreatePreparation();
  const replace = useReplacePreparation();
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<PreparationFormValues>({ resolver: zodResolver(preparationFormSchema), defaultValues: initial(preparation) });
  const { control, register, handleSubmit, setValue, getValues, setError, reset, formState: { errors } } = form;
  const measures = useFieldArray({ control, name: 'measures' });
  const watched = useWatch({ control }) as PreparationFormValues;
  const settled = useDebouncedValue(watched, 300);
  // A preparation cannot contain itself: leave it out of its own item list.
  const others = preparations.filter((p) => p.id !== preparation?.id);
  const ids = itemIds(settled.lines ?? []);
  const details = useBuildDetails(ids.ingredientIds, others.map((p) => p.id));
  const items = useMemo(() => lineItems(ingredients, others, details.data), [ingredients, others, details.data]);
  const currency = pricing.currency;

  // The preparation as typed, costed by the preview: one "size" for the batch, one per base unit, one per line.
  const plan = useMemo(() => {
    const lines = settled.lines ?? [];
    const yieldUnit = settled.yieldUnit as UnitCode;
    const self: PreparationInput | null = (() => {
      const out = [];
      for (const l of lines) {
        const line = toLineIn(l);
        if (!line) return null;
        const item = details.data && (line.ingredientId ? details.data.ingredients.get(line.ingredientId) : details.data.preparations.get(line.preparationId!));
        const unit = line.measureId ? item?.measures.find((m) => m.id === line.measureId)?.name : line.unit;
        if (!unit) return null;
        out.push({ item: (line.ingredientId ?? line.preparationId)!, quantity: line.quantity, unit });
      }
      return { key: SELF, yield: { quantity: settled.yieldQuantity, unit: yieldUnit }, densityGPerMl: settled.densityGPerMl || null, lines: out };
    })();
    if (!self || !UNIT_CODES.includes(yieldUnit) || lines.length === 0 || lines.length > 18) return null;
    const item = `p:${SELF}`;
    return planPreview({
      currency,
      policy: pricing.policy,
      details: details.data,
      extraPreparations: [self],
      sizes: [
        { name: 'batch', lines: [{ item, quantity: settled.yieldQuantity, unit: `u:${yieldUnit}` }] },
        { name: 'unit', lines: [{ item, quantity: '1', unit: `u:${baseUnitOf(yieldUnit)}` }] },
        ...lines.map((l, j) => ({ name: `line-${j}`, lines: [l] })),
      ],
    });
  }, [settled, details.data, currency, pricing.policy]);
  const preview = usePreviewCosting(plan?.request ?? null);
  const bySize = new Map((preview.data?.sizes ?? []).map((s) => [s.name, s]));
  const current = plan?.request != null && !preview.isPlaceholderData;
  const batch = current ? bySize.get('batch') : undefined;
  const unit = current ? bySize.get('unit') : undefined;
  const yieldUnit = (watched.yieldUnit ?? 'l') as UnitCode;

  const onSubmit = handleSubmit(async (v) => {
    // Enter in a field while a save is under way would send it again (a page's other Save is not the busy one).
    if (create.isPending || replace.isPending) return;
    setFormError(null);
    const body = {
      name: v.name.trim(),
      yield: { quantity: v.yieldQuantity, unit: v.yieldUnit as UnitCode },
      densityGPerMl: v.densityGPerMl || null,
      method: v.method.trim() || null,
      lines: v.lines.map((l) => toLineIn(l)!),
      measures: v.measures.map(({ name, quantity, unit }) => ({ name, quantity, unit: unit as UnitCode })),
    };
    try {
      const saved = preparation ? await replace.mutateAsync({ params: { id: preparation.id }, body }) : await create.mutateAsync({ body });
      notify(`${saved.preparation.name} saved.`);
      if (!preparation) navigate(paths.preparation.href(saved.preparation.id), { replace: true });
      else reset(initial(saved.preparation));
    } catch (err) {
      if (!isApiError(err)) return setFormError('Something went wrong. Try again.');
      const entries = Object.entries(err.fields);
      entries.forEach(([path, message], i) => {
        const name = bracketToDots(path).replace(/\.(ingredientId|preparationId)$/, '.item').replace(/\.measureId$/, '.unit').replace(/^yield\.quantity$/, 'yieldQuantity').replace(/^yield\.unit$/, 'yieldUnit');
        setError(name as never, { type: 'server', message }, { shouldFocus: i === 0 });
      });
      if (entries.length === 0) setFormError(err.status === 409 ? 'A preparation with that name already exists.' : err.message);
    }
  });

  return (
    <form id="preparation-form" onSubmit={onSubmit} noValidate className="grid gap-6 lg:grid-cols-[1fr_22rem]">
      <div className="flex flex-col gap-6">
        <FormMessage>{formError}</FormMessage>
        <CardSection title="The preparation">
          <div className="grid gap-4 md:grid-cols-[2fr_1fr_1fr]">
            <Field label="Name" error={errors.name?.message}>
              <Input autoComplete="off" disabled={!canEdit} {...register('name')} />
            </Field>
            <Field label="One batch makes" error={errors.yieldQuantity?.message}>
              <Input inputMode="decimal" autoComplete="off" disabled={!canEdit} {...register('yieldQuantity')} />
            </Field>
            <Field label="Unit of the yield" error={errors.yieldUnit?.message}>
              <Select disabled={!canEdit} {...register('yieldUnit')}>
                <UnitOptions units={UNIT_CODES} />
              </Select>
            </Field>
            <Field label="Density (optional)" unit="g per ml" hint="Only if builds use it by weight but it yields a volume, or the reverse." className="md:col-span-3" error={errors.densityGPerMl?.message}>
              <Input inputMode="decimal" autoComplete="off" disabled={!canEdit} {...register('densityGPerMl')} />
            </Field>
            <Field label="Method" className="md:col-span-3" error={errors.method?.message}>
              <TextArea rows={3} disabled={!canEdit} {...register('method')} />
            </Field>
          </div>
        </CardSection>
        <CardSection title="What goes into one batch">
          <LinesEditor
            control={control}
            register={register}
            setValue={setValue}
            getValues={getValues}
            name="lines"
            items={items}
            errors={errors.lines as unknown as (LineErrors | undefined)[] | undefined}
            lineCosts={current ? (settled.lines ?? []).map((_, j) => bySize.get(`line-${j}`)?.cost ?? null) : null}
            currency={currency}
            idPrefix="prep"
            disabled={!canEdit}
          />
          {errors.lines?.message && <p className="mt-2 text-sm font-medium text-rose">{errors.lines.message}</p>}
        </CardSection>
        <CardSection title="Measures">
          <p className="mb-4 text-sm text-muted">Portions builds can use, such as a pump of 7.5 ml.</p>
          <ol className="flex flex-col gap-3">
            {measures.fields.map((f, i) => (
              <li key={f.id} className="grid items-start gap-3 sm:grid-cols-[1fr_8rem_8rem_auto]">
                <Field label="Measure name" error={errors.measures?.[i]?.name?.message}>
                  <Input autoComplete="off" disabled={!canEdit || Boolean(f.id && preparation?.measures.some((m) => m.id === getValues(`measures.${i}.id`)))} {...register(`measures.${i}.name`)} />
                </Field>
                <Field label="Quantity" error={errors.measures?.[i]?.quantity?.message}>
                  <Input inputMode="decimal" autoComplete="off" disabled={!canEdit} {...register(`measures.${i}.quantity`)} />
                </Field>
                <Field label="Unit" error={errors.measures?.[i]?.unit?.message}>
                  <Select disabled={!canEdit} {...register(`measures.${i}.unit`)}>
                    <UnitOptions units={UNIT_CODES} />
                  </Select>
                </Field>
                {!getValues(`measures.${i}.id`) && (
                  <Button variant="quiet" size="sm" className="sm:mt-7" onClick={() => measures.remove(i)}>
                    Remove<span className="sr-only"> measure {i + 1}</span>
                  </Button>
                )}
              </li>
            ))}
          </ol>
          {canEdit && (
            <Button variant="secondary" className="mt-4" onClick={() => measures.append({ name: '', quantity: '', unit: baseUnitOf(yieldUnit) })}>
              Add a measure
            </Button>
          )}
        </CardSection>
        {canEdit && (
          <div>
            <Button type="submit" busy={create.isPending || replace.isPending}>
              Save preparation
            </Button>
          </div>
        )}
      </div>
      <aside className="flex flex-col gap-4 lg:sticky lg:top-20 lg:self-start" aria-label="Cost of the preparation">
        <div className="rounded-lg border border-rule bg-card p-4" aria-live="polite">
          <h2 className="mb-2 text-lg font-bold">Cost</h2>
          {batch && unit ? (
            <dl className="divide-y divide-rule text-sm">
              <div className="flex justify-between gap-3 py-1.5">
                <dt className="text-muted">Per batch</dt>
                <dd className="text-right text-base font-bold tabular-nums" data-figure="batch">
                  {formatMoney(batch.cost, currency, { detail: true })}
                </dd>
              </div>
              <div className="flex justify-between gap-3 py-1.5">
                <dt className="text-muted">Per {baseUnitOf(yieldUnit)}</dt>
                <dd className="text-right text-base font-bold tabular-nums" data-figure="unit">
                  {formatMoney(unit.cost, currency, { detail: true })}
                </dd>
              </div>
            </dl>
          ) : (
            <p className="text-sm text-muted">
              {preview.isError
                ? `The cost could not be worked out: ${Object.values(isApiError(preview.error) ? preview.error.fields : {})[0] ?? (preview.error as Error).message}`
                : [...(plan?.problems.values() ?? [])][0] ?? 'Enter the yield and complete every line to see the cost.'}
            </p>
          )}
        </div>
        {preview.data && current && (
          <div className="rounded-lg border border-rule bg-card p-4">
            <h2 className="mb-2 text-lg font-bold">Allergens</h2>
            <AllergenSummary allergens={preview.data.allergens} caution={ALLERGEN_CAUTION} />
          </div>
        )}
      </aside>
    </form>
  );
}
