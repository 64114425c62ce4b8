import type { ReactNode } from "react";
import type { UnitSystem } from "@/lib/domain";
import { formatIn, reductionText, unitLabel } from "@/lib/format/quantities";
import { compareRuns, type ComparedRun } from "@/lib/results/compare";
import { formatDo } from "@/lib/results/do-scale";
import type { InputDifference } from "@/lib/results/input-diff";
import { objectiveName, objectiveValueText } from "@/lib/results/objective-text";
import { quoted } from "@/lib/results/run-conditions";
import { GoverningBadge, MeetsBadge } from "./condition-summary";

/**
 * Two or more runs side by side, for choosing between them: the governing condition and
 * a row per condition (lowest DO, where, meets or fails — model runs too), the inputs that
 * differ, each facility's allocation (name and permit id) with its change from the first
 * run, the totals and the objective in plain words.
 */
export function ComparisonTable({
  runs,
  unitSystem,
  differences = [],
  names = {},
}: {
  runs: ComparedRun[];
  unitSystem: UnitSystem;
  /** Inputs that differ between the runs (lib/results/input-diff). */
  differences?: InputDifference[];
  /** Facility names by permit id. */
  names?: Record<string, string>;
}) {
  const c = compareRuns(runs);
  const u = unitLabel("load", unitSystem);
  const len = unitLabel("length", unitSystem);
  const load = (kg: number | null) => formatIn("load", kg, unitSystem);
  const where = (m: { reach: string; km: number }) => `${m.reach}, ${formatIn("length", m.km, unitSystem)} ${len}`;
  const span = c.columns.length + 1;
  const baselineName = c.baseline === 0 ? "the first run" : `run ${(c.baseline ?? 0) + 1}`;
  const change = (kg: number | null) => {
    if (kg === null) return null;
    const shown = load(Math.abs(kg));
    if (Number(shown) === 0) return `same as ${baselineName}`;
    return `${kg > 0 ? "+" : "−"}${shown} ${u} against ${baselineName}`;
  };
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
          <Section span={span}>Dissolved oxygen</Section>
          <Row
            label="Governing condition"
            strong
            values={c.columns.map((col) => (
              <span key={col.label} data-testid="governing-cell">
                {formatDo(col.governing.minimum.do_mg_l)} mg/L under {quoted(col.governing.name)}
                <span className="block text-xs font-normal text-ink-soft">{where(col.governing.minimum)}</span>
              </span>
            ))}
          />
          <Row label="Meets the criterion under every condition" values={c.columns.map((col) => <MeetsBadge key={col.label} meets={col.meets} />)} />
          {c.conditions.map((cond) => (
            <Row
              key={cond.name}
              label={`Lowest DO under ${quoted(cond.name)}`}
              values={cond.cells.map((cell, i) =>
                cell ? (
                  <span key={i}>
                    {formatDo(cell.minimum.do_mg_l)} mg/L <MeetsBadge meets={cell.meets} />
                    {cell.governing && c.columns[i].conditions.length > 1 && <GoverningBadge />}
                    <span className="block text-xs text-ink-soft">{where(cell.minimum)}</span>
                  </span>
                ) : (
                  "not in this run"
                ),
              )}
            />
          ))}

          <Section span={span}>Inputs that differ</Section>
          {differences.length === 0 ? (
            <tr>
              <td colSpan={span} className="text-sm text-ink-soft">
                The runs were computed from the same inputs.
              </td>
            </tr>
          ) : (
            differences.map((d) => <Row key={d.key} label={d.label} values={d.values} />)
          )}

          <Section span={span}>
            Allocated CBODu ({u}), reduction from today{c.baseline !== null && c.facilities.length > 0 ? ` and change from ${baselineName} (${c.columns[c.baseline].label})` : ""}
          </Section>
          {c.facilities.length === 0 && (
            <tr>
              <td colSpan={span} className="text-sm text-ink-soft">
                None of these runs allocates loads.
              </td>
            </tr>
          )}
          {c.facilities.map((f) => (
            <tr key={f.id}>
              <td>
                {names[f.id] ?? f.id}
                {names[f.id] && <span className="ml-1 font-mono text-xs text-ink-faint">{f.id}</span>}
              </td>
              {f.entries.map((e, i) => (
                <td key={c.columns[i].label} className="num">
                  {e ? (
                    <>
                      {load(e.cbodu_kg_day)} ({reductionText(e.reduction_pct)})
                      {change(f.change_kg_day[i]) && <span className="block text-xs text-ink-soft">{change(f.change_kg_day[i])}</span>}
                    </>
                  ) : c.columns[i].feasible === false ? (
                    "no allocation"
                  ) : (
                    "—"
                  )}
                </td>
              ))}
            </tr>
          ))}
          <Row label={`Total CBODu (${u})`} values={c.columns.map((col) => load(col.total_cbodu_kg_day))} strong />
          <Row label={`Total BOD5 (${u})`} values={c.columns.map((col) => load(col.total_bod5_kg_day))} />
          <Row label="Objective" values={c.columns.map((col) => objectiveName(col.objective))} />
          <Row label="Objective value" values={c.columns.map((col) => objectiveValueText(col.objective, col.objective_value, col.objective_units, unitSystem))} />
          <Row label="Allocation found" values={c.columns.map((col) => (col.feasible === null ? "model run only" : col.feasible ? "yes" : "no allocation meets the criterion"))} />
        </tbody>
      </table>
    </div>
  );
}

function Section({ span, children }: { span: number; children: ReactNode }) {
  return (
    <tr>
      <td colSpan={span} className="bg-paper-sunk text-xs font-semibold uppercase text-ink-soft">
        {children}
      </td>
    </tr>
  );
}

function Row({ label, values, strong = false }: { label: string; values: ReactNode[]; strong?: boolean }) {
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
