"use client";

/**
 * The one table for admin lists: sortable headers (buttons, with aria-sort on the header
 * cell), a text filter over every filterable column, and pages. All in the browser: the
 * lists it shows (sites, programs…) are tens to hundreds of rows.
 */
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type RowData,
  type SortDirection,
  type SortingState,
} from "@tanstack/react-table";
import { useId, useState } from "react";
import { cn } from "@/lib/cn";
import { inputClass } from "./field";
import { Button } from "./button";

declare module "@tanstack/react-table" {
  interface ColumnMeta<TData extends RowData, TValue> {
    /** Right-aligned, monospace: coordinates, hours, magnitudes. */
    numeric?: boolean;
  }
}

export type { ColumnDef };

const ARIA_SORT: Record<SortDirection | "none", "ascending" | "descending" | "none"> = { asc: "ascending", desc: "descending", none: "none" };

export function DataTable<T>({
  data,
  columns,
  caption,
  filterLabel,
  getRowId,
  initialSort = [],
  pageSize = 15,
  emptyText = "Nothing here yet.",
}: {
  data: T[];
  columns: ColumnDef<T>[];
  /** Names the table for screen readers ("Sites"). */
  caption: string;
  /** The filter box's label ("Filter sites"). */
  filterLabel: string;
  getRowId: (row: T) => string;
  initialSort?: SortingState;
  pageSize?: number;
  emptyText?: string;
}) {
  const [sorting, setSorting] = useState<SortingState>(initialSort);
  const [globalFilter, setGlobalFilter] = useState("");
  const filterId = useId();
  const table = useReactTable({
    data,
    columns,
    state: { sorting, globalFilter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setGlobalFilter,
    globalFilterFn: "includesString",
    getRowId: (row) => getRowId(row),
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
    initialState: { pagination: { pageIndex: 0, pageSize } },
  });

  const rows = table.getRowModel().rows;
  const total = table.getFilteredRowModel().rows.length;
  const { pageIndex } = table.getState().pagination;
  const first = total === 0 ? 0 : pageIndex * pageSize + 1;
  const last = Math.min(total, (pageIndex + 1) * pageSize);

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={filterId} className="text-xs font-semibold uppercase tracking-wide text-muted">
            {filterLabel}
          </label>
          <input
            id={filterId}
            type="search"
            value={globalFilter}
            onChange={(e) => setGlobalFilter(e.target.value)}
            placeholder="Type to filter…"
            className={cn(inputClass, "w-64")}
          />
        </div>
        <p className="num text-xs text-muted" aria-live="polite">
          {total === data.length ? `${total} in all` : `${total} of ${data.length} match`}
        </p>
      </div>

      <div className="scroll-cue overflow-x-auto rounded-lg border border-line bg-raised">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-sunken text-2xs uppercase tracking-wide text-muted">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const numeric = header.column.columnDef.meta?.numeric;
                  const label = header.isPlaceholder ? null : flexRender(header.column.columnDef.header, header.getContext());
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={header.column.getCanSort() ? ARIA_SORT[sorted || "none"] : undefined}
                      className={cn("px-3 py-2 font-medium", numeric && "text-right")}
                    >
                      {header.column.getCanSort() ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className={cn("inline-flex items-center gap-1 uppercase tracking-wide hover:text-text", numeric && "flex-row-reverse")}
                        >
                          {label}
                          <span aria-hidden="true" className="w-2">
                            {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : ""}
                          </span>
                        </button>
                      ) : (
                        label
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.id} className="border-t border-line align-top">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className={cn("px-3 py-2", cell.column.columnDef.meta?.numeric && "num text-right")}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
            {rows.length === 0 && (
              <tr>
                <td colSpan={table.getVisibleLeafColumns().length} className="px-3 py-6 text-center text-muted">
                  {data.length === 0 ? emptyText : "Nothing matches the filter."}
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>

      {table.getPageCount() > 1 && (
        <nav aria-label={`Pages of ${caption.toLowerCase()}`} className="flex items-center justify-end gap-3 text-sm">
          <span className="num text-xs text-muted">
            {first}–{last} of {total}
          </span>
          <Button type="button" variant="quiet" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
            Previous page
          </Button>
          <Button type="button" variant="quiet" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
            Next page
          </Button>
        </nav>
      )}
    </div>
  );
}
