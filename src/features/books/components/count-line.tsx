import { useId, useState } from 'react';
import { cx, focusRing } from '../../../components/ui/cx';
import { isApiError } from '../../../lib/api-client';
import { formatMoney, formatQuantity } from '../../../lib/format';
import { D, isDecimalString, type Dec } from '../../../shared/decimal';
import { conversionFactor, isUnitCode, UNITS } from '../../../shared/units';
import { useSaveCountLine } from '../api/counts';
import type { CountLineIn, SheetItem } from '../../../shared/contract/books';

/** The open-pack choices a barista taps instead of typing a fraction. */
const OPEN_PACK = [
  { value: '0', label: 'none' },
  { value: '0.25', label: '¼' },
  { value: '0.5', label: '½' },
  { value: '0.75', label: '¾' },
] as const;

type Mode = 'packs' | 'amount';

/** How much of the base unit (g, ml, each) one pack holds, or null when its unit cannot be converted without a density. */
export function basePerPack(item: SheetItem): Dec | null {
  try {
    return new D(item.pack.count).times(item.pack.quantity).times(conversionFactor(item.pack.unit, item.baseUnit, null));
  } catch {
    return null;
  }
}

/** What a saved count reads as in the form: whole packs plus a quarter, or (any other fraction) an amount in the base unit. */
function initialState(item: SheetItem): { mode: Mode; whole: string; open: string; amount: string } {
  if (item.packs === null) return { mode: 'packs', whole: '', open: '0', amount: '' };
  const packs = new D(item.packs);
  const whole = packs.floor();
  const fraction = packs.minus(whole).toFixed();
  const quarter = OPEN_PACK.find((o) => new D(o.value).eq(fraction));
  const per = basePerPack(item);
  if (quarter || !per) return { mode: 'packs', whole: whole.toFixed(), open: quarter?.value ?? '0', amount: '' };
  return { mode: 'amount', whole: '', open: '0', amount: packs.times(per).toDecimalPlaces(3).toFixed() };
}

function packLabel(item: SheetItem): string {
  const unit = isUnitCode(item.pack.unit) ? UNITS[item.pack.unit].symbol : item.pack.unit;
  const one = `${formatQuantity(item.pack.quantity)} ${unit}`;
  return new D(item.pack.count).eq(1) ? one : `${formatQuantity(item.pack.count)} × ${one}`;
}

/** The pack as bought; its size is added when the description does not already say it. */
function describePack(item: SheetItem): string {
  const size = packLabel(item);
  return item.description.includes(size) ? item.description : `${item.description} (pack of ${size})`;
}

const bigInput = cx('w-full rounded-md border border-edge bg-card px-3 py-3 text-right text-xl tabular-nums text-ink', focusRing);

/**
 * One pack on the count sheet. It saves itself when a field is left or a choice is tapped, and
 * says so quietly beside it; nothing waits for a Save button.
 */
export function CountLine({ countId, item, currency, readOnly }: { countId: string; item: SheetItem; currency: string; readOnly: boolean }) {
  const [state, setState] = useState(() => initialState(item));
  const [error, setError] = useState<string | null>(null);
  const [savedAt, setSavedAt] = useState<string | null>(null);
  const save = useSaveCountLine();
  const id = useId();
  const baseSymbol = UNITS[item.baseUnit].symbol;
  const per = basePerPack(item);

  function send(next: typeof state) {
    setError(null);
    let body: CountLineIn;
    if (next.mode === 'packs') {
      const whole = next.whole.trim() === '' ? '0' : next.whole.trim();
      if (!/^\d+$/.test(whole)) return setError('Whole packs: a whole number, 0 or more.');
      if (next.whole.trim() === '' && next.open === '0' && item.packs === null) return;
      body = { packs: new D(whole).plus(next.open).toFixed() };
    } else {
      const amount = next.amount.trim();
      if (amount === '' && item.packs === null) return;
      if (!isDecimalString(amount) || new D(amount).isNegative()) return setError(`Give the amount in ${baseSymbol}, 0 or more.`);
      body = { quantity: amount, unit: item.baseUnit };
    }
    save.mutate(
      { params: { id: countId, packId: item.packId }, body },
      {
        onSuccess: (r) => setSavedAt(r.line.packs),
        onError: (e) => setError(isApiError(e) ? (Object.values(e.fields)[0] ?? e.message) : 'Not saved: check your connection and try again.'),
      },
    );
  }

  const update = (patch: Partial<typeof state>, now = false) => {
    const next = { ...state, ...patch };
    setState(next);
    if (now) send(next);
  };

  return (
    <li className="border-t border-rule py-4 first:border-t-0" data-pack={item.packId}>
      <h3 id={`${id}-name`} className="text-lg font-bold text-ink">
        {item.ingredient}
      </h3>
      <p className="text-sm text-muted">{describePack(item)}</p>
      {readOnly ? (
        <p className="mt-2 text-lg tabular-nums">
          {item.packs === null ? 'Not counted' : `${formatQuantity(item.packs)} packs`}
          {item.value && <span className="ml-3 text-muted">{formatMoney(item.value, currency)}</span>}
        </p>
      ) : (
        <fieldset className="mt-3" aria-labelledby={`${id}-name`}>
          <div role="radiogroup" aria-label={`Count ${item.ingredient} in`} className="mb-3 inline-flex rounded-md border border-rule text-sm">
            {(['packs', 'amount'] as const).map((m) => (
              <button
                key={m}
                type="button"
                role="radio"
                aria-checked={state.mode === m}
                disabled={m === 'amount' && !per}
                onClick={() => update({ mode: m })}
                className={cx('min-h-11 px-4 font-medium first:rounded-l-md last:rounded-r-md disabled:opacity-50', focusRing, state.mode === m ? 'bg-slate text-white' : 'bg-card text-ink')}
              >
                {m === 'packs' ? 'Packs' : item.baseUnit === 'each' ? 'Singly' : `In ${baseSymbol}`}
              </button>
            ))}
          </div>
          {state.mode === 'packs' ? (
            <div className="grid grid-cols-[minmax(0,8rem)_1fr] items-end gap-3">
              <div>
                <label htmlFor={`${id}-whole`} className="mb-1 block text-sm font-medium">
                  Whole packs
                </label>
                <input
                  id={`${id}-whole`}
                  inputMode="numeric"
                  autoComplete="off"
                  className={bigInput}
                  value={state.whole}
                  aria-label={`${item.ingredient}: whole packs`}
                  onChange={(e) => update({ whole: e.target.value })}
                  onBlur={() => send(state)}
                  onKeyDown={(e) => e.key === 'Enter' && send(state)}
                />
              </div>
              <div>
                <span id={`${id}-open`} className="mb-1 block text-sm font-medium">
                  Open pack
                </span>
                <div role="radiogroup" aria-labelledby={`${id}-open`} className="flex gap-1.5">
                  {OPEN_PACK.map((o) => (
                    <button
                      key={o.value}
                      type="button"
                      role="radio"
                      aria-checked={state.open === o.value}
                      aria-label={o.value === '0' ? 'No open pack' : `${o.label} of a pack open`}
                      onClick={() => update({ open: o.value }, true)}
                      className={cx('min-h-12 min-w-12 flex-1 rounded-md border font-medium', o.value === '0' ? 'text-base' : 'text-lg', focusRing, state.open === o.value ? 'border-slate bg-slate text-white' : 'border-rule bg-card text-ink')}
                    >
                      {o.label}
                    </button>
                  ))}
                </div>
              </div>
            </div>
          ) : (
            <div className="max-w-xs">
              <label htmlFor={`${id}-amount`} className="mb-1 block text-sm font-medium">
                Amount on hand
              </label>
              <div className="flex items-center gap-2">
                <input
                  id={`${id}-amount`}
                  inputMode="decimal"
                  autoComplete="off"
                  className={bigInput}
                  value={state.amount}
                  aria-label={`${item.ingredient}: amount in ${baseSymbol}`}
                  onChange={(e) => update({ amount: e.target.value })}
                  onBlur={() => send(state)}
                  onKeyDown={(e) => e.key === 'Enter' && send(state)}
                />
                <span className="text-lg text-muted">{baseSymbol}</span>
              </div>
            </div>
          )}
          <p aria-live="polite" className="mt-2 min-h-5 text-sm">
            {error ? (
              <span className="font-medium text-rose">{error}</span>
            ) : save.isPending ? (
              <span className="text-muted">Saving…</span>
            ) : savedAt !== null ? (
              <span className="text-olive">
                <span aria-hidden="true">✓ </span>Saved: {formatQuantity(savedAt)} packs
              </span>
            ) : null}
          </p>
        </fieldset>
      )}
    </li>
  );
}
