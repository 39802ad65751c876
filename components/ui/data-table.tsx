"use client";
// Data table on TanStack Table: sortable column headers, one filter box, numeric columns aligned right.
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type RowData,
  type SortingState,
  type VisibilityState,
} from "@tanstack/react-table";
import { clsx } from "clsx";
import { useId, useState, type ReactNode } from "react";

declare module "@tanstack/react-table" {
  // The type parameters must repeat TanStack's declaration to merge with it.
  interface ColumnMeta<TData extends RowData, TValue> {
    align?: "left" | "right";
  }
}

export interface DataTableProps<T> {
  data: T[];
  // Columns hold different value types; TanStack's documentation types such a list with `any`.
  columns: ColumnDef<T, any>[];
  caption: string;
  /** Shows a filter box over the table when given. */
  filterLabel?: string;
  initialSorting?: SortingState;
  getRowId?: (row: T) => string;
  /** Columns kept for the filter but not shown, e.g. `{ email: false }`. */
  columnVisibility?: VisibilityState;
  empty?: ReactNode;
}

export function DataTable<T>({
  data,
  columns,
  caption,
  filterLabel,
  initialSorting = [],
  getRowId,
  columnVisibility,
  empty,
}: DataTableProps<T>) {
  const [sorting, setSorting] = useState<SortingState>(initialSorting);
  const [globalFilter, setGlobalFilter] = useState("");
  const filterId = useId();
  const table = useReactTable({
    data,
    columns,
    state: { sorting, globalFilter },
    initialState: { columnVisibility },
    onSortingChange: setSorting,
    onGlobalFilterChange: setGlobalFilter,
    getRowId,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const rows = table.getRowModel().rows;

  return (
    <div className="grid gap-3">
      {filterLabel ? (
        <div className="flex items-center gap-2">
          <label htmlFor={filterId} className="sr-only">
            {filterLabel}
          </label>
          <input
            id={filterId}
            type="search"
            value={globalFilter}
            onChange={(event) => setGlobalFilter(event.target.value)}
            placeholder={filterLabel}
            className="h-10 w-full max-w-xs rounded border border-line-strong bg-surface px-3 text-base text-ink placeholder:text-ink-faint sm:h-9 sm:text-sm"
          />
        </div>
      ) : null}
      <div className="overflow-x-auto rounded border border-line">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-sunken text-left">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const right = header.column.columnDef.meta?.align === "right";
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}
                      className={clsx("px-3 py-2 text-xs font-semibold text-ink-muted", right && "text-right")}
                    >
                      {header.isPlaceholder ? null : header.column.getCanSort() ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className={clsx("inline-flex items-center gap-1 hover:text-ink", right && "flex-row-reverse")}
                        >
                          {flexRender(header.column.columnDef.header, header.getContext())}
                          <SortGlyph direction={sorted} />
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
            {rows.map((row) => (
              <tr key={row.id} className="border-t border-line bg-surface">
                {row.getVisibleCells().map((cell) => (
                  <td
                    key={cell.id}
                    className={clsx("px-3 py-2.5 align-middle", cell.column.columnDef.meta?.align === "right" && "nums text-right")}
                  >
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
            {rows.length === 0 ? (
              <tr className="border-t border-line bg-surface">
                <td colSpan={table.getVisibleLeafColumns().length} className="px-3 py-6 text-center text-ink-muted">
                  {globalFilter ? "Nothing matches the filter." : (empty ?? "Nothing here yet.")}
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}

function SortGlyph({ direction }: { direction: false | "asc" | "desc" }) {
  const glyph = direction === "asc" ? "↑" : direction === "desc" ? "↓" : "↕";
  return (
    <span aria-hidden="true" className={clsx("text-2xs", !direction && "text-ink-faint")}>
      {glyph}
    </span>
  );
}
