"use client";
import type { ColumnDef } from "@tanstack/react-table";
import { formatNumber } from "@/lib/format/quantities";
import { isBelowCriterion } from "@/lib/results/do-scale";
import type { ReactNode } from "react";

/**
 * A sortable column: sorts on `value`, shows `show(row)` (default: the value).
 * Numeric columns are right-aligned by SortableTable.
 */
export function column<T>(
  id: string,
  header: string,
  value: (row: T) => string | number | null,
  options: { numeric?: boolean; show?: (row: T) => ReactNode } = {},
): ColumnDef<T, unknown> {
  return {
    id,
    header,
    accessorFn: value,
    sortUndefined: "last",
    meta: { numeric: options.numeric ?? false },
    cell: (c) => (options.show ? options.show(c.row.original) : (c.getValue() as ReactNode)),
  };
}

/** DO in a table cell: "anoxic" in a dark badge instead of a negative figure, clay when below the criterion. */
export function DoCell({ value, criterion }: { value: number; criterion: number }) {
  if (value < 0) return <span className="rounded bg-ink px-1.5 py-0.5 text-xs font-semibold uppercase text-paper">anoxic</span>;
  return <span className={isBelowCriterion(value, criterion) ? "font-semibold text-clay-700" : undefined}>{formatNumber("do", value)}</span>;
}
