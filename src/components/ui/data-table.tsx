import { useMemo, useState, type ReactNode } from 'react';
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type FilterFn,
  type SortingFn,
  type SortingState,
} from '@tanstack/react-table';
import { cx } from './cx';
import { EmptyState } from './empty-state';
import { SortHeader, Table, TableFilters, TableSearch, Td, Th, THead } from './table';
import { compareSortValues, matchesSearch, type SortValue } from './table-rows';

/**
 * One column of a DataTable: its header, what a cell shows, and optionally what it sorts by,
 * what the search box reads in it, and its total. Figures are right-aligned in tabular numbers.
 */
export interface DataColumn<T> {
  id: string;
  header: string;
  cell: (row: T) => ReactNode;
  /** Sorts by this (text, a whole number or a decimal string, compared exactly); unsortable without it. */
  sortValue?: (row: T) => SortValue;
  /** Text the search box looks in. */
  searchText?: (row: T) => string | null | undefined;
  /** The column's total over the rows shown, in the table's last row. */
  total?: (rows: T[]) => ReactNode;
  figure?: boolean;
  className?: string;
  /** Screen-reader-only header (a column of actions). */
  hiddenHeader?: boolean;
}

interface DataTableProps<T> {
  caption: string;
  rows: readonly T[];
  columns: DataColumn<T>[];
  rowId: (row: T) => string;
  /** The column sorted first, or null to keep the rows in the order they came. */
  initialSort?: { id: string; direction: 'asc' | 'desc' } | null;
  /** A search box over the columns' searchText. */
  search?: { label: string; placeholder?: string };
  /** More filters (selects), already applied to `rows` by the caller, shown beside the search. */
  filters?: ReactNode;
  /** How many rows there are before the caller's own filters (for "n of m shown"). */
  total?: number;
  /** What to say when no row is left to show after searching or filtering. */
  noMatch?: { title: string; next: ReactNode };
  /** A class for each row (a highlight). */
  rowClassName?: (row: T) => string | undefined;
  /** Words for the totals row's first cell. */
  totalsLabel?: string;
  className?: string;
}

const sortByValue: SortingFn<unknown> = (a, b, id) => compareSortValues(a.getValue(id), b.getValue(id));
const bySearchText: FilterFn<unknown> = (row, _id, query: string) => matchesSearch(query, row.getValue('__search'));

/**
 * The one table of the product: sticky header, sort by any column with a sort value (exact
 * decimals, blanks last either way), a search box, arrow-key movement between cells (the Table
 * primitive), an empty state and an optional totals row. Built on @tanstack/react-table.
 */
export function DataTable<T>({ caption, rows, columns, rowId, initialSort = null, search, filters, total, noMatch, rowClassName, totalsLabel = 'Total', className }: DataTableProps<T>) {
  const [sorting, setSorting] = useState<SortingState>(initialSort ? [{ id: initialSort.id, desc: initialSort.direction === 'desc' }] : []);
  const [query, setQuery] = useState('');
  const defs = useMemo<ColumnDef<T, SortValue>[]>(
    () => [
      ...columns.map(
        (c): ColumnDef<T, SortValue> => ({
          id: c.id,
          header: c.header,
          accessorFn: (row) => {
            const v = c.sortValue?.(row);
            // Blanks sort last whichever way the column is sorted.
            return v === null || v === '' ? undefined : v;
          },
          enableSorting: Boolean(c.sortValue),
          sortingFn: sortByValue as SortingFn<T>,
          sortUndefined: 'last',
        }),
      ),
      {
        id: '__search',
        accessorFn: (row) => columns.map((c) => c.searchText?.(row) ?? '').join(' '),
        enableSorting: false,
      },
    ],
    [columns],
  );
  const data = useMemo(() => [...rows], [rows]);
  // The table instance is rebuilt each render by design; nothing memoises what it returns.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable<T>({
    data,
    columns: defs,
    getRowId: (row) => rowId(row),
    state: { sorting, globalFilter: query, columnVisibility: { __search: false } },
    onSortingChange: setSorting,
    onGlobalFilterChange: setQuery,
    globalFilterFn: bySearchText as FilterFn<T>,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    enableSortingRemoval: false,
  });
  const shown = table.getRowModel().rows;
  const byId = new Map(columns.map((c) => [c.id, c]));
  const hasTotals = columns.some((c) => c.total);
  const sortState = sorting[0] ? { key: sorting[0].id, direction: sorting[0].desc ? ('desc' as const) : ('asc' as const) } : null;

  return (
    <div className={cx('flex flex-col gap-4', className)}>
      {(search || filters) && (
        <TableFilters shown={shown.length} total={total ?? rows.length}>
          {search && <TableSearch label={search.label} value={query} onChange={setQuery} placeholder={search.placeholder} />}
          {filters}
        </TableFilters>
      )}
      {shown.length === 0 ? (
        <EmptyState title={noMatch?.title ?? 'Nothing matches'} next={noMatch?.next ?? 'Clear the search or the filters to see every row.'} />
      ) : (
        <Table caption={caption}>
          <THead>
            <tr>
              {table.getHeaderGroups()[0].headers.map((h) => {
                const c = byId.get(h.column.id)!;
                if (c.sortValue)
                  return (
                    <SortHeader
                      key={h.id}
                      label={c.header}
                      sortKey={c.id}
                      sort={sortState}
                      onSort={() => h.column.toggleSorting(sortState?.key === c.id ? sortState.direction === 'asc' : false)}
                      figure={c.figure}
                      className={c.className}
                    />
                  );
                return (
                  <Th key={h.id} figure={c.figure} className={c.className}>
                    {c.hiddenHeader ? <span className="sr-only">{c.header}</span> : flexRender(h.column.columnDef.header, h.getContext())}
                  </Th>
                );
              })}
            </tr>
          </THead>
          <tbody>
            {shown.map((r) => (
              <tr key={r.id} className={rowClassName?.(r.original)}>
                {columns.map((c) => (
                  <Td key={c.id} figure={c.figure} className={c.className}>
                    {c.cell(r.original)}
                  </Td>
                ))}
              </tr>
            ))}
          </tbody>
          {hasTotals && (
            <tfoot>
              <tr className="font-bold">
                {columns.map((c, i) => (
                  <Td key={c.id} figure={c.figure} className={cx('border-t-2 border-ink/30', c.className)}>
                    {c.total ? c.total(shown.map((r) => r.original)) : i === 0 ? totalsLabel : null}
                  </Td>
                ))}
              </tr>
            </tfoot>
          )}
        </Table>
      )}
    </div>
  );
}
