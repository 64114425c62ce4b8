"use client";
import { useMemo } from "react";
import { CsvButton, CsvLink, downloadCsv, SortableTable } from "@/components/tables/sortable-table";
import type { UnitSystem } from "@/lib/domain";
import { formatIn, formatNumber, formatPercent, unitLabel } from "@/lib/format/quantities";
import type { AllocationResult } from "@/lib/model/allocation/types";
import type { ModelFile } from "@/lib/model/types";
import { allocationCsv, allocationRows, type AllocationRow } from "@/lib/results/csv-rows";
import { column } from "./columns";

/**
 * Each facility's allocation: CBODu and BOD5 loads, effluent BOD5 at design flow,
 * today's load and the reduction from it; sortable, with a CSV download that carries
 * the planning caution. `about` lines (basin, scenario, run) go into the CSV's notes.
 * A plan's table gives `csvHref` instead: its button fetches the plan's own CSV download,
 * so the page offers one allocation file under one name.
 */
export function AllocationTable({
  allocation,
  model,
  unitSystem,
  fileName = "allocation.csv",
  about = [],
  names,
  csvHref,
}: {
  allocation: AllocationResult;
  model: ModelFile;
  unitSystem: UnitSystem;
  fileName?: string;
  about?: string[];
  /** Facility names by permit id: shown beside each permit id and added to the CSV. */
  names?: Record<string, string>;
  /** The server's CSV of this table (a plan's download route); replaces the file built in the browser. */
  csvHref?: string;
}) {
  const rows = useMemo(() => allocationRows(allocation, model), [allocation, model]);
  const load = unitLabel("load", unitSystem);
  const columns = useMemo(() => {
    const l = (v: number) => formatIn("load", v, unitSystem);
    return [
      column<AllocationRow>("id", "Facility", (r) => (names?.[r.id] ? `${names[r.id]} ${r.id}` : r.id), {
        show: (r) =>
          names?.[r.id] ? (
            <span>
              {names[r.id]} <span className="font-mono text-xs text-ink-faint">{r.id}</span>
            </span>
          ) : (
            r.id
          ),
      }),
      column<AllocationRow>("flow", `Design flow (${unitLabel("flow", unitSystem)})`, (r) => r.design_flow_m3_s, {
        numeric: true,
        show: (r) => formatIn("flow", r.design_flow_m3_s, unitSystem),
      }),
      column<AllocationRow>("cbodu", `Allocated CBODu (${load})`, (r) => r.cbodu_kg_day, { numeric: true, show: (r) => l(r.cbodu_kg_day) }),
      column<AllocationRow>("bod5", `Allocated BOD5 (${load})`, (r) => r.bod5_kg_day, { numeric: true, show: (r) => l(r.bod5_kg_day) }),
      column<AllocationRow>("bod5_mg_l", "Effluent BOD5 (mg/L)", (r) => r.bod5_mg_l, { numeric: true, show: (r) => formatNumber("concentration", r.bod5_mg_l) }),
      column<AllocationRow>("today", `Today's CBODu (${load})`, (r) => r.today_cbodu_kg_day, { numeric: true, show: (r) => l(r.today_cbodu_kg_day) }),
      column<AllocationRow>("reduction", "Reduction (%)", (r) => r.reduction_pct, {
        numeric: true,
        // a reduction that rounds to zero is shown as 0.0, never as -0.0
        show: (r) => formatPercent(r.reduction_pct),
      }),
    ];
  }, [load, unitSystem, names]);
  if (!allocation.feasible) return <p className="text-sm text-ink-soft">No allocation meets the criterion; see the diagnosis.</p>;
  const csv = () => {
    const t = allocationCsv(allocation, model, unitSystem, about, names);
    downloadCsv(fileName, t.rows, t.columns, t.notes);
  };
  return (
    <div className="space-y-2">
      <div className="flex items-center justify-between gap-4">
        <p className="text-xs text-ink-faint">Effluent BOD5 is the allocated BOD5 load at the facility&apos;s design flow.</p>
        {csvHref ? <CsvLink href={csvHref} label="Download allocations (CSV)" /> : <CsvButton onClick={csv} />}
      </div>
      <SortableTable rows={rows} columns={columns} rowId={(r) => r.id} testId="allocation-table" initialSort={[{ id: "id", desc: false }]} />
    </div>
  );
}
