"use client";
import { StartReachSelect } from "./start-reach-select";
import { useMemo, useState } from "react";
import { CartesianGrid, ComposedChart, Legend, Line, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { UnitSystem } from "@/lib/domain";
import type { AllocationResult } from "@/lib/model/allocation/types";
import type { ModelFile } from "@/lib/model/types";
import type { RunResult } from "@/lib/model/network/run";
import { DO_BAND_COLOURS, formatDo } from "@/lib/results/do-scale";
import { governingIndex, type ConditionResult } from "@/lib/results/governing";
import { headwaterReaches } from "@/lib/results/path";
import { profileOverlay } from "@/lib/results/profile-series";

const FAINT = "#6f7d86";
const RULE = "#d9d6cc";
/**
 * One colour and dash per run, from the palette (tailwind.config.ts), so lines stay apart in
 * grey print too; clay is left to the criterion line.
 */
const LINES: Array<{ colour: string; dash?: string }> = [
  { colour: "#245659" },
  { colour: "#c08a2e", dash: "8 3" },
  { colour: "#1d2a33", dash: "2 3" },
  { colour: "#55652f", dash: "10 3 2 3" },
  { colour: "#7fb1ae", dash: "4 4" },
  { colour: "#143234", dash: "1 2" },
  { colour: "#7b8f4a" },
  { colour: "#6f7d86", dash: "6 2" },
];

export interface OverlayRun {
  label: string;
  conditions: readonly ConditionResult[];
  /** The run's model file (the first, for an allocation run: the network is the same under each condition). */
  models: ModelFile[];
  /** The allocation's binding checkpoints, conditions named as the run names them (runConditions): they break ties of the governing rule. */
  allocation?: Pick<AllocationResult, "binding"> | null;
}

const GOVERNING = "__governing__";

/**
 * DO profiles of the compared runs on one chart, from a chosen start reach to the outlet:
 * each run under its governing condition, or all under one named condition they share.
 */
export function ProfileOverlayChart({ runs, unitSystem, height = 380 }: { runs: OverlayRun[]; unitSystem: UnitSystem; height?: number }) {
  const first = runs[0].models[0];
  const heads = useMemo(() => headwaterReaches(first), [first]);
  const [from, setFrom] = useState(heads[0]);
  const [which, setWhich] = useState(GOVERNING);
  const shared = useMemo(() => runs[0].conditions.map((c) => c.name).filter((n) => runs.every((r) => r.conditions.some((c) => c.name === n))), [runs]);
  const overlay = useMemo(() => {
    const items = runs.map((r) => {
      const i = which === GOVERNING ? governingIndex(r.conditions, r.allocation) : r.conditions.findIndex((c) => c.name === which);
      const c = r.conditions[i];
      return { label: r.label, condition: c.name, run: c.run as RunResult, model: r.models[Math.min(i, r.models.length - 1)] };
    });
    return profileOverlay(items, from, unitSystem);
  }, [runs, which, from, unitSystem]);
  const top = Math.ceil(Math.max(...overlay.criteria_mg_l.map((c) => c + 1), ...overlay.lines.flatMap((l) => l.points.map((p) => p.do_shown_mg_l))) + 0.5);
  return (
    <section className="card space-y-3" data-testid="profile-overlay">
      <div className="flex flex-wrap items-end gap-3">
        <h2 className="grow">DO along the river, run by run</h2>
        <StartReachSelect id="overlay-start" model={first} heads={heads} value={from} onChange={setFrom} />
        <div>
          <label htmlFor="overlay-condition" className="field-label">
            Condition
          </label>
          <select id="overlay-condition" className="field-input" value={which} onChange={(e) => setWhich(e.target.value)}>
            <option value={GOVERNING}>Each run&apos;s governing condition</option>
            {shared.map((n) => (
              <option key={n} value={n}>
                {n}
              </option>
            ))}
          </select>
        </div>
      </div>
      {overlay.skipped.length > 0 && (
        <p className="text-sm text-ink-soft">Not drawn (their network has no path from {from} like the first run&apos;s): {overlay.skipped.join("; ")}.</p>
      )}
      <div className="w-full" style={{ height }} role="img" aria-label={`DO profiles of ${overlay.lines.length} runs from ${from} to the outlet`}>
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart margin={{ top: 22, right: 24, bottom: 28, left: 8 }}>
            <CartesianGrid stroke={RULE} strokeDasharray="2 4" />
            <XAxis
              type="number"
              dataKey="distance"
              domain={[0, overlay.length]}
              tickFormatter={(v: number) => v.toFixed(1)}
              label={{ value: `Distance from the head of ${from} (${overlay.unit})`, position: "insideBottom", offset: -16, fill: FAINT }}
              stroke={FAINT}
            />
            <YAxis
              type="number"
              domain={[0, top]}
              allowDataOverflow
              label={{ value: "Dissolved oxygen (mg/L)", angle: -90, position: "insideLeft", offset: 16, fill: FAINT, style: { textAnchor: "middle" } }}
              stroke={FAINT}
            />
            {overlay.reaches.slice(1).map((r) => (
              <ReferenceLine key={`reach-${r.id}`} x={r.from} stroke={RULE} strokeWidth={1.5} label={{ value: r.id, position: "insideTopLeft", fill: FAINT, fontSize: 10 }} />
            ))}
            {overlay.criteria_mg_l.map((c) => (
              <ReferenceLine
                key={`criterion-${c}`}
                y={c}
                stroke={DO_BAND_COLOURS.below}
                strokeWidth={1.5}
                strokeDasharray="6 3"
                label={{ value: `criterion ${c.toFixed(1)} mg/L`, position: "insideBottomRight", fill: DO_BAND_COLOURS.below, fontSize: 11 }}
              />
            ))}
            {overlay.lines.map((l, i) => (
              <Line
                key={l.label}
                name={`${l.label} (${l.condition})`}
                data={l.points}
                dataKey="do_shown_mg_l"
                stroke={LINES[i % LINES.length].colour}
                strokeDasharray={LINES[i % LINES.length].dash}
                strokeWidth={2.25}
                dot={false}
                isAnimationActive={false}
                type="linear"
              />
            ))}
            <Tooltip
              formatter={(v) => (typeof v === "number" ? `${formatDo(v)} mg/L` : String(v))}
              labelFormatter={(v) => (typeof v === "number" ? `${v.toFixed(2)} ${overlay.unit} along the path` : String(v))}
            />
            <Legend verticalAlign="top" align="left" wrapperStyle={{ fontSize: 12 }} />
          </ComposedChart>
        </ResponsiveContainer>
      </div>
      <ul className="text-sm text-ink-soft">
        {overlay.lines.map((l) => (
          <li key={l.label}>
            {l.label}, under “{l.condition}”: lowest {l.lowest.do_mg_l < 0 ? "anoxic" : `${formatDo(l.lowest.do_mg_l)} mg/L`} in {l.lowest.reach},{" "}
            {l.lowest.distance.toFixed(2)} {overlay.unit} along the path
          </li>
        ))}
      </ul>
    </section>
  );
}
