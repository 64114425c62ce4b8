"use client";
import { useMemo } from "react";
import { SortableTable } from "@/components/tables/sortable-table";
import { HYDRAULICS_RULE_SHORT, type UnitSystem } from "@/lib/domain";
import { nameOf, REAERATION_NAMES } from "@/lib/format/labels";
import { formatIn, formatNumber, unitLabel } from "@/lib/format/quantities";
import type { RunResult } from "@/lib/model/network/run";
import { reachRows, type ReachRow } from "@/lib/results/reach-rows";
import { column, DoCell } from "./columns";

/** "O'Connor–Dobbins, Owens–Edwards–Gibbs (raised to the 0.6/H floor)": the formulas that gave k_a, by name. */
export const kaMethodText = (r: ReachRow) => `${r.ka_methods.map((m) => nameOf(REAERATION_NAMES, m)).join(", ")}${r.ka_floored ? " (raised to the 0.6/H floor)" : ""}`;

const hydraulicsText = (r: ReachRow) => r.hydraulics.map((h) => HYDRAULICS_RULE_SHORT[h]).join(", ");

/** Per-reach results: minimum DO and where, travel time, k_a and the method that gave it. */
export function ReachResultsTable({
  run,
  unitSystem,
  selectedReach,
  onSelectReach,
  reachNames,
}: {
  run: RunResult;
  unitSystem: UnitSystem;
  /** Reach names by id (from the network the run used); a column appears when any reach has one. */
  reachNames?: Readonly<Record<string, string | null>>;
  selectedReach?: string | null;
  onSelectReach?: (reachId: string) => void;
}) {
  const rows = useMemo(() => reachRows(run), [run]);
  const len = unitLabel("length", unitSystem);
  const columns = useMemo(
    () => [
      column<ReachRow>("id", "Reach", (r) => r.id),
      ...(reachNames && Object.values(reachNames).some(Boolean) ? [column<ReachRow>("name", "Name", (r) => reachNames[r.id] ?? null)] : []),
      // the first click on minimum DO puts the worst reach on top
      {
        ...column<ReachRow>("min_do", "Minimum DO (mg/L)", (r) => r.min_do_mg_l, {
          numeric: true,
          show: (r) => <DoCell value={r.min_do_mg_l} criterion={run.criterion_do_mg_l} />,
        }),
        sortDescFirst: false,
      },
      column<ReachRow>("min_at", `at (${len} from head)`, (r) => r.min_do_km, { numeric: true, show: (r) => formatIn("length", r.min_do_km, unitSystem) }),
      column<ReachRow>("length", `Length (${len})`, (r) => r.length_km, { numeric: true, show: (r) => formatIn("length", r.length_km, unitSystem) }),
      column<ReachRow>("travel", "Travel time (d)", (r) => r.travel_time_day, { numeric: true, show: (r) => formatNumber("time", r.travel_time_day) }),
      column<ReachRow>("ka", "k_a (1/d)", (r) => r.ka_min_per_day, {
        numeric: true,
        show: (r) => {
          const [lo, hi] = [formatNumber("rate", r.ka_min_per_day), formatNumber("rate", r.ka_max_per_day)];
          return lo === hi ? lo : `${lo}–${hi}`;
        },
      }),
      column<ReachRow>("method", "Reaeration formula", (r) => kaMethodText(r), { show: (r) => kaMethodText(r) }),
      // only when some reach's velocity and depth follow its flow; otherwise every reach's are as given
      ...(rows.some((r) => r.hydraulics.some((h) => h !== "given"))
        ? [column<ReachRow>("hydraulics", "Velocity and depth", (r) => hydraulicsText(r), { show: (r) => hydraulicsText(r) })]
        : []),
    ],
    [len, unitSystem, run.criterion_do_mg_l, reachNames, rows],
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
