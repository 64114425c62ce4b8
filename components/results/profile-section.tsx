"use client";
import { StartReachSelect } from "./start-reach-select";
import { useMemo, type ReactNode } from "react";
import type { UnitSystem } from "@/lib/domain";
import type { ModelFile, RunResult } from "@/lib/model";
import { headwaterReaches, profileSeries } from "@/lib/results";
import { observedOnPath, type ResidualRow } from "@/lib/results/survey-residuals";
import { ProfileChart } from "./profile-chart";
import { ProfileCsvButton } from "./profile-csv-button";

/**
 * The DO-versus-distance card: a start-reach picker, the chart, and (when a
 * file stem is given) the profile CSV. The start reach is the caller's state
 * so a map click can set it too. With `observed` (a survey's rows against this run), the
 * samples on the path are drawn beside the modelled line.
 */
export function ProfileSection({
  run,
  model,
  unitSystem,
  from,
  onFrom,
  title = "DO along the river",
  csv,
  observed,
  children,
}: {
  run: RunResult;
  model: ModelFile;
  unitSystem: UnitSystem;
  from: string;
  onFrom: (reachId: string) => void;
  title?: string;
  csv?: { fileStem: string; about: string[]; condition?: string };
  /** A survey's rows against this run, and the survey's name for the chart's key. */
  observed?: { label: string; rows: readonly ResidualRow[] };
  children?: ReactNode;
}) {
  const heads = useMemo(() => headwaterReaches(model), [model]);
  const series = useMemo(() => profileSeries(run, model, from, unitSystem), [run, model, from, unitSystem]);
  const onChart = useMemo(() => (observed ? { label: observed.label, points: observedOnPath(series, observed.rows) } : undefined), [observed, series]);
  const offPath = observed ? observed.rows.filter((r) => r.onNetwork).length - (onChart?.points.length ?? 0) : 0;
  return (
    <section className="card space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <h2 className="grow">{title}</h2>
        <StartReachSelect id="profile-start" model={model} heads={heads} value={from} onChange={onFrom} />
        {csv && <ProfileCsvButton series={series} fileName={`${csv.fileStem}-profile-${from}.csv`} about={csv.about} condition={csv.condition} />}
      </div>
      {children}
      <ProfileChart series={series} observed={onChart} />
      {offPath > 0 && (
        <p className="text-sm text-ink-soft" data-testid="observed-off-path">
          {offPath} {offPath === 1 ? "sample lies" : "samples lie"} on reaches off this path: choose another start reach to see {offPath === 1 ? "it" : "them"} on the chart.
        </p>
      )}
    </section>
  );
}
