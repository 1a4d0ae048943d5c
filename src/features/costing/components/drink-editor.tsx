import { useMemo, useState } from 'react';
import { useForm, useWatch, type FieldErrors } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input, Select } from '../../../components/ui/input';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { ALLERGEN_CAUTION } from '../../../shared/allergens';
import { useBuildDetails } from '../api/get-build-details';
import { usePreviewCosting } from '../api/preview-costing';
import { useCreateDrink, useReplaceDrink } from '../api/mutations';
import type { CupSize, Drink, DrinkIn, IngredientSummary, PreparationSummary, PricingPolicyBody } from '../../../shared/contract/costing';
import { bracketToDots, drinkFormSchema, type DrinkFormValues } from '../schemas';
import { AllergenSummary } from './allergens';
import { LinesEditor, type FormLine, type LineErrors } from './lines-editor';
import { fromLineOut, itemIds, lineItems, planPreview, toLineIn } from './preview-request';
import { PreviewError, SizeColumns, SizeHeading } from './size-columns';
import { SizeFigures } from './size-figures';
import { useDebouncedValue } from './use-debounced-value';

function initialValues(sizes: readonly CupSize[], drink: Drink | undefined): DrinkFormValues {
  return {
    name: drink?.name ?? '',
    category: drink?.category ?? '',
    temperature: drink?.temperature ?? 'hot',
    notes: drink?.notes ?? '',
    sizes: sizes.map((s) => {
      const offered = drink?.sizes.find((d) => d.sizeId === s.id);
      return {
        sizeId: s.id,
        name: s.name,
        volumeMl: s.volumeMl,
        offered: drink ? Boolean(offered) : true,
        currentPrice: offered?.currentPrice ?? '',
        lines: offered ? offered.lines.map(fromLineOut) : [],
      };
    }),
  };
}

function toDrinkIn(v: DrinkFormValues): DrinkIn {
  return {
    name: v.name.trim(),
    category: v.category.trim(),
    temperature: v.temperature,
    notes: v.notes.trim() || null,
    sizes: v.sizes
      .filter((s) => s.offered)
      .map((s) => ({ sizeId: s.sizeId, currentPrice: s.currentPrice.trim() || null, lines: s.lines.map((l) => toLineIn(l)!) })),
  };
}

/** The policy that prices this drink: its category's override, else the business's own. */
function policyFor(body: PricingPolicyBody, category: string) {
  return body.overrides.find((o) => o.category === category.trim()) ?? body.policy;
}

/**
 * The drink editor: the cup sizes side by side, each with its build, and the
 * cost per cup, suggested price and margins worked out by the server's preview
 * as you type. Saving sends the whole drink in one request.
 */
export function DrinkEditor({ drink, sizes, ingredients, preparations, pricing, categories, canEdit }: {
  drink?: Drink;
  sizes: CupSize[];
  ingredients: IngredientSummary[];
  preparations: PreparationSummary[];
  pricing: PricingPolicyBody;
  categories: string[];
  canEdit: boolean;
}) {
  const navigate = useNavigate();
  const { notify } = useToast();
  const create = useCreateDrink();
  const replace = useReplaceDrink();
  const [formError, setFormError] = useState<string | null>(null);
  const [copy, setCopy] = useState<{ from: number; to: number } | null>(null);
  const defaults = useMemo(() => initialValues(sizes, drink), [sizes, drink]);
  const form = useForm<DrinkFormValues>({ resolver: zodResolver(drinkFormSchema), defaultValues: defaults });
  const { control, register, handleSubmit, setValue, getValues, setError, reset, formState } = form;
  const errors = formState.errors as FieldErrors<DrinkFormValues>;

  const watched = useWatch({ control }) as DrinkFormValues;
  const settled = useDebouncedValue(watched, 300);
  const offered = (settled.sizes ?? []).filter((s) => s.offered);
  const ids = itemIds(offered.flatMap((s) => s.lines ?? []));
  // Every preparation's detail is loaded up front: the line editor offers their measures (a pump of syrup).
  const details = useBuildDetails(ids.ingredientIds, preparations.map((p) => p.id));
  const policy = policyFor(pricing, settled.category ?? '');
  const plan = planPreview({
    currency: pricing.currency,
    policy,
    sizes: offered.map((s) => ({ name: s.name, currentPrice: s.currentPrice, lines: s.lines ?? [] })),
    details: details.data,
  });
  const preview = usePreviewCosting(plan.request);
  const items = useMemo(() => lineItems(ingredients, preparations, details.data), [ingredients, preparations, details.data]);
  const previewBySize = new Map((preview.data?.sizes ?? []).map((s) => [s.name, s]));
  const previewIsCurrent = plan.request !== null && !preview.isPlaceholderData;
  // Figures are "ready" once they answer what is on screen now, not a build typed a moment ago.
  const ready = JSON.stringify(watched) === JSON.stringify(settled) && !plan.waiting && !preview.isFetching && !details.isFetching;

  const busy = create.isPending || replace.isPending;
  const onSubmit = handleSubmit(async (values) => {
    // Enter in a field while a save is under way presses the page's top Save, which is not busy.
    if (busy) return;
    setFormError(null);
    const body = toDrinkIn(values);
    const offeredIndex = values.sizes.map((s, i) => (s.offered ? i : -1)).filter((i) => i >= 0);
    try {
      const saved = drink ? await replace.mutateAsync({ params: { id: drink.id }, body }) : await create.mutateAsync({ body });
      notify(`${saved.drink.name} saved.`);
      if (!drink) navigate(paths.drink.href(saved.drink.id), { replace: true });
      else reset(initialValues(sizes, saved.drink));
    } catch (err) {
      if (!isApiError(err)) return setFormError('Something went wrong. Try again.');
      let placed = 0;
      for (const [path, message] of Object.entries(err.fields)) {
        // The server numbers only the sizes sent: map them back to the form's columns.
        const m = /^sizes\[(\d+)\](.*)$/.exec(path);
        let name = bracketToDots(path);
        if (m) name = bracketToDots(`sizes[${offeredIndex[Number(m[1])]}]${m[2]}`);
        name = name.replace(/\.(ingredientId|preparationId)$/, '.item').replace(/\.measureId$/, '.unit');
        setError(name as never, { type: 'server', message }, { shouldFocus: placed === 0 });
        placed++;
      }
      if (placed === 0 || err.code !== 'invalid_input') setFormError(err.message);
    }
  });

  const doCopy = (from: number, to: number) => {
    const lines = (getValues(`sizes.${from}.lines`) as FormLine[]).map((l) => ({ ...l }));
    setValue(`sizes.${to}.lines`, lines, { shouldDirty: true });
    setValue(`sizes.${to}.offered`, true, { shouldDirty: true });
    notify(`${getValues(`sizes.${from}.name`)} build copied to ${getValues(`sizes.${to}.name`)}. Adjust the quantities, then save.`);
  };

  const targetPct = policy.targetMarginPct;
  const categoryListId = 'drink-category-options';

  return (
    <form id="drink-form" onSubmit={onSubmit} noValidate className="flex flex-col gap-6">
      <FormMessage>{formError}</FormMessage>
      <Card className="grid gap-4 md:grid-cols-[2fr_1fr_auto]">
        <Field label="Drink name" error={errors.name?.message}>
          <Input autoComplete="off" disabled={!canEdit} {...register('name')} />
        </Field>
        <Field label="Category" hint="Pricing overrides match it." error={errors.category?.message}>
          <Input list={categoryListId} autoComplete="off" disabled={!canEdit} {...register('category')} />
        </Field>
        <datalist id={categoryListId}>
          {categories.map((c) => (
            <option key={c} value={c} />
          ))}
        </datalist>
        <fieldset className="flex flex-col gap-1">
          <legend className="mb-1 text-sm font-medium text-ink">Served</legend>
          <div className="flex gap-4 pt-1 md:mt-6">
            {(['hot', 'iced'] as const).map((t) => (
              <label key={t} className="flex items-center gap-2 text-ink">
                <input type="radio" value={t} className="h-4 w-4 accent-copper" disabled={!canEdit} {...register('temperature')} />
                {t === 'hot' ? 'Hot' : 'Iced'}
              </label>
            ))}
          </div>
        </fieldset>
        <Field label="Notes for the bar" className="md:col-span-3" error={errors.notes?.message}>
          <Input autoComplete="off" disabled={!canEdit} {...register('notes')} />
        </Field>
      </Card>

      <section aria-labelledby="sizes-heading" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="sizes-heading" className="text-lg font-bold">
            Builds by cup size
          </h2>
          <p className="text-sm text-muted">
            Target margin {targetPct} % ({policy.taxMode === 'inclusive' ? `prices include ${policy.taxRatePct} % tax` : `tax of ${policy.taxRatePct} % added at the till`}).
            <span aria-hidden="true">{ready ? '' : ' Updating…'}</span>
          </p>
        </div>
        {errors.sizes?.message && <FormMessage>{errors.sizes.message}</FormMessage>}
        {preview.isError && <PreviewError error={preview.error} />}
        <SizeColumns count={sizes.length}>
            {defaults.sizes.map((size, i) => {
              const isOffered = watched.sizes?.[i]?.offered ?? false;
              const costed = isOffered ? previewBySize.get(size.name) : undefined;
              const problem = plan.problems.get(size.name);
              const sizeErrors = errors.sizes?.[i];
              const lineErrors = (sizeErrors?.lines as unknown as (LineErrors | undefined)[] | undefined) ?? undefined;
              const headingId = `size-${size.sizeId}-heading`;
              return (
                <section key={size.sizeId} aria-labelledby={headingId} className="flex flex-col gap-3 rounded-lg border border-rule bg-card p-4" data-size={size.name}>
                  <div className="flex items-start justify-between gap-2">
                    <SizeHeading id={headingId} name={size.name} volumeMl={size.volumeMl} />
                    <label className="flex items-center gap-2 text-sm text-ink">
                      <input type="checkbox" className="h-4 w-4 accent-copper" disabled={!canEdit} {...register(`sizes.${i}.offered`)} />
                      Offered
                    </label>
                  </div>
                  {isOffered ? (
                    <>
                      <LinesEditor
                        control={control}
                        register={register}
                        setValue={setValue}
                        getValues={getValues}
                        name={`sizes.${i}.lines`}
                        items={items}
                        errors={lineErrors}
                        lineCosts={previewIsCurrent && costed ? costed.lines.map((l) => l.cost) : null}
                        currency={pricing.currency}
                        idPrefix={`size-${i}`}
                        disabled={!canEdit}
                      />
                      {sizeErrors?.lines?.message && <p className="text-sm font-medium text-rose">{sizeErrors.lines.message}</p>}
                      <Field label={`Menu price, ${size.name}`} unit={pricing.currency} error={sizeErrors?.currentPrice?.message}>
                        <Input inputMode="decimal" autoComplete="off" disabled={!canEdit} {...register(`sizes.${i}.currentPrice`)} />
                      </Field>
                      <div aria-live="polite" data-state={ready ? 'ready' : 'updating'} data-figures-for={size.name} className="rounded-md border border-rule bg-paper/50 px-3 py-2">
                        {costed && !problem ? (
                          <SizeFigures
                            cost={costed.cost}
                            suggestedPrice={costed.suggestedPrice}
                            atSuggested={costed.atSuggested}
                            atCurrent={costed.atCurrent}
                            currency={pricing.currency}
                            targetPct={targetPct}
                            testId={`figures-${size.name}`}
                          />
                        ) : (
                          <p className="py-2 text-sm text-muted">{problem ?? 'Working out the cost…'}</p>
                        )}
                      </div>
                      {canEdit && sizes.length > 1 && (
                        <CopyBuild sizeIndex={i} sizes={defaults.sizes.map((s) => s.name)} onCopy={(to) => {
                          const target = getValues(`sizes.${to}.lines`) as FormLine[];
                          if (target.length > 0) setCopy({ from: i, to });
                          else doCopy(i, to);
                        }} />
                      )}
                    </>
                  ) : (
                    <p className="text-sm text-muted">Not offered in this size. Tick “Offered” to build it.</p>
                  )}
                </section>
              );
            })}
        </SizeColumns>
      </section>

      {preview.data && (
        <section aria-labelledby="allergens-heading" className="max-w-3xl">
          <h2 id="allergens-heading" className="mb-2 text-lg font-bold">
            Allergens in this drink
          </h2>
          <AllergenSummary allergens={preview.data.allergens} caution={ALLERGEN_CAUTION} />
        </section>
      )}

      {canEdit && (
        <div className="flex gap-3">
          <Button type="submit" busy={busy}>
            Save drink
          </Button>
        </div>
      )}

      <ConfirmDialog
        open={copy !== null}
        title={copy ? `Replace the ${defaults.sizes[copy.to].name} build?` : ''}
        consequence={copy ? <p>The {defaults.sizes[copy.to].name} lines you have now will be replaced by a copy of the {defaults.sizes[copy.from].name} build. Nothing is saved until you save the drink.</p> : null}
        confirmLabel="Replace the build"
        onCancel={() => setCopy(null)}
        onConfirm={() => {
          if (copy) doCopy(copy.from, copy.to);
          setCopy(null);
        }}
      />
    </form>
  );
}

function CopyBuild({ sizeIndex, sizes, onCopy }: { sizeIndex: number; sizes: string[]; onCopy: (to: number) => void }) {
  const others = sizes.map((name, i) => ({ name, i })).filter((s) => s.i !== sizeIndex);
  const [to, setTo] = useState(String(others[0]?.i ?? ''));
  const id = `copy-${sizeIndex}`;
  return (
    <div className="flex items-end gap-2 border-t border-rule pt-3">
      <div className="min-w-0 flex-1">
        <label htmlFor={id} className="mb-1 block text-xs font-medium text-muted">
          Copy this build to
        </label>
        <Select id={id} value={to} onChange={(e) => setTo(e.target.value)} className="py-1.5">
          {others.map((s) => (
            <option key={s.i} value={s.i}>
              {s.name}
            </option>
          ))}
        </Select>
      </div>
      <Button variant="secondary" size="sm" className="mb-0.5" onClick={() => onCopy(Number(to))}>
        Copy<span className="sr-only"> the {sizes[sizeIndex]} build</span>
      </Button>
    </div>
  );
}
