"use client";

import { useMemo, type ReactNode } from "react";
import {
  createColumnHelper,
  rowPaginationFeature,
  rowSortingFeature,
  tableFeatures,
  useTable,
  type ColumnDef,
  type PaginationState,
  type RowData,
  type SortingState,
  type Updater,
} from "@tanstack/react-table";
import { Pagination } from "@/components/ui/pagination";

/** How a column sits in the table; `sortDescFirst` on the column itself puts newest or largest first. */
export interface DataColumnMeta {
  /** Numbers read best right-aligned. */
  align?: "end";
  /** Extra classes for the column's cells, e.g. `whitespace-nowrap`. */
  cellClassName?: string;
}

/**
 * Sorting and paging are the server's: the table only keeps their state and draws headers,
 * so the rows given are already one sorted page.
 */
export const dataTableFeatures = tableFeatures({ rowSortingFeature, rowPaginationFeature, columnMeta: {} as DataColumnMeta });
type Features = typeof dataTableFeatures;

// Column values differ per column; the helper keeps each one typed where the column is declared.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type DataColumn<T extends RowData> = ColumnDef<Features, T, any>;

export function columnHelperFor<T extends RowData>() {
  return createColumnHelper<Features, T>();
}

export interface SortChoice {
  id: string;
  desc: boolean;
}

function resolve<T>(updater: Updater<T>, current: T): T {
  return typeof updater === "function" ? (updater as (old: T) => T)(current) : updater;
}

const SKELETON_ROWS = 5;
// A fresh `[]` on every render would make the table rebuild its rows each time.
const NO_ROWS: never[] = [];

export interface DataTableProps<T extends RowData> {
  /** Read out by screen readers as the table's name. */
  label: string;
  columns: DataColumn<T>[];
  /** One page of rows, already sorted by the server; undefined while the first page loads. */
  rows: T[] | undefined;
  total: number;
  getRowId: (row: T) => string;
  sort: SortChoice;
  onSortChange: (sort: SortChoice) => void;
  /** 1-based, as in the address bar. */
  page: number;
  pageSize: number;
  onPageChange: (page: number) => void;
  /** A later page or a new filter is on its way while the previous rows stay visible. */
  refreshing?: boolean;
  error?: string | null;
  empty: ReactNode;
  rowTestId?: string;
}

/** A server-driven table: sortable headers, skeleton rows while loading, an empty state, pages. */
export function DataTable<T extends RowData>({
  label,
  columns,
  rows,
  total,
  getRowId,
  sort,
  onSortChange,
  page,
  pageSize,
  onPageChange,
  refreshing = false,
  error,
  empty,
  rowTestId,
}: DataTableProps<T>) {
  const sorting = useMemo<SortingState>(() => [{ id: sort.id, desc: sort.desc }], [sort.id, sort.desc]);
  const pagination = useMemo<PaginationState>(() => ({ pageIndex: page - 1, pageSize }), [page, pageSize]);
  const table = useTable({
    features: dataTableFeatures,
    columns,
    data: rows ?? NO_ROWS,
    getRowId,
    rowCount: total,
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    state: { sorting, pagination },
    onSortingChange: (updater) => {
      const next = resolve(updater, sorting)[0];
      if (next) onSortChange({ id: next.id, desc: next.desc });
    },
    onPaginationChange: (updater) => onPageChange(resolve(updater, pagination).pageIndex + 1),
  });

  const loading = rows === undefined && !error;
  const headerGroups = table.getHeaderGroups();
  const columnCount = headerGroups[0]?.headers.length ?? 1;
  return (
    <div className="relative">
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm" aria-label={label} aria-busy={loading || refreshing}>
          <thead className="border-y border-chart-rule bg-chart-paper text-xs uppercase tracking-wide text-chart-muted">
            {headerGroups.map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const column = header.column;
                  const direction = column.getIsSorted();
                  const end = column.columnDef.meta?.align === "end";
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      className={`whitespace-nowrap px-3 py-2 align-bottom font-medium first:pl-4 last:pr-4 sm:first:pl-6 sm:last:pr-6 ${end ? "text-right" : ""}`}
                      aria-sort={direction === "asc" ? "ascending" : direction === "desc" ? "descending" : undefined}
                    >
                      {header.isPlaceholder ? null : column.getCanSort() ? (
                        <button
                          type="button"
                          onClick={column.getToggleSortingHandler()}
                          className={`inline-flex items-center gap-1 uppercase tracking-wide hover:text-chart-ink ${direction ? "text-chart-ink" : ""}`}
                        >
                          <table.FlexRender header={header} />
                          <span aria-hidden className="w-3 text-[0.65rem]">
                            {direction === "asc" ? "▲" : direction === "desc" ? "▼" : "·"}
                          </span>
                        </button>
                      ) : (
                        <table.FlexRender header={header} />
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className={`divide-y divide-chart-rule transition-opacity ${refreshing ? "opacity-60" : ""}`}>
            {loading
              ? Array.from({ length: SKELETON_ROWS }, (_, i) => (
                  <tr key={i} data-testid="skeleton-row">
                    {Array.from({ length: columnCount }, (_, j) => (
                      <td key={j} className="px-3 py-3 first:pl-4 sm:first:pl-6">
                        <span
                          className="block h-3 animate-pulse rounded bg-chart-rule"
                          style={{ width: `${40 + ((i * 7 + j * 13) % 45)}%` }}
                        />
                      </td>
                    ))}
                  </tr>
                ))
              : table.getRowModel().rows.map((row) => (
                  <tr key={row.id} data-testid={rowTestId} className="hover:bg-chart-paper/60">
                    {row.getAllCells().map((cell) => {
                      const meta = cell.column.columnDef.meta;
                      return (
                        <td
                          key={cell.id}
                          className={`px-3 py-2.5 align-top first:pl-4 last:pr-4 sm:first:pl-6 sm:last:pr-6 ${meta?.align === "end" ? "text-right tabular-nums" : ""} ${meta?.cellClassName ?? ""}`}
                        >
                          <table.FlexRender cell={cell} />
                        </td>
                      );
                    })}
                  </tr>
                ))}
          </tbody>
        </table>
      </div>
      {loading ? (
        <p className="sr-only" role="status">
          Loading…
        </p>
      ) : null}
      {error ? (
        <p role="alert" className="m-4 rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
          {error}
        </p>
      ) : null}
      {!loading && !error && total === 0 ? empty : null}
      {!loading && total > 0 ? (
        <Pagination
          page={page}
          pageSize={pageSize}
          total={total}
          onPageChange={(p) => table.setPageIndex(p - 1)}
          label={`${label}: pages`}
        />
      ) : null}
    </div>
  );
}
