"use client";
import type { ImportReport, Problem } from "@/geo";
import { outletSentence } from "@/lib/format/outlet";

const TONE = {
  error: "border-clay-500 bg-clay-100 text-clay-700",
  warning: "border-ochre-500 bg-ochre-100 text-ochre-700",
} as const;

/** The validation report: errors block saving, warnings don't; a click shows the problem on the map. */
export function ReportView({
  report,
  onShow,
  shown,
}: {
  report: ImportReport;
  onShow: (problem: Problem) => void;
  shown: Problem | null;
}) {
  const row = (p: Problem, i: number) => (
    <li key={`${p.severity}-${i}`}>
      <button
        type="button"
        disabled={!p.geometry}
        onClick={() => p.geometry && onShow(p)}
        className={`w-full rounded-md border-l-4 px-3 py-2 text-left text-sm ${TONE[p.severity]} ${
          shown === p ? "ring-2 ring-tarn-500" : ""
        } ${p.geometry ? "hover:brightness-95" : "cursor-default"}`}
      >
        <span className="mr-2 text-xs font-semibold uppercase">{p.severity}</span>
        {p.message}
        {p.geometry && <span className="ml-2 text-xs underline">show on map</span>}
      </button>
    </li>
  );
  const n = report.network;
  return (
    <div className="space-y-3" data-testid="validation-report">
      <p className="text-sm text-ink-soft">
        {n.reaches.length} reaches, {n.nodes.length} nodes, {n.parts.length} separate part(s), {n.dischargers.length} discharger(s);
        total length {n.totalLengthKm.toFixed(2)} km.{" "}
        <strong className={report.errors.length ? "text-clay-700" : "text-reed-700"}>
          {report.errors.length} error(s), {report.warnings.length} warning(s).
        </strong>
      </p>
      {n.parts.length > 0 && (
        <ul className="space-y-1 text-sm" data-testid="outlet-summary">
          {n.parts.map((part) => (
            <li key={part.index}>{outletSentence(part, n.parts.length)}</li>
          ))}
        </ul>
      )}
      {report.errors.length + report.warnings.length === 0 && (
        <p className="rounded-md bg-reed-100 px-3 py-2 text-sm text-reed-700">No problems found.</p>
      )}
      <ul className="space-y-2">
        {report.errors.map(row)}
        {report.warnings.map(row)}
      </ul>
    </div>
  );
}
