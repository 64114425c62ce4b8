"use client";
import {
  CartesianGrid,
  ComposedChart,
  Legend,
  Line,
  ReferenceArea,
  ReferenceLine,
  ResponsiveContainer,
  Scatter,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { DO_BAND_COLOURS, doBand, formatDo } from "@/lib/results/do-scale";
import { anoxicStretches, type ProfileSeries, type SeriesPoint } from "@/lib/results/profile-series";

const INK = "#1d2a33";
const FAINT = "#6f7d86";
const RULE = "#d9d6cc";

type Critical = ProfileSeries["criticals"][number];

function CriticalMark({ cx, cy, payload, criterion }: { cx?: number; cy?: number; payload?: Critical; criterion: number }) {
  if (cx === undefined || cy === undefined || !payload) return null;
  const colour = DO_BAND_COLOURS[doBand(payload.do_mg_l, criterion)];
  const r = payload.below ? 7 : 5.5;
  // a diamond, so critical points read differently from the line's own points
  return <path d={`M${cx},${cy - r} L${cx + r},${cy} L${cx},${cy + r} L${cx - r},${cy} Z`} fill="#ffffff" stroke={colour} strokeWidth={2.5} />;
}

function ProfileTooltip({ active, payload, unit }: { active?: boolean; payload?: ReadonlyArray<{ payload?: unknown }>; unit: string }) {
  const p = active ? (payload?.[0]?.payload as (SeriesPoint & Partial<Critical>) | undefined) : undefined;
  if (!p) return null;
  const isCritical = "below" in p;
  return (
    <div className="rounded-md border border-rule bg-paper-raised px-3 py-2 text-xs shadow">
      <p className="font-semibold">
        {isCritical ? "Critical point of " : "Reach "}
        {p.reach}
      </p>
      <p>
        {p.distance.toFixed(2)} {unit} along the path
      </p>
      <p>DO {p.do_mg_l < 0 ? "anoxic" : `${formatDo(p.do_mg_l)} mg/L`}</p>
      {!isCritical && <p>Saturation {formatDo(p.do_sat_mg_l)} mg/L</p>}
    </div>
  );
}

/**
 * DO versus distance along a path to the outlet: the DO line (anoxic stretches shaded
 * and drawn at zero), saturation, the criterion, dischargers as labelled verticals,
 * reach boundaries, and each reach's exact critical point as a diamond.
 */
export function ProfileChart({ series, height = 360 }: { series: ProfileSeries; height?: number }) {
  const criterion = series.criterion_mg_l;
  const top = Math.ceil(Math.max(criterion + 1, ...series.points.map((p) => p.do_sat_mg_l)) + 0.5);
  return (
    <div data-testid="profile-chart" className="w-full" style={{ height }} role="img" aria-label={`DO profile from ${series.origin ?? series.path[0]} to the outlet`}>
      <ResponsiveContainer width="100%" height="100%">
        <ComposedChart data={series.points} margin={{ top: 22, right: 24, bottom: 28, left: 8 }}>
          <CartesianGrid stroke={RULE} strokeDasharray="2 4" />
          <XAxis
            type="number"
            dataKey="distance"
            domain={[0, series.length]}
            tickFormatter={(v: number) => v.toFixed(1)}
            label={{ value: `Distance from ${series.origin ?? `the head of ${series.path[0]}`} (${series.unit})`, position: "insideBottom", offset: -16, fill: FAINT }}
            stroke={FAINT}
          />
          <YAxis
            type="number"
            domain={[0, top]}
            allowDataOverflow
            label={{ value: "Dissolved oxygen (mg/L)", angle: -90, position: "insideLeft", offset: 16, fill: FAINT, style: { textAnchor: "middle" } }}
            stroke={FAINT}
          />
          {anoxicStretches(series).map((s) => (
            <ReferenceArea key={`anoxic-${s.from}`} x1={s.from} x2={Math.max(s.to, s.from + series.length / 400)} y1={0} y2={top} fill={INK} fillOpacity={0.12} label={{ value: "anoxic", fill: INK, position: "center" }} />
          ))}
          {series.reaches.slice(1).map((r) => (
            <ReferenceLine key={`reach-${r.id}`} x={r.from} stroke={RULE} strokeWidth={1.5} label={{ value: r.id, position: "insideTopLeft", fill: FAINT, fontSize: 10 }} />
          ))}
          {series.dischargers.map((d) => (
            <ReferenceLine key={`discharger-${d.id}`} x={d.distance} stroke={INK} strokeDasharray="4 3" label={{ value: d.id, position: "top", fill: INK, fontSize: 11 }} />
          ))}
          <ReferenceLine
            y={criterion}
            stroke={DO_BAND_COLOURS.below}
            strokeWidth={1.5}
            strokeDasharray="6 3"
            label={{ value: `criterion ${criterion.toFixed(1)} mg/L`, position: "insideBottomRight", fill: DO_BAND_COLOURS.below, fontSize: 11 }}
          />
          <Line name="DO saturation" dataKey="do_sat_mg_l" stroke="#7fb1ae" strokeDasharray="5 4" dot={false} isAnimationActive={false} type="linear" />
          <Line name="DO" dataKey="do_shown_mg_l" stroke="#245659" strokeWidth={2.25} dot={false} isAnimationActive={false} type="linear" />
          <Scatter
            name="critical point"
            data={series.criticals}
            dataKey="do_shown_mg_l"
            // the marks draw themselves (CriticalMark); this colour is the legend's
            fill={FAINT}
            stroke={INK}
            legendType="diamond"
            isAnimationActive={false}
            shape={(props: unknown) => <CriticalMark {...(props as { cx?: number; cy?: number; payload?: Critical })} criterion={criterion} />}
          />
          <Tooltip content={({ active, payload }) => <ProfileTooltip active={active} payload={payload} unit={series.unit} />} />
          <Legend verticalAlign="top" align="right" height={24} wrapperStyle={{ fontSize: 12 }} />
        </ComposedChart>
      </ResponsiveContainer>
    </div>
  );
}
