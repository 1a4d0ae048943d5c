import { useMemo, useState } from 'react';
import { useForm, useWatch, type FieldErrors } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input } from '../../../components/ui/input';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { formatMoney } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { ALLERGEN_CAUTION } from '../../../shared/allergens';
import { isDecimalString } from '../../../shared/decimal';
import { useBuildDetails } from '../api/get-build-details';
import { usePreviewCosting } from '../api/preview-costing';
import { useCreateModifier, useDeleteModifier, useReplaceModifier } from '../api/mutations';
import type { CupSize, IngredientSummary, Modifier, ModifierIn, PreparationSummary, PricingPolicyBody } from '../../../shared/contract/costing';
import { bracketToDots, modifierFormSchema, type ModifierFormValues } from '../schemas';
import { AllergenSummary } from './allergens';
import { LinesEditor, type LineErrors } from './lines-editor';
import { kindLabels } from './modifiers-table';
import { fromLineOut, itemIds, lineItems, planPreview, toLineIn } from './preview-request';
import { PreviewError, SizeColumns, SizeHeading } from './size-columns';
import { FigureMark } from './size-figures';
import { UpchargeMark, upchargeStatus } from './upcharge-mark';
import { useDebouncedValue } from './use-debounced-value';

type Action = 'add' | 'remove';

function initialValues(sizes: readonly CupSize[], modifier: Modifier | undefined): ModifierFormValues {
  return {
    name: modifier?.name ?? '',
    kind: modifier?.kind ?? 'add',
    upcharge: modifier?.upcharge ?? '',
    sizes: sizes.map((s) => {
      const lines = modifier?.sizes.find((m) => m.sizeId === s.id)?.lines ?? [];
      return {
        sizeId: s.id,
        name: s.name,
        volumeMl: s.volumeMl,
        add: lines.filter((l) => l.action === 'add').map(fromLineOut),
        remove: lines.filter((l) => l.action === 'remove').map(fromLineOut),
      };
    }),
  };
}

/** The actions a kind of modifier has: an add-on only puts in; a swap takes out, then puts in. */
const actionsOf = (kind: string | undefined): Action[] => (kind === 'swap' ? ['remove', 'add'] : ['add']);

/** The body of one POST/PUT, and for each line sent the form path it came from (to place the server's field errors). */
function toModifierIn(v: ModifierFormValues): { body: ModifierIn; origins: string[] } {
  const origins: string[] = [];
  const lines: ModifierIn['lines'] = [];
  v.sizes.forEach((s, i) => {
    for (const action of actionsOf(v.kind))
      s[action].forEach((l, j) => {
        lines.push({ sizeId: s.sizeId, action, ...toLineIn(l)! });
        origins.push(`sizes.${i}.${action}.${j}`);
      });
  });
  return { body: { name: v.name.trim(), kind: v.kind, upcharge: v.upcharge.trim() || null, lines }, origins };
}

const sectionLabels: Record<Action, { add: string; swap: string }> = {
  remove: { add: '', swap: 'Takes out' },
  add: { add: 'Adds', swap: 'Puts in' },
};

/**
 * An add-on or swap, per cup size: what it takes out of the build and what it
 * puts in. The cost of each side follows as you type; the extra cost and the
 * upcharge that keeps the target margin are the server's, for what is saved.
 */
export function ModifierEditor({ modifier, sizes, ingredients, preparations, pricing, canEdit }: {
  modifier?: Modifier;
  sizes: CupSize[];
  ingredients: IngredientSummary[];
  preparations: PreparationSummary[];
  pricing: PricingPolicyBody;
  canEdit: boolean;
}) {
  const navigate = useNavigate();
  const { notify } = useToast();
  const create = useCreateModifier();
  const replace = useReplaceModifier();
  const remove = useDeleteModifier();
  const [formError, setFormError] = useState<string | null>(null);
  const [confirmDelete, setConfirmDelete] = useState(false);
  const defaults = useMemo(() => initialValues(sizes, modifier), [sizes, modifier]);
  const form = useForm<ModifierFormValues>({ resolver: zodResolver(modifierFormSchema), defaultValues: defaults });
  const { control, register, handleSubmit, setValue, getValues, setError, reset, formState } = form;
  const errors = formState.errors as FieldErrors<ModifierFormValues>;
  const currency = pricing.currency;

  const watched = useWatch({ control }) as ModifierFormValues;
  const settled = useDebouncedValue(watched, 300);
  const actions = actionsOf(watched.kind);
  const settledActions = actionsOf(settled.kind);
  const allLines = (settled.sizes ?? []).flatMap((s) => settledActions.flatMap((a) => s[a] ?? []));
  const ids = itemIds(allLines);
  // Every preparation's detail up front: the line editor offers their measures (a pump of syrup).
  const details = useBuildDetails(ids.ingredientIds, preparations.map((p) => p.id));
  const items = useMemo(() => lineItems(ingredients, preparations, details.data), [ingredients, preparations, details.data]);
  // Each side of each size is previewed as a "size" of its own: its cost and its line costs.
  const plan = planPreview({
    currency,
    policy: pricing.policy,
    details: details.data,
    sizes: (settled.sizes ?? []).flatMap((s) => settledActions.filter((a) => (s[a] ?? []).length > 0).map((a) => ({ name: `${s.sizeId}:${a}`, lines: s[a] ?? [] }))),
  });
  const preview = usePreviewCosting(plan.request);
  const current = plan.request !== null && !preview.isPlaceholderData;
  const costed = new Map((current ? (preview.data?.sizes ?? []) : []).map((s) => [s.name, s]));
  const saved = new Map((modifier?.sizes ?? []).map((s) => [s.sizeId, s]));
  const showSaved = Boolean(modifier) && !formState.isDirty;
  // Live figures answer what is on screen now, not lines typed a moment ago.
  const ready = current && JSON.stringify(watched) === JSON.stringify(settled) && !plan.waiting && !preview.isFetching && !details.isFetching;

  const onSubmit = handleSubmit(async (values) => {
    // Enter in a field while a save is under way would send it again (a page's other Save is not the busy one).
    if (create.isPending || replace.isPending) return;
    setFormError(null);
    const { body, origins } = toModifierIn(values);
    try {
      const out = modifier ? await replace.mutateAsync({ params: { id: modifier.id }, body }) : await create.mutateAsync({ body });
      notify(`${out.modifier.name} saved.`);
      if (!modifier) navigate(paths.modifier.href(out.modifier.id), { replace: true });
      else reset(initialValues(sizes, out.modifier));
    } catch (err) {
      if (!isApiError(err)) return setFormError('Something went wrong. Try again.');
      let placed = 0;
      const loose: string[] = [];
      for (const [path, message] of Object.entries(err.fields)) {
        const m = /^lines\[(\d+)\]\.(\w+)$/.exec(path);
        let name: string | null = bracketToDots(path);
        if (m) {
          const field = { ingredientId: 'item', preparationId: 'item', measureId: 'unit', unit: 'unit', quantity: 'quantity' }[m[2]];
          name = field && origins[Number(m[1])] ? `${origins[Number(m[1])]}.${field}` : null;
        }
        if (name === null || !['name', 'kind', 'upcharge'].some((f) => name === f || name!.startsWith('sizes.'))) {
          loose.push(message);
          continue;
        }
        setError(name as never, { type: 'server', message }, { shouldFocus: placed === 0 });
        placed++;
      }
      if (loose.length > 0) setFormError(loose.join(' '));
      else if (placed === 0) setFormError(err.status === 409 ? 'A modifier with that name already exists.' : err.message);
    }
  });

  const onDelete = async () => {
    if (!modifier) return;
    try {
      await remove.mutateAsync({ params: { id: modifier.id } });
      notify(`${modifier.name} deleted.`);
      navigate(paths.modifiers.href(), { replace: true });
    } catch {
      // The dialog shows the mutation's error.
    }
  };

  const policy = pricing.policy;
  const offeredIn = (modifier?.sizes ?? []).map((s) => s.name);

  return (
    <form id="modifier-form" onSubmit={onSubmit} noValidate className="flex flex-col gap-6">
      <FormMessage>{formError}</FormMessage>
      <Card className="grid gap-4 md:grid-cols-[2fr_auto_1fr]">
        <Field label="Modifier name" error={errors.name?.message}>
          <Input autoComplete="off" disabled={!canEdit} {...register('name')} />
        </Field>
        <fieldset className="flex flex-col gap-1">
          <legend className="mb-1 text-sm font-medium text-ink">Kind</legend>
          <div className="flex gap-4 pt-1 md:mt-6">
            {(['add', 'swap'] as const).map((k) => (
              <label key={k} className="flex items-center gap-2 text-ink">
                <input type="radio" value={k} className="h-4 w-4 accent-copper" disabled={!canEdit} {...register('kind')} />
                {kindLabels[k]}
              </label>
            ))}
          </div>
        </fieldset>
        <Field label="Menu upcharge, every size" unit={currency} error={errors.upcharge?.message}>
          <Input inputMode="decimal" autoComplete="off" disabled={!canEdit} {...register('upcharge')} />
        </Field>
      </Card>

      <section aria-labelledby="modifier-sizes-heading" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="modifier-sizes-heading" className="text-lg font-bold">
            By cup size
          </h2>
          <p className="text-sm text-muted">
            {watched.kind === 'swap' ? 'What it takes out of the build and what it puts in instead. ' : 'What it adds to the build. '}
            Leave a size empty where it is not offered, and the upcharge empty if it is not charged. Suggested upcharges keep the target margin of {policy.targetMarginPct} %.
          </p>
        </div>
        {errors.sizes?.message && <FormMessage>{errors.sizes.message}</FormMessage>}
        {preview.isError && <PreviewError error={preview.error} />}
        <SizeColumns count={sizes.length}>
            {defaults.sizes.map((size, i) => {
              const headingId = `modifier-size-${size.sizeId}-heading`;
              const hasLines = actions.some((a) => (watched.sizes?.[i]?.[a] ?? []).length > 0);
              // With nothing taken out, the extra cost is what the preview costs the added lines, and its
              // suggested price is the same rounding of the same unrounded figure as the server's upcharge.
              const takesOut = actions.includes('remove') && (watched.sizes?.[i]?.remove ?? []).length > 0;
              const added = !takesOut && ready ? costed.get(`${size.sizeId}:add`) : undefined;
              const figures = showSaved
                ? saved.get(size.sizeId)
                : added
                  ? { costDelta: added.cost, suggestedUpcharge: added.suggestedPrice, problem: null }
                  : undefined;
              const upcharge = showSaved ? (modifier?.upcharge ?? null) : watched.upcharge?.trim() && isDecimalString(watched.upcharge.trim()) ? watched.upcharge.trim() : null;
              return (
                <section key={size.sizeId} aria-labelledby={headingId} className="flex flex-col gap-3 rounded-lg border border-rule bg-card p-4" data-size={size.name}>
                  <SizeHeading id={headingId} name={size.name} volumeMl={size.volumeMl} />
                  {actions.map((action) => {
                    const key = `${size.sizeId}:${action}`;
                    const side = costed.get(key);
                    const lineErrors = errors.sizes?.[i]?.[action] as unknown as (LineErrors | undefined)[] | undefined;
                    const label = sectionLabels[action][watched.kind === 'swap' ? 'swap' : 'add'];
                    return (
                      <fieldset key={action} className="flex flex-col gap-2" data-action={action}>
                        <legend className="mb-1 flex w-full items-baseline justify-between gap-2 text-sm font-bold text-ink">
                          <span>{label}</span>
                          <span className="font-normal text-muted tabular-nums" data-figure={`${action}-cost`}>
                            {side ? formatMoney(side.cost, currency, { detail: true }) : ''}
                          </span>
                        </legend>
                        <LinesEditor
                          control={control}
                          register={register}
                          setValue={setValue}
                          getValues={getValues}
                          name={`sizes.${i}.${action}`}
                          items={items}
                          errors={lineErrors}
                          lineCosts={side ? side.lines.map((l) => l.cost) : null}
                          currency={currency}
                          idPrefix={`size-${i}-${action}`}
                          disabled={!canEdit}
                          emptyText={action === 'remove' ? 'Nothing taken out.' : 'Nothing added yet.'}
                        />
                        {plan.problems.get(key) && !plan.waiting && <p className="text-sm text-muted">{plan.problems.get(key)}</p>}
                      </fieldset>
                    );
                  })}
                  <div aria-live="polite" className="rounded-md border border-rule bg-paper/50 px-3 py-2" data-figures-for={size.name}>
                    {figures && figures.costDelta !== null ? (
                      <dl className="divide-y divide-rule text-sm">
                        <div className="flex justify-between gap-3 py-1.5">
                          <dt className="text-muted">Extra cost per cup</dt>
                          <dd className="text-right font-bold tabular-nums" data-figure="extra-cost">
                            {formatMoney(figures.costDelta, currency, { detail: true })}
                          </dd>
                        </div>
                        <div className="flex justify-between gap-3 py-1.5">
                          <dt className="text-muted">Suggested upcharge</dt>
                          <dd className="text-right font-bold tabular-nums" data-figure="suggested">
                            {figures.suggestedUpcharge === null ? '—' : formatMoney(figures.suggestedUpcharge, currency)}
                          </dd>
                        </div>
                        {upchargeStatus(upcharge, figures.suggestedUpcharge) && (
                          <FigureMark term="Upcharge against the suggested">
                            <UpchargeMark upcharge={upcharge} suggested={figures.suggestedUpcharge} />
                          </FigureMark>
                        )}
                      </dl>
                    ) : (
                      <p className="py-1 text-sm text-muted">
                        {figures?.problem
                          ? figures.problem
                          : !hasLines
                            ? 'Not offered in this size.'
                            : 'Save to work out the extra cost and the suggested upcharge.'}
                      </p>
                    )}
                  </div>
                </section>
              );
            })}
        </SizeColumns>
      </section>

      {modifier && (
        <section aria-labelledby="modifier-allergens-heading" className="max-w-3xl">
          <h2 id="modifier-allergens-heading" className="mb-2 text-lg font-bold">
            Allergens it adds
          </h2>
          <AllergenSummary allergens={modifier.allergens} caution={ALLERGEN_CAUTION} />
        </section>
      )}

      {canEdit && (
        <div className="flex gap-3">
          <Button type="submit" busy={create.isPending || replace.isPending}>
            Save modifier
          </Button>
          {modifier && (
            <Button variant="secondary" onClick={() => setConfirmDelete(true)}>
              Delete modifier
            </Button>
          )}
        </div>
      )}

      <ConfirmDialog
        open={confirmDelete}
        title={modifier ? `Delete ${modifier.name}?` : ''}
        consequence={
          modifier ? (
            <p>
              Its lines{offeredIn.length > 0 ? ` for ${offeredIn.join(', ')}` : ''}
              {modifier.upcharge !== null ? ` and its menu upcharge of ${formatMoney(modifier.upcharge, currency)}` : ''} are deleted, and it leaves the recipe cards and the price list. This cannot be undone.
            </p>
          ) : null
        }
        confirmLabel="Delete modifier"
        busy={remove.isPending}
        error={remove.isError ? (isApiError(remove.error) ? remove.error.message : 'It could not be deleted. Try again.') : null}
        onCancel={() => setConfirmDelete(false)}
        onConfirm={() => void onDelete()}
      />
    </form>
  );
}
