/**
 * A sortable, searchable, paged table on @tanstack/react-table.
 *
 * Keyboard: every sortable header is a button (its state in `aria-sort` on the header cell); when
 * rows lead somewhere, the first cell holds a real link, so Tab and Enter reach the row's page, and
 * a mouse click anywhere else on the row goes there too.
 */
import { useId, useMemo, useState, type MouseEvent, type ReactNode } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type FilterFn,
  type Row,
  type SortingState,
} from '@tanstack/react-table';

export type CellValue = string | number | null | undefined;

/** One column: the value it sorts and searches by, and how its cell shows. */
export interface DataColumn<T> {
  id: string;
  header: string;
  /** The value used for sorting and search (null and empty sort last). */
  value: (row: T) => CellValue;
  /** The cell's content; defaults to the value, or "—" when there is none. */
  cell?: (row: T) => ReactNode;
  /** Numbers align right. */
  align?: 'left' | 'right';
  /** Defaults to true. */
  sortable?: boolean;
  /** Whether the search box looks in this column; defaults to true for text values. */
  searchable?: boolean;
  /** Hides the column on narrow screens. */
  hideBelow?: 'sm' | 'md' | 'lg';
  /** Extra classes for the cells of the column. */
  className?: string;
}

export interface DataTableProps<T> {
  data: readonly T[];
  columns: DataColumn<T>[];
  /** The table's accessible name ("Clients"). */
  label: string;
  /** What one row is, singular and plural ("client", "clients"), for counts. */
  noun: [string, string];
  rowKey: (row: T) => string | number;
  /** Where a row leads; its first cell becomes a link and the whole row is clickable. */
  rowHref?: (row: T) => string;
  /** Shown instead of the table when there are no rows at all. */
  empty?: ReactNode;
  /** The search text, when the caller keeps it (for example in the address); otherwise kept here. */
  search?: string;
  onSearchChange?: (value: string) => void;
  searchPlaceholder?: string;
  /** Controls beside the search box (filters). */
  toolbar?: ReactNode;
  initialSort?: { id: string; desc?: boolean };
  pageSize?: number;
}

const HIDE: Record<NonNullable<DataColumn<unknown>['hideBelow']>, string> = {
  sm: 'hidden sm:table-cell',
  md: 'hidden md:table-cell',
  lg: 'hidden lg:table-cell',
};

/** Folds case and accents so “havlicek” finds “Havlíček”. */
export function foldText(text: string): string {
  return text.normalize('NFD').replace(/\p{M}/gu, '').toLowerCase();
}

const normalised = (v: CellValue): string | number | undefined => (v === null || v === undefined || v === '' ? undefined : v);

const matchesSearch: FilterFn<unknown> = (row, columnId, filterValue: string) => {
  const value = row.getValue<CellValue>(columnId);
  if (value === undefined || value === null) return false;
  return foldText(String(value)).includes(foldText(filterValue.trim()));
};

function compareCells<T>(a: Row<T>, b: Row<T>, columnId: string): number {
  const x = a.getValue<string | number>(columnId);
  const y = b.getValue<string | number>(columnId);
  if (typeof x === 'number' && typeof y === 'number') return x - y;
  return String(x).localeCompare(String(y), 'en', { numeric: true, sensitivity: 'base' });
}

function SortMark({ state }: { state: false | 'asc' | 'desc' }) {
  return (
    <span aria-hidden className={`inline-block w-3 text-xs ${state ? 'text-moss-deep' : 'text-rule'}`}>
      {state === 'asc' ? '▲' : state === 'desc' ? '▼' : '↕'}
    </span>
  );
}

/** The table; see DataTableProps. */
export function DataTable<T>({
  data,
  columns,
  label,
  noun,
  rowKey,
  rowHref,
  empty,
  search,
  onSearchChange,
  searchPlaceholder,
  toolbar,
  initialSort,
  pageSize = 25,
}: DataTableProps<T>) {
  const navigate = useNavigate();
  const searchId = useId();
  const [ownSearch, setOwnSearch] = useState('');
  const query = search ?? ownSearch;
  const setQuery = onSearchChange ?? setOwnSearch;
  const [sorting, setSorting] = useState<SortingState>(initialSort ? [{ id: initialSort.id, desc: initialSort.desc ?? false }] : []);
  const [pagination, setPagination] = useState({ pageIndex: 0, pageSize });

  const byId = useMemo(() => new Map(columns.map((c) => [c.id, c])), [columns]);
  const columnDefs = useMemo<ColumnDef<T, CellValue>[]>(
    () =>
      columns.map((c) => ({
        id: c.id,
        header: c.header,
        accessorFn: (row: T) => normalised(c.value(row)),
        enableSorting: c.sortable !== false,
        sortingFn: compareCells,
        sortUndefined: 'last',
      })),
    [columns],
  );

  const table = useReactTable<T>({
    data: data as T[],
    columns: columnDefs,
    state: { sorting, globalFilter: query, pagination },
    onSortingChange: (updater) => {
      setSorting(updater);
      setPagination((p) => ({ ...p, pageIndex: 0 }));
    },
    onPaginationChange: setPagination,
    globalFilterFn: matchesSearch as FilterFn<T>,
    getColumnCanGlobalFilter: (column) => {
      const spec = byId.get(column.id);
      if (spec?.searchable !== undefined) return spec.searchable;
      const first = data[0];
      return first !== undefined && typeof spec?.value(first) === 'string';
    },
    enableSortingRemoval: false,
    autoResetPageIndex: false,
    getRowId: (row) => String(rowKey(row)),
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
  });

  const onSearch = (value: string) => {
    setQuery(value);
    setPagination((p) => ({ ...p, pageIndex: 0 }));
  };

  const total = data.length;
  const matching = table.getFilteredRowModel().rows.length;
  const pageCount = Math.max(1, table.getPageCount());
  const pageIndex = Math.min(pagination.pageIndex, pageCount - 1);
  // Rows went away (a delete, a narrower filter elsewhere): stay on the last page that exists.
  if (pageIndex !== pagination.pageIndex) setPagination({ ...pagination, pageIndex });
  const first = matching === 0 ? 0 : pageIndex * pagination.pageSize + 1;
  const last = Math.min(matching, (pageIndex + 1) * pagination.pageSize);
  const count = (n: number) => `${n.toLocaleString('en-US')} ${n === 1 ? noun[0] : noun[1]}`;
  const rows = table.getRowModel().rows;

  const onRowClick = (e: MouseEvent<HTMLTableRowElement>, href: string) => {
    if (e.button !== 0 || e.defaultPrevented) return;
    if ((e.target as HTMLElement).closest('a, button, input, select, textarea, label')) return;
    if (window.getSelection()?.toString()) return;
    navigate(href);
  };

  if (total === 0 && empty) return <>{empty}</>;

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex min-w-0 flex-1 basis-56 flex-col gap-1">
          <label htmlFor={searchId} className="text-sm font-semibold text-ink">
            Filter {noun[1]}
          </label>
          <input
            id={searchId}
            type="search"
            value={query}
            onChange={(e) => onSearch(e.target.value)}
            placeholder={searchPlaceholder ?? `Search ${noun[1]}…`}
            className="w-full rounded border border-rule bg-white px-3 py-2 text-sm text-ink placeholder:text-slate/70 focus:border-moss focus:outline-none focus:ring-2 focus:ring-moss/30 sm:max-w-sm"
          />
        </div>
        {toolbar}
      </div>

      <p className="sr-only" aria-live="polite">
        {query ? `${count(matching)} match “${query}”.` : ''}
      </p>

      {matching === 0 ? (
        <div className="rounded border border-dashed border-rule px-4 py-6 text-center">
          <p className="font-serif text-sm text-ink">No {noun[1]} match “{query}”.</p>
          <p className="mt-1 text-sm text-slate">
            Check the spelling, or{' '}
            <button type="button" className="font-semibold text-moss-deep underline" onClick={() => onSearch('')}>
              clear the search
            </button>
            .
          </p>
        </div>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full border-collapse text-sm tabular-nums">
            <caption className="sr-only">
              {label}
              {sorting[0] ? `, sorted by ${byId.get(sorting[0].id)?.header ?? sorting[0].id} ${sorting[0].desc ? 'descending' : 'ascending'}` : ''}
            </caption>
            <thead>
              {table.getHeaderGroups().map((group) => (
                <tr key={group.id} className="border-b border-rule text-left text-xs uppercase tracking-wide text-slate">
                  {group.headers.map((header) => {
                    const spec = byId.get(header.column.id);
                    const sorted = header.column.getIsSorted();
                    const right = spec?.align === 'right';
                    const ariaSort = !header.column.getCanSort() ? undefined : sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none';
                    return (
                      <th
                        key={header.id}
                        scope="col"
                        aria-sort={ariaSort}
                        className={`py-2 pr-3 font-semibold last:pr-0 ${right ? 'text-right' : ''} ${spec?.hideBelow ? HIDE[spec.hideBelow] : ''}`}
                      >
                        {header.column.getCanSort() ? (
                          <button
                            type="button"
                            onClick={header.column.getToggleSortingHandler()}
                            className={`inline-flex items-center gap-1 rounded uppercase tracking-wide hover:text-moss-deep ${right ? 'flex-row-reverse' : ''} ${sorted ? 'text-moss-deep' : ''}`}
                          >
                            {flexRender(header.column.columnDef.header, header.getContext())}
                            <SortMark state={sorted} />
                          </button>
                        ) : (
                          flexRender(header.column.columnDef.header, header.getContext())
                        )}
                      </th>
                    );
                  })}
                </tr>
              ))}
            </thead>
            <tbody>
              {rows.map((row) => {
                const href = rowHref?.(row.original);
                return (
                  <tr
                    key={row.id}
                    onClick={href ? (e) => onRowClick(e, href) : undefined}
                    className={`border-b border-rule/60 last:border-0 ${href ? 'cursor-pointer hover:bg-moss/5' : ''}`}
                  >
                    {row.getVisibleCells().map((cell, i) => {
                      const spec = byId.get(cell.column.id);
                      const raw: ReactNode = spec?.cell ? spec.cell(row.original) : (cell.getValue<CellValue>() ?? '—');
                      const content = i === 0 && href ? (
                        <Link to={href} className="font-semibold text-ink hover:text-moss-deep hover:underline">
                          {raw}
                        </Link>
                      ) : (
                        raw
                      );
                      const classes = `py-2 pr-3 align-top last:pr-0 ${spec?.align === 'right' ? 'text-right' : ''} ${spec?.hideBelow ? HIDE[spec.hideBelow] : ''} ${spec?.className ?? ''}`;
                      return i === 0 ? (
                        <th key={cell.id} scope="row" className={`text-left font-semibold ${classes}`}>
                          {content}
                        </th>
                      ) : (
                        <td key={cell.id} className={classes}>
                          {content}
                        </td>
                      );
                    })}
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}

      {matching > 0 ? (
        <div className="flex flex-wrap items-center justify-between gap-2 text-sm text-slate">
          <p>
            {pageCount > 1 ? `${first}–${last} of ${count(matching)}` : count(matching)}
            {query && matching !== total ? ` (of ${total.toLocaleString('en-US')})` : ''}
          </p>
          {pageCount > 1 ? (
            <nav aria-label={`Pages of ${noun[1]}`} className="flex items-center gap-2">
              <button
                type="button"
                onClick={() => table.previousPage()}
                disabled={!table.getCanPreviousPage()}
                className="rounded border border-rule bg-card px-3 py-1 font-semibold text-ink hover:border-moss disabled:cursor-not-allowed disabled:opacity-50"
              >
                Previous
              </button>
              <span aria-live="polite" className="tabular-nums text-ink">
                Page {pageIndex + 1} of {pageCount}
              </span>
              <button
                type="button"
                onClick={() => table.nextPage()}
                disabled={!table.getCanNextPage()}
                className="rounded border border-rule bg-card px-3 py-1 font-semibold text-ink hover:border-moss disabled:cursor-not-allowed disabled:opacity-50"
              >
                Next
              </button>
            </nav>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
