import { useMemo, useState, type HTMLAttributes, type ReactNode, type TdHTMLAttributes, type ThHTMLAttributes } from 'react';
import { cx, focusRing } from './cx';

/** A table in a scrolling card whose header row stays in view. */
export function Table({ className, children, caption, ...rest }: HTMLAttributes<HTMLTableElement> & { caption?: ReactNode }) {
  return (
    <div className="max-h-[70vh] overflow-auto rounded-lg border border-rule bg-card print:max-h-none print:overflow-visible">
      <table className={cx('w-full border-collapse text-left text-sm', className)} {...rest}>
        {caption && <caption className="sr-only">{caption}</caption>}
        {children}
      </table>
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

export type SortDirection = 'asc' | 'desc';
export interface SortState<K extends string> {
  key: K;
  direction: SortDirection;
}

/** A column header that sorts the table; announces its state with aria-sort. */
export function SortHeader<K extends string>({ label, sortKey, sort, onSort, figure }: {
  label: string;
  sortKey: K;
  sort: SortState<K>;
  onSort: (key: K) => void;
  figure?: boolean;
}) {
  const active = sort.key === sortKey;
  return (
    <Th figure={figure} aria-sort={active ? (sort.direction === 'asc' ? 'ascending' : 'descending') : 'none'}>
      <button type="button" onClick={() => onSort(sortKey)} className={cx('inline-flex items-center gap-1 rounded-sm font-medium hover:text-ink', focusRing, active && 'text-ink')}>
        {label}
        <span aria-hidden="true" className="text-xs">
          {active ? (sort.direction === 'asc' ? '▲' : '▼') : '↕'}
        </span>
      </button>
    </Th>
  );
}

/**
 * Sorts rows by a column. `value` gives each column's sort value; strings compare
 * with the locale's collation, decimal strings and numbers compare numerically.
 */
export function useSortedRows<T, K extends string>(rows: readonly T[], initial: SortState<K>, value: (row: T, key: K) => string | number) {
  const [sort, setSort] = useState<SortState<K>>(initial);
  const sorted = useMemo(() => {
    const collator = new Intl.Collator(undefined, { numeric: true, sensitivity: 'base' });
    const factor = sort.direction === 'asc' ? 1 : -1;
    return [...rows].sort((a, b) => {
      const va = value(a, sort.key);
      const vb = value(b, sort.key);
      const order = typeof va === 'number' && typeof vb === 'number' ? va - vb : collator.compare(String(va), String(vb));
      return order * factor;
    });
  }, [rows, sort, value]);
  const onSort = (key: K) => setSort((s) => (s.key === key ? { key, direction: s.direction === 'asc' ? 'desc' : 'asc' } : { key, direction: 'asc' }));
  return { sorted, sort, onSort };
}
