import { useRef, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input, Select } from '../../../components/ui/input';
import { isApiError } from '../../../lib/api-client';
import { formatDate } from '../../../lib/format';
import { isDecimalString } from '../../../shared/decimal';
import { useSaveSalesDay } from '../api/sales-days';
import { localToday } from './dates';

interface Row {
  key: number;
  drinkSizeId: string;
  quantity: string;
  netSales: string;
}

/** The currency's sign ("£", "$") for beside the number field. */
const currencySymbol = (currency: string) => new Intl.NumberFormat(undefined, { style: 'currency', currency }).formatToParts(0).find((p) => p.type === 'currency')?.value ?? currency;

const blank = (key: number): Row => ({ key, drinkSizeId: '', quantity: '', netSales: '' });

/**
 * A day's sales typed in when the till's file is missing. Saving replaces that day's
 * hand-entered lines; lines from till files stay.
 */
export function ManualSales({ siteId, drinkSizes, currency }: { siteId: string; drinkSizes: { id: string; label: string }[]; currency: string }) {
  const [soldOn, setSoldOn] = useState(localToday());
  const [rows, setRows] = useState<Row[]>([blank(0)]);
  const [problem, setProblem] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const next = useRef(1);
  const save = useSaveSalesDay();
  const set = (key: number, patch: Partial<Row>) => setRows((rs) => rs.map((r) => (r.key === key ? { ...r, ...patch } : r)));

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setSaved(null);
    const filled = rows.filter((r) => r.drinkSizeId || r.quantity || r.netSales);
    const bad = filled.find((r) => !r.drinkSizeId || !isDecimalString(r.quantity.trim()) || !isDecimalString(r.netSales.trim()));
    if (bad) return setProblem('Each line needs a drink and size, the cups sold and the net sales (0 or more, as plain numbers).');
    setProblem(null);
    save.mutate(
      { siteId, soldOn, lines: filled.map((r) => ({ drinkSizeId: r.drinkSizeId, quantity: r.quantity.trim(), netSales: r.netSales.trim() })) },
      { onSuccess: (r) => setSaved(`Saved ${r.lines.length} ${r.lines.length === 1 ? 'line' : 'lines'} for ${formatDate(r.soldOn)}.`) },
    );
  };

  return (
    <form onSubmit={submit} className="flex flex-col gap-4" aria-label="Enter a day's sales by hand">
      <Field label="Day" className="sm:w-56">
        <Input type="date" required value={soldOn} max={localToday()} onChange={(e) => setSoldOn(e.target.value)} className="py-3" />
      </Field>
      <ul className="flex flex-col gap-3">
        {rows.map((r, i) => (
          <li key={r.key} className="grid grid-cols-2 gap-3 rounded-md border border-rule p-3 sm:grid-cols-[1fr_8rem_9rem_auto] sm:items-end">
            <Field label={`Drink ${i + 1}`} className="col-span-2 sm:col-span-1">
              <Select value={r.drinkSizeId} onChange={(e) => set(r.key, { drinkSizeId: e.target.value })} className="py-3">
                <option value="">Choose a drink and size</option>
                {drinkSizes.map((d) => (
                  <option key={d.id} value={d.id}>
                    {d.label}
                  </option>
                ))}
              </Select>
            </Field>
            <Field label="Cups sold">
              <Input inputMode="decimal" value={r.quantity} onChange={(e) => set(r.key, { quantity: e.target.value })} className="py-3" />
            </Field>
            <Field label="Net sales" unit={currencySymbol(currency)}>
              <Input inputMode="decimal" value={r.netSales} onChange={(e) => set(r.key, { netSales: e.target.value })} className="py-3" />
            </Field>
            {rows.length > 1 && (
              <Button variant="quiet" className="col-span-2 justify-self-start sm:col-span-1" onClick={() => setRows((rs) => rs.filter((x) => x.key !== r.key))} aria-label={`Remove drink ${i + 1}`}>
                Remove
              </Button>
            )}
          </li>
        ))}
      </ul>
      <div className="flex flex-wrap gap-3">
        <Button variant="secondary" onClick={() => setRows((rs) => [...rs, blank(next.current++)])}>
          Add a drink
        </Button>
        <Button type="submit" busy={save.isPending}>
          Save the day
        </Button>
      </div>
      {problem && <FormMessage>{problem}</FormMessage>}
      {save.error && <FormMessage>{isApiError(save.error) ? (Object.values(save.error.fields)[0] ?? save.error.message) : 'Not saved; try again.'}</FormMessage>}
      {saved && <FormMessage tone="info">{saved}</FormMessage>}
      <p className="text-sm text-muted">Net sales are before sales tax or VAT. How tax applies to your sales depends on where you trade: check with your accountant or the tax authority.</p>
    </form>
  );
}
