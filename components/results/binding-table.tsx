"use client";
import { useMemo } from "react";
import { SortableTable } from "@/components/tables/sortable-table";
import type { UnitSystem } from "@/lib/domain";
import { conditionName } from "@/lib/format/labels";
import { formatIn, formatNumber, unitLabel } from "@/lib/format/quantities";
import type { AllocationResult } from "@/lib/model/allocation/types";
import { bindingRows, type BindingRow } from "@/lib/results/binding-rows";
import { column } from "./columns";

/** The checkpoints that limit the allocation, with what one more mg/L of room at each is worth. */
export function BindingTable({ allocation, unitSystem }: { allocation: AllocationResult; unitSystem: UnitSystem }) {
  const rows = useMemo(() => bindingRows(allocation, unitSystem), [allocation, unitSystem]);
  const columns = useMemo(() => {
    const first = rows[0];
    return [
      column<BindingRow>("condition", "Condition", (r) => conditionName(r.condition)),
      column<BindingRow>("reach", "Reach", (r) => r.reach),
      column<BindingRow>("km", `at (${unitLabel("length", unitSystem)} from head)`, (r) => r.km, { numeric: true, show: (r) => formatIn("length", r.km, unitSystem) }),
      column<BindingRow>("do", "DO (mg/L)", (r) => r.do_mg_l, { numeric: true, show: (r) => formatNumber("do", r.do_mg_l) }),
      column<BindingRow>("dual", `Worth of 1 mg/L (${first?.dual_unit ?? ""})`, (r) => r.dual_shown, { numeric: true, show: (r) => formatNumber("dual", r.dual_shown) }),
      ...(first?.gain_unit
        ? [column<BindingRow>("gain", `DO gained (${first.gain_unit})`, (r) => r.gain_shown, { numeric: true, show: (r) => formatNumber("dual", r.gain_shown) })]
        : []),
    ];
  }, [rows, unitSystem]);
  if (rows.length === 0) return <p className="text-sm text-ink-soft">No checkpoint binds: every facility is at its ceiling or floor.</p>;
  return (
    <div className="space-y-2">
      <p className="text-xs text-ink-faint">
        A binding checkpoint sits exactly at the criterion (plus any margin of safety). Its worth is how much the objective would
        improve if the requirement there were 1 mg/L lower.
      </p>
      <SortableTable rows={rows} columns={columns} rowId={(r) => String(rows.indexOf(r))} testId="binding-table" />
    </div>
  );
}
