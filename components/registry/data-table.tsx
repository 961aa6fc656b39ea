"use client";

import { flexRender, getCoreRowModel, useReactTable, type ColumnDef, type SortingState } from "@tanstack/react-table";
import { Pager } from "@/components/ui/pager";
import { EmptyRow, ErrorRow, SkeletonRows, Table } from "@/components/ui/table";

export interface ServerPage<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

/**
 * A table whose sorting and paging happen on the server: the table only renders the
 * page it was given and reports header clicks, which the caller writes into the URL.
 */
export function DataTable<T>({
  caption,
  columns,
  data,
  isPending,
  error,
  onRetry,
  sort,
  dir,
  onSort,
  page,
  empty = "Nothing matches.",
}: {
  caption: string;
  columns: ColumnDef<T>[];
  data: ServerPage<T> | undefined;
  isPending: boolean;
  error: unknown;
  onRetry: () => void;
  sort: string;
  dir: "asc" | "desc";
  onSort: (sort: string, dir: "asc" | "desc") => void;
  page: number;
  empty?: string;
}) {
  const sorting: SortingState = sort ? [{ id: sort, desc: dir === "desc" }] : [];
  // The table is rebuilt from props on every render, so the compiler's memoisation is not needed here.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: data?.items ?? [],
    columns,
    state: { sorting },
    manualSorting: true,
    manualPagination: true,
    getCoreRowModel: getCoreRowModel(),
  });
  const cols = columns.length;
  return (
    <div>
      <Table caption={caption}>
        <thead>
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => {
                const sortable = h.column.getCanSort() && h.column.columnDef.enableSorting !== false;
                const active = sort === h.column.id;
                return (
                  <th
                    key={h.id}
                    scope="col"
                    aria-sort={active ? (dir === "asc" ? "ascending" : "descending") : undefined}
                    className="border-b border-ink-300 bg-ink-50 px-3 py-2 text-xs font-semibold uppercase tracking-wide text-ink-600"
                  >
                    {sortable ? (
                      <button type="button" className="inline-flex items-center gap-1 uppercase hover:text-ink-900" onClick={() => onSort(h.column.id, active && dir === "asc" ? "desc" : "asc")}>
                        {flexRender(h.column.columnDef.header, h.getContext())}
                        <span aria-hidden>{active ? (dir === "asc" ? "▲" : "▼") : "↕"}</span>
                      </button>
                    ) : (
                      flexRender(h.column.columnDef.header, h.getContext())
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {isPending && <SkeletonRows cols={cols} />}
          {!!error && <ErrorRow colSpan={cols} error={error} onRetry={onRetry} />}
          {data && data.items.length === 0 && <EmptyRow colSpan={cols}>{empty}</EmptyRow>}
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id}>
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className="border-b border-ink-100 px-3 py-2 align-top">
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </Table>
      <Pager page={page} total={data?.total} pageSize={data?.pageSize} />
    </div>
  );
}
