"use client";
import { useMemo } from "react";
import { SortableTable } from "@/components/tables/sortable-table";
import type { UnitSystem } from "@/db/schema";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import type { RunResult } from "@/lib/model/network/run";
import { reachRows, type ReachRow } from "@/lib/results/reach-rows";
import { column, DoCell } from "./columns";

/** Per-reach results: minimum DO and where, travel time, k_a and the method that gave it. */
export function ReachResultsTable({
  run,
  unitSystem,
  selectedReach,
  onSelectReach,
}: {
  run: RunResult;
  unitSystem: UnitSystem;
  selectedReach?: string | null;
  onSelectReach?: (reachId: string) => void;
}) {
  const rows = useMemo(() => reachRows(run), [run]);
  const len = unitLabel("length", unitSystem);
  const columns = useMemo(
    () => [
      column<ReachRow>("id", "Reach", (r) => r.id),
      column<ReachRow>("min_do", "Minimum DO (mg/L)", (r) => r.min_do_mg_l, {
        numeric: true,
        show: (r) => <DoCell value={r.min_do_mg_l} criterion={run.criterion_do_mg_l} />,
      }),
      column<ReachRow>("min_at", `at (${len} from head)`, (r) => r.min_do_km, { numeric: true, show: (r) => formatIn("length", r.min_do_km, unitSystem) }),
      column<ReachRow>("length", `Length (${len})`, (r) => r.length_km, { numeric: true, show: (r) => formatIn("length", r.length_km, unitSystem) }),
      column<ReachRow>("travel", "Travel time (d)", (r) => r.travel_time_day, { numeric: true, show: (r) => r.travel_time_day.toFixed(3) }),
      column<ReachRow>("ka", "k_a (1/d)", (r) => r.ka_min_per_day, {
        numeric: true,
        show: (r) => (r.ka_max_per_day - r.ka_min_per_day < 5e-4 ? r.ka_min_per_day.toFixed(3) : `${r.ka_min_per_day.toFixed(3)}–${r.ka_max_per_day.toFixed(3)}`),
      }),
      column<ReachRow>("method", "k_a from", (r) => r.ka_methods.join(", "), {
        show: (r) => `${r.ka_methods.join(", ")}${r.ka_floored ? " (raised to the 0.6/H floor)" : ""}`,
      }),
    ],
    [len, unitSystem, run.criterion_do_mg_l],
  );
  return (
    <SortableTable
      rows={rows}
      columns={columns}
      rowId={(r) => r.id}
      selectedId={selectedReach}
      onRowClick={onSelectReach ? (r) => onSelectReach(r.id) : undefined}
      testId="reach-results-table"
    />
  );
}
