import type { UnitSystem } from "@/db/schema";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import { compareRuns, type ComparedRun } from "@/lib/results/compare";
import { formatDo } from "@/lib/results/do-scale";

/**
 * Two or more runs side by side: each facility's allocated CBODu (and reduction from
 * today), the totals, the minimum DO and where, and the objective.
 */
export function ComparisonTable({ runs, unitSystem }: { runs: ComparedRun[]; unitSystem: UnitSystem }) {
  const c = compareRuns(runs);
  const u = unitLabel("load", unitSystem);
  const len = unitLabel("length", unitSystem);
  const load = (kg: number | null) => formatIn("load", kg, unitSystem);
  return (
    <div className="overflow-x-auto">
      <table className="data-table" data-testid="comparison-table">
        <thead>
          <tr>
            <th />
            {c.columns.map((col) => (
              <th key={col.label} className="num">
                {col.label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          <tr>
            <td colSpan={c.columns.length + 1} className="bg-paper-sunk text-xs font-semibold uppercase text-ink-soft">
              Allocated CBODu ({u}) and reduction from today
            </td>
          </tr>
          {c.facilities.map((f) => (
            <tr key={f.id}>
              <td>{f.id}</td>
              {f.entries.map((e, i) => (
                <td key={c.columns[i].label} className="num">
                  {e ? `${load(e.cbodu_kg_day)}${e.reduction_pct === null ? "" : ` (${e.reduction_pct.toFixed(1)} % cut)`}` : "—"}
                </td>
              ))}
            </tr>
          ))}
          <Row label={`Total CBODu (${u})`} values={c.columns.map((col) => load(col.total_cbodu_kg_day))} strong />
          <Row label={`Total BOD5 (${u})`} values={c.columns.map((col) => load(col.total_bod5_kg_day))} />
          <Row
            label="Minimum DO (mg/L)"
            values={c.columns.map((col) => `${formatDo(col.minimum.do_mg_l)} — ${col.minimum.reach} at ${formatIn("length", col.minimum.km, unitSystem)} ${len}`)}
          />
          <Row label="Objective" values={c.columns.map((col) => col.objective ?? "model run only")} />
          <Row
            label="Objective value"
            values={c.columns.map((col) => objectiveText(col.objective_value, col.objective_units, unitSystem))}
          />
          <Row label="Meets the criterion" values={c.columns.map((col) => (col.feasible === null ? "—" : col.feasible ? "yes" : "no"))} />
        </tbody>
      </table>
    </div>
  );
}

/** The objective's value; load objectives (stated in kg/d) are shown in the basin's load unit. */
function objectiveText(value: number | null, units: string | null, system: UnitSystem): string {
  if (value === null) return "—";
  if (units?.startsWith("kg/d")) return `${formatIn("load", value, system)} ${unitLabel("load", system)}${units.slice("kg/d".length)}`;
  return `${value.toFixed(3)} ${units ?? ""}`;
}

function Row({ label, values, strong = false }: { label: string; values: string[]; strong?: boolean }) {
  return (
    <tr className={strong ? "font-semibold" : undefined}>
      <td>{label}</td>
      {values.map((v, i) => (
        <td key={i} className="num">
          {v}
        </td>
      ))}
    </tr>
  );
}
