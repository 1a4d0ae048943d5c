import { useMemo, useRef, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { ErrorState } from '../../../components/ui/error-state';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input, Select } from '../../../components/ui/input';
import { SkeletonRows } from '../../../components/ui/skeleton';
import { isApiError } from '../../../lib/api-client';
import { formatDate } from '../../../lib/format';
import { isDecimalString } from '../../../shared/decimal';
import type { ManualDay } from '../../../shared/contract/books';
import { useSaveSalesDay, useSalesDay } from '../api/sales-days';
import { localToday } from './dates';

interface Row {
  key: number;
  drinkSizeId: string;
  quantity: string;
  netSales: string;
  /** Tax as saved with this line's net sales; kept only while the net sales are unchanged. */
  saved?: { netSales: string; tax: string | null };
}

/** The currency's sign ("£", "$") for beside the number field. */
const currencySymbol = (currency: string) => new Intl.NumberFormat(undefined, { style: 'currency', currency }).formatToParts(0).find((p) => p.type === 'currency')?.value ?? currency;

const blank = (key: number): Row => ({ key, drinkSizeId: '', quantity: '', netSales: '' });
const lines = (n: number) => (n === 1 ? '1 line' : `${n} lines`);
const isDay = (v: string) => /^\d{4}-\d{2}-\d{2}$/.test(v);
const monthName = (day: string) => new Date(`${day}T00:00:00Z`).toLocaleDateString(undefined, { month: 'long', year: 'numeric', timeZone: 'UTC' });

/**
 * A day's sales typed in when the till's file is missing. Choosing a day loads the lines
 * already typed in for it; saving replaces them (the form says so first). Lines from till
 * files stay; a day in a closed month cannot be saved.
 */
export function ManualSales({ siteId, drinkSizes, currency }: { siteId: string; drinkSizes: { id: string; label: string }[]; currency: string }) {
  const [soldOn, setSoldOn] = useState(localToday());
  const day = useSalesDay(siteId, isDay(soldOn) ? soldOn : null);
  return (
    <div className="flex flex-col gap-4">
      <Field label="Day" className="sm:w-56">
        <Input type="date" required value={soldOn} max={localToday()} onChange={(e) => setSoldOn(e.target.value)} className="py-3" />
      </Field>
      {!isDay(soldOn) ? (
        <p className="text-muted">Choose the day the sales were made.</p>
      ) : day.isPending ? (
        <SkeletonRows rows={2} label="Loading the day's sales" />
      ) : day.isError ? (
        <ErrorState error={day.error} onRetry={() => day.refetch()} />
      ) : (
        // A new day (or site) starts a new form from what is saved for it.
        <DayForm key={`${siteId}/${soldOn}`} day={day.data} drinkSizes={drinkSizes} currency={currency} />
      )}
    </div>
  );
}

function DayForm({ day, drinkSizes, currency }: { day: ManualDay; drinkSizes: { id: string; label: string }[]; currency: string }) {
  const { siteId, soldOn } = day;
  const [rows, setRows] = useState<Row[]>(() =>
    day.lines.length
      ? day.lines.map((l, i) => ({ key: i, drinkSizeId: l.drinkSizeId, quantity: l.quantity, netSales: l.netSales, saved: { netSales: l.netSales, tax: l.tax } }))
      : [blank(0)],
  );
  const [problem, setProblem] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const next = useRef(Math.max(1, day.lines.length));
  const save = useSaveSalesDay();
  const set = (key: number, patch: Partial<Row>) => setRows((rs) => rs.map((r) => (r.key === key ? { ...r, ...patch } : r)));
  // A saved line's drink may have left the menu since: it stays choosable, under its saved name.
  const choices = useMemo(() => {
    const known = new Set(drinkSizes.map((d) => d.id));
    const gone = day.lines.filter((l) => !known.has(l.drinkSizeId)).map((l) => ({ id: l.drinkSizeId, label: `${l.label} (no longer on the menu)` }));
    return [...drinkSizes, ...new Map(gone.map((g) => [g.id, g])).values()];
  }, [drinkSizes, day.lines]);
  const savedCount = day.lines.length;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setSaved(null);
    if (day.closed) return;
    const filled = rows.filter((r) => r.drinkSizeId || r.quantity || r.netSales);
    const bad = filled.find((r) => !r.drinkSizeId || !isDecimalString(r.quantity.trim()) || !isDecimalString(r.netSales.trim()));
    if (bad) return setProblem('Each line needs a drink and size, the cups sold and the net sales (0 or more, as plain numbers).');
    setProblem(null);
    save.mutate(
      {
        body: {
          siteId,
          soldOn,
          lines: filled.map((r) => {
            const netSales = r.netSales.trim();
            return { drinkSizeId: r.drinkSizeId, quantity: r.quantity.trim(), netSales, tax: r.saved && r.saved.netSales === netSales ? r.saved.tax : null };
          }),
        },
      },
      { onSuccess: (r) => setSaved(`Saved ${lines(r.lines.length)} for ${formatDate(r.soldOn)}${r.replaced ? `, in place of the ${lines(r.replaced)} saved before` : ''}.`) },
    );
  };

  return (
    <form onSubmit={submit} className="flex flex-col gap-4" aria-label="Enter a day's sales by hand">
      {day.closed && (
        <FormMessage tone="info">
          {monthName(soldOn)} is closed, so the sales of {formatDate(soldOn)} cannot change. The owner can reopen the month under Month end.
        </FormMessage>
      )}
      <p className="text-sm text-muted" data-testid="manual-day-status">
        {savedCount === 0 ? `Nothing typed in for ${formatDate(soldOn)} yet.` : `${lines(savedCount)} typed in for ${formatDate(soldOn)}, shown below.`}
        {day.importedLines > 0 && (day.closed ? ` The day also has ${lines(day.importedLines)} from till files.` : ` The ${lines(day.importedLines)} from till files for that day stay as they are.`)}
      </p>
      {/* A closed day with nothing typed in has nothing to show. */}
      {!(day.closed && savedCount === 0) && (
        <ul className="flex flex-col gap-3">
          {rows.map((r, i) => (
            <li key={r.key} className="grid grid-cols-2 gap-3 rounded-md border border-rule p-3 sm:grid-cols-[1fr_8rem_9rem_auto] sm:items-end">
              <Field label={`Drink ${i + 1}`} className="col-span-2 sm:col-span-1">
                <Select value={r.drinkSizeId} disabled={day.closed} onChange={(e) => set(r.key, { drinkSizeId: e.target.value })} className="py-3">
                  <option value="">Choose a drink and size</option>
                  {choices.map((d) => (
                    <option key={d.id} value={d.id}>
                      {d.label}
                    </option>
                  ))}
                </Select>
              </Field>
              <Field label="Cups sold">
                <Input inputMode="decimal" value={r.quantity} readOnly={day.closed} onChange={(e) => set(r.key, { quantity: e.target.value })} className="py-3" />
              </Field>
              <Field label="Net sales" unit={currencySymbol(currency)}>
                <Input inputMode="decimal" value={r.netSales} readOnly={day.closed} onChange={(e) => set(r.key, { netSales: e.target.value })} className="py-3" />
              </Field>
              {rows.length > 1 && !day.closed && (
                <Button variant="quiet" className="col-span-2 justify-self-start sm:col-span-1" onClick={() => setRows((rs) => rs.filter((x) => x.key !== r.key))} aria-label={`Remove drink ${i + 1}`}>
                  Remove
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
      {!day.closed && (
        <>
          {savedCount > 0 && (
            <p className="rounded-md border border-butter bg-card px-4 py-3 text-ink" data-testid="manual-day-replaces">
              This replaces the {lines(savedCount)} saved for {formatDate(soldOn)}: what is in the form when you save becomes that day&apos;s hand-entered sales.
            </p>
          )}
          <div className="flex flex-wrap gap-3">
            <Button variant="secondary" onClick={() => setRows((rs) => [...rs, blank(next.current++)])}>
              Add a drink
            </Button>
            <Button type="submit" busy={save.isPending}>
              {savedCount > 0 ? `Replace the ${lines(savedCount)}` : 'Save the day'}
            </Button>
          </div>
        </>
      )}
      {problem && <FormMessage>{problem}</FormMessage>}
      {save.error && <FormMessage>{isApiError(save.error) ? (Object.values(save.error.fields)[0] ?? save.error.message) : 'Not saved; try again.'}</FormMessage>}
      {saved && <FormMessage tone="info">{saved}</FormMessage>}
      <p className="text-sm text-muted">Net sales are before sales tax or VAT. How tax applies to your sales depends on where you trade: check with your accountant or the tax authority.</p>
    </form>
  );
}
