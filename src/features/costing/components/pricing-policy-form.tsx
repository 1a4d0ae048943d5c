import { useState } from 'react';
import { useFieldArray, useForm, type UseFormRegister, type FieldErrors } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input, Select } from '../../../components/ui/input';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { useSavePricingPolicy } from '../api/mutations';
import type { PricingPolicyBody } from '../../../shared/contract/costing';
import { bracketToDots, policyFormSchema, type PolicyFormValues } from '../schemas';

type Prefix = 'policy' | `overrides.${number}`;

function PolicyFields({ prefix, register, errors, currency }: { prefix: Prefix; register: UseFormRegister<PolicyFormValues>; errors?: FieldErrors<PolicyFormValues['policy']>; currency: string }) {
  const at = (f: string) => `${prefix}.${f}` as never;
  return (
    <div className="grid items-start gap-3 sm:grid-cols-2 lg:grid-cols-5">
      <Field label="Target margin" unit="%" error={errors?.targetMarginPct?.message}>
        <Input inputMode="decimal" autoComplete="off" {...register(at('targetMarginPct'))} />
      </Field>
      <Field label="Menu prices" error={errors?.taxMode?.message}>
        <Select {...register(at('taxMode'))}>
          <option value="inclusive">Include tax</option>
          <option value="exclusive">Exclude tax</option>
        </Select>
      </Field>
      <Field label="Sales tax rate" unit="%" error={errors?.taxRatePct?.message}>
        <Input inputMode="decimal" autoComplete="off" {...register(at('taxRatePct'))} />
      </Field>
      <Field label="Rounding" error={errors?.rounding?.message}>
        <Select {...register(at('rounding'))}>
          <option value="up">Round up</option>
          <option value="nearest">Round to nearest</option>
          <option value="none">No rounding</option>
        </Select>
      </Field>
      <Field label="Price step" unit={currency} error={errors?.priceStep?.message}>
        <Input inputMode="decimal" autoComplete="off" {...register(at('priceStep'))} />
      </Field>
    </div>
  );
}

/** Target margin, tax and rounding for the business, overridable per drink category. */
export function PricingPolicyForm({ data, canEdit }: { data: PricingPolicyBody; canEdit: boolean }) {
  const save = useSavePricingPolicy();
  const { notify } = useToast();
  const [formError, setFormError] = useState<string | null>(null);
  const toForm = (d: PricingPolicyBody): PolicyFormValues => ({
    policy: { ...d.policy, priceStep: d.policy.priceStep ?? '' },
    overrides: d.overrides.map((o) => ({ ...o, priceStep: o.priceStep ?? '' })),
  });
  const { register, control, handleSubmit, setError, reset, formState: { errors } } = useForm<PolicyFormValues>({ resolver: zodResolver(policyFormSchema), defaultValues: toForm(data) });
  const overrides = useFieldArray({ control, name: 'overrides' });
  const onSubmit = handleSubmit(async (v) => {
    setFormError(null);
    const step = (s: string) => (s.trim() === '' ? null : s.trim());
    try {
      const saved = await save.mutateAsync({
        body: {
          policy: { ...v.policy, priceStep: step(v.policy.priceStep) },
          overrides: v.overrides.map((o) => ({ ...o, priceStep: step(o.priceStep) })),
        },
      });
      reset(toForm(saved));
      notify('Pricing policy saved. Suggested prices now follow it.');
    } catch (err) {
      if (!isApiError(err)) return setFormError('Something went wrong. Try again.');
      const entries = Object.entries(err.fields);
      entries.forEach(([p, message], i) => setError(bracketToDots(p) as never, { type: 'server', message }, { shouldFocus: i === 0 }));
      if (entries.length === 0) setFormError(err.message);
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <FormMessage>{formError}</FormMessage>
      <p className="rounded-md border border-butter bg-butter/20 px-3 py-2 text-sm text-ink">
        <span className="font-medium">Check with your tax authority. </span>
        {data.caution}
      </p>
      <p className="text-sm text-muted">
        The target margin is a share of the price before tax. Suggested prices are rounded to a multiple of the price step (e.g. 0.05 or 0.10): up, to the
        nearest, or not at all (to the smallest coin). “Exclude tax” means tax is added at the till.
      </p>
      {!data.isSet && <FormMessage tone="info">No policy saved yet: these are starting values. Check them and save.</FormMessage>}
      <fieldset disabled={!canEdit} className="flex flex-col gap-5">
        <fieldset>
          <legend className="mb-2 font-bold text-ink">Every drink</legend>
          <PolicyFields prefix="policy" register={register} errors={errors.policy} currency={data.currency} />
        </fieldset>
        <fieldset>
          <legend className="mb-1 font-bold text-ink">By drink category</legend>
          <p className="mb-3 text-sm text-muted">A category listed here (as named on its drinks, e.g. Tea) is priced with its own figures.</p>
          <ol className="flex flex-col gap-4">
            {overrides.fields.map((f, i) => (
              <li key={f.id} className="rounded-md border border-rule bg-paper/50 p-3">
                <div className="mb-3 flex items-end gap-3">
                  <Field label="Drink category" className="w-64" error={errors.overrides?.[i]?.category?.message}>
                    <Input autoComplete="off" {...register(`overrides.${i}.category`)} />
                  </Field>
                  <Button variant="quiet" size="sm" className="mb-1" onClick={() => overrides.remove(i)}>
                    Remove this category
                  </Button>
                </div>
                <PolicyFields prefix={`overrides.${i}`} register={register} errors={errors.overrides?.[i]} currency={data.currency} />
              </li>
            ))}
          </ol>
          <Button variant="secondary" className="mt-3" onClick={() => overrides.append({ category: '', ...toForm(data).policy })}>
            Add a category
          </Button>
        </fieldset>
      </fieldset>
      {canEdit && (
        <div>
          <Button type="submit" busy={save.isPending}>
            Save pricing policy
          </Button>
        </div>
      )}
    </form>
  );
}
