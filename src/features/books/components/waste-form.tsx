import { useMemo, useRef, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input, Select } from '../../../components/ui/input';
import { isApiError } from '../../../lib/api-client';
import { formatMoney, formatQuantity } from '../../../lib/format';
import { D, isDecimalString } from '../../../shared/decimal';
import { BASE_UNIT_OF, UNIT_CODES, UNITS, type BaseUnit, type UnitCode } from '../../../shared/units';
import { useRecordWaste } from '../api/waste';
import type { WasteChoice, WasteEntry } from '../../../shared/contract/books';
import { localToday } from './dates';

/** The reasons a barista picks most often; anything else is typed. */
export const WASTE_REASONS = ['Out of date', 'Spilled or dropped', 'Drink remade', 'Left over at close', 'Poured for testing or training', 'Damaged on delivery'] as const;
const OTHER = 'other';

const KIND_LABEL: Record<WasteChoice['kind'], string> = { ingredient: 'Ingredients', preparation: 'Preparations', drinkSize: 'Drinks (cups)' };

function unitsFor(base: BaseUnit): UnitCode[] {
  const dimension = (Object.keys(BASE_UNIT_OF) as (keyof typeof BASE_UNIT_OF)[]).find((d) => BASE_UNIT_OF[d] === base);
  return UNIT_CODES.filter((c) => UNITS[c].dimension === dimension);
}

type Errors = Partial<Record<'item' | 'quantity' | 'unit' | 'reason' | 'occurredOn', string>>;

/**
 * Records one waste entry. For roles that read costs, its value at cost comes back from the
 * server (it knows the prices in force on the day), and is shown once the entry appears in the
 * month's list.
 */
export function WasteForm({ siteId, choices, entries, currency }: { siteId: string; choices: WasteChoice[]; entries: WasteEntry[] | undefined; currency: string | undefined }) {
  const [key, setKey] = useState('');
  const [quantity, setQuantity] = useState('');
  const [unit, setUnit] = useState<string>('');
  const [reason, setReason] = useState<string>(WASTE_REASONS[0]);
  const [otherReason, setOtherReason] = useState('');
  const [occurredOn, setOccurredOn] = useState(localToday());
  const [errors, setErrors] = useState<Errors>({});
  const [savedId, setSavedId] = useState<string | null>(null);
  const record = useRecordWaste();
  const form = useRef<HTMLFormElement>(null);

  const chosen = choices.find((c) => `${c.kind}:${c.id}` === key);
  const units = useMemo(() => (chosen?.baseUnit ? unitsFor(chosen.baseUnit) : []), [chosen]);
  const saved = savedId ? entries?.find((e) => e.id === savedId) : undefined;

  const choose = (value: string) => {
    setKey(value);
    const c = choices.find((x) => `${x.kind}:${x.id}` === value);
    setUnit(c?.baseUnit ?? '');
  };

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const why = reason === OTHER ? otherReason.trim() : reason;
    const next: Errors = {};
    if (!chosen) next.item = 'Choose what was wasted.';
    if (!isDecimalString(quantity.trim()) || new D(quantity.trim()).lte(0)) next.quantity = 'Give a quantity above 0.';
    if (chosen && chosen.kind !== 'drinkSize' && !unit) next.unit = 'Choose the unit.';
    if (!why) next.reason = 'Say why it was wasted.';
    if (!occurredOn) next.occurredOn = 'Give the day it happened.';
    setErrors(next);
    if (Object.keys(next).length || !chosen) {
      // Focus the first field in error, in the form's order.
      requestAnimationFrame(() => form.current?.querySelector<HTMLElement>('[aria-invalid="true"]')?.focus());
      return;
    }
    record.mutate(
      { body: { siteId, occurredOn, item: { kind: chosen.kind, id: chosen.id }, quantity: quantity.trim(), unit: chosen.kind === 'drinkSize' ? null : (unit as UnitCode), reason: why } },
      {
        onSuccess: (r) => {
          setSavedId(r.entry.id);
          setQuantity('');
          setOtherReason('');
        },
        onError: (err) => {
          if (isApiError(err) && Object.keys(err.fields).length) setErrors(err.fields as Errors);
        },
      },
    );
  };

  const groups = (['ingredient', 'preparation', 'drinkSize'] as const).map((k) => ({ kind: k, items: choices.filter((c) => c.kind === k) })).filter((g) => g.items.length);

  return (
    <form ref={form} onSubmit={submit} noValidate className="flex flex-col gap-4 rounded-lg border border-rule bg-card p-4 shadow-sm">
      <Field label="What was wasted" error={errors.item}>
        <Select value={key} onChange={(e) => choose(e.target.value)} className="py-3 text-lg">
          <option value="">Choose an item</option>
          {groups.map((g) => (
            <optgroup key={g.kind} label={KIND_LABEL[g.kind]}>
              {g.items.map((c) => (
                <option key={c.id} value={`${c.kind}:${c.id}`}>
                  {c.name}
                </option>
              ))}
            </optgroup>
          ))}
        </Select>
      </Field>
      <div className="grid grid-cols-2 gap-3">
        <Field label="Quantity" error={errors.quantity} unit={chosen?.kind === 'drinkSize' ? 'cups' : undefined}>
          <Input inputMode="decimal" autoComplete="off" value={quantity} onChange={(e) => setQuantity(e.target.value)} className="py-3 text-lg" />
        </Field>
        {chosen?.kind !== 'drinkSize' && (
          <Field label="Unit" error={errors.unit}>
            <Select value={unit} onChange={(e) => setUnit(e.target.value)} disabled={!chosen} className="py-3 text-lg">
              {!chosen && <option value="">—</option>}
              {units.map((u) => (
                <option key={u} value={u}>
                  {UNITS[u].symbol}
                </option>
              ))}
            </Select>
          </Field>
        )}
      </div>
      <Field label="Why" error={reason === OTHER ? undefined : errors.reason}>
        <Select value={reason} onChange={(e) => setReason(e.target.value)} className="py-3 text-lg">
          {WASTE_REASONS.map((r) => (
            <option key={r} value={r}>
              {r}
            </option>
          ))}
          <option value={OTHER}>Something else…</option>
        </Select>
      </Field>
      {reason === OTHER && (
        <Field label="Say why" error={errors.reason}>
          <Input value={otherReason} maxLength={200} onChange={(e) => setOtherReason(e.target.value)} className="py-3 text-lg" />
        </Field>
      )}
      <Field label="Day" error={errors.occurredOn} className="sm:w-56">
        <Input type="date" value={occurredOn} max={localToday()} onChange={(e) => setOccurredOn(e.target.value)} className="py-3 text-lg" />
      </Field>
      {record.error && !(isApiError(record.error) && Object.keys(record.error.fields).length) && (
        <FormMessage>{isApiError(record.error) ? record.error.message : 'Not recorded: check your connection and try again.'}</FormMessage>
      )}
      <div className="flex flex-wrap items-center gap-4">
        <Button type="submit" size="lg" busy={record.isPending}>
          Record waste
        </Button>
        <p aria-live="polite" className="text-base" data-testid="waste-saved">
          {saved && (
            <span className="text-ink">
              <span aria-hidden="true" className="text-olive">
                ✓{' '}
              </span>
              Recorded: {formatQuantity(saved.quantity, saved.unit ? (UNITS[saved.unit as UnitCode]?.symbol ?? saved.unit) : 'cups')} of {saved.item.name}
              {/* Its value comes only to roles that read costs. */}
              {saved.value !== undefined && (
                <>
                  , worth <span className="font-bold tabular-nums">{saved.value && currency ? formatMoney(saved.value, currency) : 'not yet costed'}</span>
                  {saved.problem ? ` (${saved.problem})` : ''}
                </>
              )}
            </span>
          )}
        </p>
      </div>
    </form>
  );
}
