import { useEffect, useRef } from 'react';
import { Controller, useFieldArray, useWatch, type Control, type FieldValues, type UseFormGetValues, type UseFormRegister, type UseFormSetValue } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { Input, Select } from '../../../components/ui/input';
import { formatMoney, formatQuantity } from '../../../lib/format';
import type { BaseUnit } from '../../../shared/units';
import type { MeasureOut } from '../../../shared/contract/costing';
import { ItemPicker, type ItemChoice } from './item-picker';
import { unitsFor, unitSymbol } from './units';

/** A line as the form holds it: keys that say what kind of thing each value names. */
export interface FormLine {
  /** "i:<ingredient id>" | "p:<preparation id>" | "" */
  item: string;
  quantity: string;
  /** "u:<unit code>" | "m:<measure id>" | "" */
  unit: string;
}

/** What the line editor knows of an item: enough to offer its units and measures. */
export interface LineItem extends ItemChoice {
  name: string;
  baseUnit: BaseUnit | null;
  density: string | null;
  /** null while the preparation's detail is loading. */
  measures: MeasureOut[] | null;
}

export const emptyLine = (): FormLine => ({ item: '', quantity: '', unit: '' });

export interface LineErrors {
  item?: { message?: string };
  quantity?: { message?: string };
  unit?: { message?: string };
}

/** Keeps the unit when the new item can use it, else the item's first measure or its base unit. */
function unitForItem(item: LineItem | undefined, unit: string): string {
  if (!item) return unit;
  if (unit.startsWith('m:') && item.measures?.some((m) => `m:${m.id}` === unit)) return unit;
  if (unit.startsWith('u:') && unitsFor(item.baseUnit, item.density).includes(unit.slice(2) as never)) return unit;
  if (item.measures && item.measures.length > 0) return `m:${item.measures[0].id}`;
  return item.baseUnit ? `u:${item.baseUnit}` : '';
}

/**
 * Focus for after the next render: a control the list's change removed, disabled or moved
 * (Remove, or a move button at the end of the list) would otherwise drop it to the page.
 */
function useFocusAfterRender() {
  const pending = useRef<string | null>(null);
  useEffect(() => {
    if (!pending.current) return;
    document.getElementById(pending.current)?.focus();
    pending.current = null;
  });
  return (id: string) => {
    pending.current = id;
  };
}

/**
 * The lines of a build or a preparation: item, quantity with its unit or measure
 * beside it, and (when costed) each line's cost to 4 decimals.
 */
export function LinesEditor<T extends FieldValues>({ control, register, setValue, getValues, name, items, errors, lineCosts, currency, idPrefix, disabled, emptyText = 'No lines yet. Add the coffee, milk, syrups and the cup itself.' }: {
  control: Control<T>;
  register: UseFormRegister<T>;
  setValue: UseFormSetValue<T>;
  getValues: UseFormGetValues<T>;
  /** Path of the lines array in the form, e.g. "sizes.1.lines". */
  name: string;
  items: ReadonlyMap<string, LineItem>;
  errors?: (LineErrors | undefined)[];
  /** Each line's cost as written by the server (4 places), when known. */
  lineCosts?: (string | null)[] | null;
  currency: string;
  idPrefix: string;
  disabled?: boolean;
  /** What an empty list says to do next. */
  emptyText?: string;
}) {
  // The generic form type cannot see that `name` holds FormLine[]; the casts stay inside here.
  const { fields, append, remove, move } = useFieldArray({ control, name: name as never });
  const lines = (useWatch({ control, name: name as never }) ?? []) as FormLine[];
  const choices = [...items.values()];
  const at = (j: number, field: keyof FormLine) => `${name}.${j}.${field}` as never;
  const focusLater = useFocusAfterRender();
  const lineId = (j: number, part: 'item' | 'up' | 'down') => `${idPrefix}-line-${j}-${part}`;
  const addId = `${idPrefix}-add-line`;
  // Where the focus goes when a line goes: the line that took its place, else the one before, else Add a line.
  const removeLine = (j: number) => {
    remove(j);
    focusLater(j < fields.length - 1 ? lineId(j, 'item') : j > 0 ? lineId(j - 1, 'item') : addId);
  };
  // A moved line keeps the focus on its move button, or on the other one once it reaches an end.
  const moveLine = (j: number, to: number) => {
    move(j, to);
    const [same, other] = to < j ? (['up', 'down'] as const) : (['down', 'up'] as const);
    const atEnd = to === 0 || to === fields.length - 1;
    focusLater(lineId(to, atEnd ? other : same));
  };

  return (
    <div className="flex flex-col gap-3">
      {fields.length === 0 && <p className="text-sm text-muted">{emptyText}</p>}
      <ol className="flex flex-col gap-3">
        {fields.map((f, j) => {
          const line = lines[j] ?? emptyLine();
          const item = items.get(line.item);
          const e = errors?.[j];
          const base = `${idPrefix}-line-${j}`;
          const cost = lineCosts?.[j];
          const units = unitsFor(item?.baseUnit, item?.density);
          return (
            <li key={f.id} className="rounded-md border border-rule bg-paper/60 p-2" aria-label={`Line ${j + 1}`}>
              <label htmlFor={lineId(j, 'item')} className="mb-1 block text-xs font-medium text-muted">
                Item
              </label>
              <Controller
                control={control}
                name={at(j, 'item')}
                render={({ field }) => (
                  <ItemPicker
                    ref={field.ref}
                    id={lineId(j, 'item')}
                    label={`Item, line ${j + 1}`}
                    value={field.value as unknown as string}
                    choices={choices}
                    invalid={Boolean(e?.item)}
                    describedBy={e?.item ? `${base}-item-error` : undefined}
                    disabled={disabled}
                    onBlur={field.onBlur}
                    onChange={(key) => {
                      field.onChange(key);
                      const next = unitForItem(items.get(key), (getValues(at(j, 'unit')) as unknown as string) ?? '');
                      setValue(at(j, 'unit'), next as never, { shouldDirty: true });
                    }}
                  />
                )}
              />
              {e?.item?.message && (
                <p id={`${base}-item-error`} className="mt-1 text-sm font-medium text-rose">
                  {e.item.message}
                </p>
              )}
              <div className="mt-2 flex items-end gap-2">
                <div className="w-24 shrink-0">
                  <label htmlFor={`${base}-qty`} className="mb-1 block text-xs font-medium text-muted">
                    Quantity
                  </label>
                  <Input
                    id={`${base}-qty`}
                    inputMode="decimal"
                    aria-label={`Quantity, line ${j + 1}`}
                    invalid={Boolean(e?.quantity)}
                    aria-describedby={e?.quantity ? `${base}-qty-error` : undefined}
                    disabled={disabled}
                    {...register(at(j, 'quantity'))}
                  />
                </div>
                <div className="min-w-0 flex-1">
                  <label htmlFor={`${base}-unit`} className="mb-1 block text-xs font-medium text-muted">
                    Unit or measure
                  </label>
                  {/* Controlled: the options follow the item, so the value must be re-applied after they render. */}
                  <Controller
                    control={control}
                    name={at(j, 'unit')}
                    render={({ field }) => (
                  <Select
                    id={`${base}-unit`}
                    aria-label={`Unit or measure, line ${j + 1}`}
                    invalid={Boolean(e?.unit)}
                    disabled={disabled}
                    name={field.name}
                    ref={field.ref}
                    value={field.value as unknown as string}
                    onChange={field.onChange}
                    onBlur={field.onBlur}
                  >
                    <option value="">Choose…</option>
                    {item?.measures && item.measures.length > 0 && (
                      <optgroup label="Measures">
                        {item.measures.map((m) => (
                          <option key={m.id} value={`m:${m.id}`}>
                            {m.name} ({formatQuantity(m.quantity, unitSymbol(m.unit))})
                          </option>
                        ))}
                      </optgroup>
                    )}
                    <optgroup label="Units">
                      {units.map((u) => (
                        <option key={u} value={`u:${u}`}>
                          {unitSymbol(u)}
                        </option>
                      ))}
                    </optgroup>
                  </Select>
                    )}
                  />
                </div>
              </div>
              {(e?.quantity?.message || e?.unit?.message) && (
                <p id={`${base}-qty-error`} className="mt-1 text-sm font-medium text-rose">
                  {e?.quantity?.message ?? e?.unit?.message}
                </p>
              )}
              <div className="mt-2 flex items-center justify-between gap-2">
                <p className="whitespace-nowrap text-sm text-muted">
                  Line cost{' '}
                  <span className="font-medium tabular-nums text-ink" data-line-cost>
                    {cost ? formatMoney(cost, currency, { detail: true }) : '—'}
                  </span>
                </p>
                <div className="flex shrink-0 gap-0.5">
                  <Button id={lineId(j, 'up')} variant="quiet" size="sm" disabled={disabled || j === 0} onClick={() => moveLine(j, j - 1)} aria-label={`Move line ${j + 1} up`}>
                    ↑
                  </Button>
                  <Button id={lineId(j, 'down')} variant="quiet" size="sm" disabled={disabled || j === fields.length - 1} onClick={() => moveLine(j, j + 1)} aria-label={`Move line ${j + 1} down`}>
                    ↓
                  </Button>
                  <Button variant="quiet" size="sm" disabled={disabled} onClick={() => removeLine(j)}>
                    Remove<span className="sr-only"> line {j + 1}</span>
                  </Button>
                </div>
              </div>
            </li>
          );
        })}
      </ol>
      <div>
        {/* The new line's item takes the focus: the form would otherwise pick its first registered box, the quantity. */}
        <Button id={addId} variant="secondary" size="sm" disabled={disabled} onClick={() => append(emptyLine() as never, { focusName: at(fields.length, 'item') })}>
          Add a line
        </Button>
      </div>
    </div>
  );
}
