"use client";
import {
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from "@tanstack/react-table";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { csvText, type CsvColumn } from "@/lib/reports/csv-text";

export type { CsvColumn };

/**
 * Download rows as a CSV file built in the browser, by the same writer as the server's
 * downloads: one header row, `notes` (the caution first) in the last column "Notes".
 */
export function downloadCsv<T>(fileName: string, rows: T[], columns: CsvColumn<T>[], notes: string[] = []): void {
  const text = csvText({ notes, columns, rows });
  const url = URL.createObjectURL(new Blob([text], { type: "text/csv;charset=utf-8" }));
  const a = document.createElement("a");
  a.href = url;
  a.download = fileName;
  a.click();
  URL.revokeObjectURL(url);
}

/**
 * A sortable table (@tanstack/react-table) with numeric columns right-aligned
 * (give a column `meta: { numeric: true }`) and an optional selected row.
 */
export function SortableTable<T>({
  rows,
  columns,
  rowId,
  selectedId,
  onRowClick,
  testId,
  initialSort,
}: {
  rows: T[];
  columns: ColumnDef<T, unknown>[];
  rowId: (row: T) => string;
  selectedId?: string | null;
  onRowClick?: (row: T) => void;
  testId?: string;
  initialSort?: SortingState;
}) {
  const [sorting, setSorting] = useState<SortingState>(initialSort ?? []);
  // eslint-disable-next-line react-hooks/incompatible-library -- react-table returns new functions each render by design
  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getRowId: rowId,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  return (
    <div className="overflow-x-auto">
      <table className="data-table" data-testid={testId}>
        <thead>
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => {
                const numeric = (h.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                const sorted = h.column.getIsSorted();
                return (
                  <th
                    key={h.id}
                    className={numeric ? "num" : undefined}
                    aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}
                  >
                    <button type="button" className="uppercase" onClick={h.column.getToggleSortingHandler()}>
                      {flexRender(h.column.columnDef.header, h.getContext())}
                      {sorted === "asc" ? " ▲" : sorted === "desc" ? " ▼" : ""}
                    </button>
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr
              key={row.id}
              onClick={onRowClick ? () => onRowClick(row.original) : undefined}
              className={`${onRowClick ? "cursor-pointer hover:bg-tarn-50" : ""} ${row.id === selectedId ? "!bg-tarn-100" : ""}`}
              aria-selected={row.id === selectedId ? true : undefined}
            >
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className={(cell.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric ? "num" : undefined}>
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function CsvButton({ onClick, label = "Download CSV" }: { onClick: () => void; label?: string }) {
  return (
    <Button variant="secondary" className="px-3 py-1.5" onClick={onClick}>
      {label}
    </Button>
  );
}

/** The same look as CsvButton for a file the server makes (a plan's downloads), so one content has one file and one name. */
export function CsvLink({ href, label = "Download CSV" }: { href: string; label?: string }) {
  return (
    <a
      href={href}
      download
      className="inline-flex items-center justify-center rounded-md border border-rule-strong bg-paper-raised px-3 py-1.5 text-sm font-medium text-ink no-underline hover:bg-paper-sunk"
    >
      {label}
    </a>
  );
}
