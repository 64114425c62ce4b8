"use client";
import { CartesianGrid, ComposedChart, Line, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis } from "recharts";
import type { UnitSystem } from "@/lib/domain";
import { quantity, unitLabel } from "@/lib/format/quantities";
import type { FrequencyPlot } from "@/lib/results/frequency-plot";

const CURVE = "#245659";
const POINT = "#c08a2e";
const RULE = "#d9d6cc";

const tickT = (t: number) => (t >= 10 ? String(Math.round(t)) : String(t));

/**
 * A low-flow frequency plot: each year's n-day minimum at its plotting position and the fitted
 * log-Pearson III curve, flow against return period, both on logarithmic axes, in the basin's unit.
 */
export function FrequencyChart({ plot, days, unitSystem }: { plot: FrequencyPlot; days: number; unitSystem: UnitSystem }) {
  const unit = unitLabel("flow", unitSystem);
  const shown = (si: number) => quantity("flow", si, unitSystem).value;
  const points = plot.points.map((p) => ({ t: p.return_period_years, observed: shown(p.flow_m3_s), year: p.year }));
  const curve = plot.curve.map((c) => ({ t: c.return_period_years, fitted: shown(c.flow_m3_s) }));
  const all = [...points.map((p) => p.observed), ...curve.map((c) => c.fitted)];
  const lo = Math.min(...all);
  const hi = Math.max(...all);
  return (
    <figure className="space-y-2">
      <div className="w-full" style={{ height: 340 }} role="img" aria-label={`${days}-day annual minimum flows against return period, with the fitted log-Pearson III curve`}>
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart margin={{ top: 12, right: 20, bottom: 24, left: 8 }}>
            <CartesianGrid stroke={RULE} />
            <XAxis
              dataKey="t"
              type="number"
              scale="log"
              domain={[1, 100]}
              ticks={[1, 1.25, 2, 5, 10, 20, 50, 100]}
              tickFormatter={tickT}
              allowDataOverflow
              label={{ value: "Return period (years)", position: "insideBottom", offset: -12 }}
            />
            <YAxis
              type="number"
              scale="log"
              domain={[lo / 1.3, hi * 1.3]}
              allowDataOverflow
              tickFormatter={(v: number) => v.toPrecision(2)}
              width={64}
              label={{ value: unit, angle: -90, position: "insideLeft" }}
            />
            <Tooltip
              formatter={(v) => [`${Number(v).toPrecision(3)} ${unit}`, ""]}
              labelFormatter={(t) => `return period ${Number(t).toFixed(2)} years`}
            />
            <Line data={curve} dataKey="fitted" name="log-Pearson III" stroke={CURVE} strokeWidth={2.25} dot={false} isAnimationActive={false} />
            <Scatter data={points} dataKey="observed" name="annual minimum" fill={POINT} isAnimationActive={false} />
          </ComposedChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="text-xs text-ink-soft">
        Each dot is one climatic year&apos;s lowest {days}-day mean flow at its plotting position (rank m of n from the lowest, return period (n + 1)/m); the
        line is the fitted log-Pearson Type III distribution.
        {plot.zero_years > 0 && ` ${plot.zero_years} year(s) with a zero minimum cannot be drawn on a logarithmic axis and are not shown.`}
      </figcaption>
    </figure>
  );
}
