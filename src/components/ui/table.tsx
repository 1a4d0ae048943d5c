import { useEffect, useId, useMemo, useRef, useState, type HTMLAttributes, type ReactNode, type TdHTMLAttributes, type ThHTMLAttributes } from 'react';
import { cx, focusRing } from './cx';
import { Field } from './field';
import { Input } from './input';
import { keepTableReachable, moveInTable } from './table-keys';
import { sortRows, type SortDirection, type SortValue } from './table-rows';

/** Read out with every table: how the keyboard moves between its cells. */
export const TABLE_KEYS_HINT =
  'Arrow keys move between cells; in a text box Left and Right move in the text. Home and End go to the start and end of a row, Ctrl+Home and Ctrl+End to the first and last row.';

// A cell focused from the keyboard shows the same copper ring as a control.
const cellFocus = '[&_:is(td,th):focus-visible]:outline-2 [&_:is(td,th):focus-visible]:-outline-offset-2 [&_:is(td,th):focus-visible]:outline-copper';

/**
 * A table in a scrolling card whose header row stays in view. The arrow keys move between its
 * cells (see table-keys.ts); screen readers hear how, as the table's description.
 */
export function Table({ className, children, caption, onKeyDown, ...rest }: HTMLAttributes<HTMLTableElement> & { caption?: ReactNode }) {
  const ref = useRef<HTMLTableElement>(null);
  const hintId = useId();
  // After every render: rows may have come, gone or been sorted.
  useEffect(() => {
    if (ref.current) keepTableReachable(ref.current);
  });
  return (
    <div className="max-h-[70vh] scroll-pt-12 overflow-auto rounded-lg border border-rule bg-card print:max-h-none print:overflow-visible">
      <table
        ref={ref}
        className={cx('w-full border-collapse text-left text-sm', cellFocus, className)}
        aria-describedby={hintId}
        onKeyDown={(e) => {
          onKeyDown?.(e);
          const { key, ctrlKey, altKey, metaKey, shiftKey, target, nativeEvent } = e;
          const event = { key, ctrlKey, altKey, metaKey, shiftKey, target, isComposing: nativeEvent.isComposing, defaultPrevented: e.isDefaultPrevented() };
          if (ref.current && moveInTable(ref.current, event)) e.preventDefault();
        }}
        {...rest}
      >
        {caption && <caption className="sr-only">{caption}</caption>}
        {children}
      </table>
      <p id={hintId} className="sr-only print:hidden">
        {TABLE_KEYS_HINT}
      </p>
    </div>
  );
}

export function THead({ children }: { children: ReactNode }) {
  return <thead className="sticky top-0 z-10 bg-paper shadow-[inset_0_-1px_0] shadow-rule">{children}</thead>;
}

interface ThProps extends ThHTMLAttributes<HTMLTableCellElement> {
  figure?: boolean;
}

export function Th({ figure, className, ...rest }: ThProps) {
  return <th scope="col" className={cx('px-3 py-2 font-medium text-muted', figure && 'text-right', className)} {...rest} />;
}

interface TdProps extends TdHTMLAttributes<HTMLTableCellElement> {
  /** A number: right-aligned with figures of equal width. */
  figure?: boolean;
}

export function Td({ figure, className, ...rest }: TdProps) {
  return <td className={cx('border-t border-rule px-3 py-2 align-middle text-ink', figure && 'text-right tabular-nums', className)} {...rest} />;
}

export type { SortDirection, SortValue };
export interface SortState<K extends string> {
  key: K;
  direction: SortDirection;
}

/** A column header that sorts the table; announces its state with aria-sort. */
export function SortHeader<K extends string>({ label, sortKey, sort, onSort, figure, className }: {
  label: string;
  sortKey: K;
  /** null while the rows are in the order they came in. */
  sort: SortState<K> | null;
  onSort: (key: K) => void;
  figure?: boolean;
  className?: string;
}) {
  const active = sort?.key === sortKey;
  const direction = active ? sort.direction : null;
  return (
    <Th figure={figure} className={className} aria-sort={direction === 'asc' ? 'ascending' : direction === 'desc' ? 'descending' : 'none'}>
      <button type="button" onClick={() => onSort(sortKey)} className={cx('inline-flex items-center gap-1 rounded-sm font-medium hover:text-ink', figure && 'text-right', focusRing, active && 'text-ink')}>
        {label}
        <span aria-hidden="true" className="text-xs">
          {direction === 'asc' ? '▲' : direction === 'desc' ? '▼' : '↕'}
        </span>
      </button>
    </Th>
  );
}

/**
 * Sorts rows by a column (see sortRows: decimal strings compare exactly, blanks last). `value`
 * gives each column's sort value and should be stable (useCallback). With `initial` null the rows
 * keep the order they came in until a header is chosen.
 */
export function useSortedRows<T, K extends string>(rows: readonly T[], initial: SortState<K> | null, value: (row: T, key: K) => SortValue) {
  const [sort, setSort] = useState<SortState<K> | null>(initial);
  const sorted = useMemo(() => (sort ? sortRows(rows, (row) => value(row, sort.key), sort.direction) : [...rows]), [rows, sort, value]);
  const onSort = (key: K) => setSort((s) => (s?.key === key ? { key, direction: s.direction === 'asc' ? 'desc' : 'asc' } : { key, direction: 'asc' }));
  /** A SortHeader for this table; figure columns (the default) are right-aligned. */
  const header = (key: K, label: string, figure = true) => <SortHeader label={label} sortKey={key} sort={sort} onSort={onSort} figure={figure} />;
  return { sorted, sort, onSort, header };
}

/** The search box above a table. */
export function TableSearch({ label, value, onChange, placeholder, className = 'w-64' }: {
  label: string;
  value: string;
  onChange: (value: string) => void;
  placeholder?: string;
  className?: string;
}) {
  return (
    <Field label={label} className={className}>
      <Input type="search" value={value} onChange={(e) => onChange(e.target.value)} placeholder={placeholder} />
    </Field>
  );
}

/** The row of filters above a table, ending with how many rows they let through. */
export function TableFilters({ shown, total, children }: { shown: number; total: number; children: ReactNode }) {
  return (
    <div className="flex flex-wrap items-end gap-4 print:hidden">
      {children}
      <p className="pb-2 text-sm text-muted tabular-nums" role="status">
        {shown} of {total} shown
      </p>
    </div>
  );
}
