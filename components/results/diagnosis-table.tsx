"use client";
import { useMemo } from "react";
import { SortableTable } from "@/components/tables/sortable-table";
import { Notice } from "@/components/ui/notice";
import type { UnitSystem } from "@/lib/domain";
import { conditionName } from "@/lib/format/labels";
import { formatIn, formatNumber, roundDecimals, unitLabel } from "@/lib/format/quantities";
import type { DiagnosisEntry } from "@/lib/model/allocation/types";
import { diagnosisRows, type DiagnosisRow } from "@/lib/results/diagnosis-rows";
import { column, DoCell } from "./columns";

const mgl = (x: number) => formatNumber("do", x);
// shares of a deficit to the whole per cent: a breakdown, not a measurement
const share = (x: number, p: number) => <span className="whitespace-nowrap">{`${mgl(x)} (${roundDecimals(p, 0)} %)`}</span>;

/**
 * Why no allocation meets the criterion: the checkpoints that fail with every discharger
 * at its floor, by how much, and how much of their deficit comes from background water,
 * SOD and upstream reaches versus the dischargers. Rows are keyed by position: two
 * checkpoints can share a place (just above and just below an outfall).
 */
export function DiagnosisTable({ diagnosis, unitSystem }: { diagnosis: DiagnosisEntry[]; unitSystem: UnitSystem }) {
  const rows = useMemo(() => diagnosisRows(diagnosis), [diagnosis]);
  const columns = useMemo(
    () => [
      column<DiagnosisRow>("reach", "Reach", (r) => r.reach),
      column<DiagnosisRow>("km", `at (${unitLabel("length", unitSystem)} from head)`, (r) => r.km, { numeric: true, show: (r) => formatIn("length", r.km, unitSystem) }),
      column<DiagnosisRow>("condition", "Condition", (r) => conditionName(r.condition)),
      column<DiagnosisRow>("do", "DO at floors (mg/L)", (r) => r.do_mg_l, { numeric: true, show: (r) => <DoCell value={r.do_mg_l} criterion={r.required_do_mg_l} /> }),
      column<DiagnosisRow>("required", "Required (mg/L)", (r) => r.required_do_mg_l, { numeric: true, show: (r) => mgl(r.required_do_mg_l) }),
      column<DiagnosisRow>("short", "Short by (mg/L)", (r) => r.shortfall_mg_l, { numeric: true, show: (r) => mgl(r.shortfall_mg_l) }),
      column<DiagnosisRow>("background", "Deficit from background (mg/L)", (r) => r.from_background_mg_l, {
        numeric: true,
        show: (r) => share(r.from_background_mg_l, r.background_pct),
      }),
      column<DiagnosisRow>("sod", "from SOD (mg/L)", (r) => r.from_sod_mg_l, { numeric: true, show: (r) => share(r.from_sod_mg_l, r.sod_pct) }),
      column<DiagnosisRow>("dischargers", "from dischargers (mg/L)", (r) => r.from_dischargers_mg_l, {
        numeric: true,
        show: (r) => share(r.from_dischargers_mg_l, r.dischargers_pct),
      }),
      column<DiagnosisRow>("without", "DO with no discharger (mg/L)", (r) => r.do_without_dischargers_mg_l, {
        numeric: true,
        show: (r) => <DoCell value={r.do_without_dischargers_mg_l} criterion={r.required_do_mg_l} />,
      }),
    ],
    [unitSystem],
  );
  const hopeless = rows.filter((r) => r.fails_without_dischargers);
  return (
    <div className="space-y-3" data-testid="diagnosis">
      <Notice tone="error" title="No allocation meets the criterion">
        <p>
          Even with every discharger at its floor, DO stays below the requirement at {rows.length} checkpoint{rows.length === 1 ? "" : "s"}.
          {hopeless.length > 0
            ? ` At ${hopeless.length} of them background water, SOD and upstream reaches alone already keep DO too low, so no cut in discharger loads can fix it there.`
            : " Everywhere the dischargers' share is what tips DO below: lower floors (more treatment) would be needed."}
        </p>
      </Notice>
      <SortableTable rows={rows} columns={columns} rowId={(r) => String(rows.indexOf(r))} testId="diagnosis-table" />
    </div>
  );
}
