"use client";
import { StartReachSelect } from "./start-reach-select";
import { useMemo, type ReactNode } from "react";
import type { UnitSystem } from "@/lib/domain";
import type { ModelFile, RunResult } from "@/lib/model";
import { headwaterReaches, profileSeries } from "@/lib/results";
import { ProfileChart } from "./profile-chart";
import { ProfileCsvButton } from "./profile-csv-button";

/**
 * The DO-versus-distance card: a start-reach picker, the chart, and (when a
 * file stem is given) the profile CSV. The start reach is the caller's state
 * so a map click can set it too.
 */
export function ProfileSection({
  run,
  model,
  unitSystem,
  from,
  onFrom,
  title = "DO along the river",
  csv,
  children,
}: {
  run: RunResult;
  model: ModelFile;
  unitSystem: UnitSystem;
  from: string;
  onFrom: (reachId: string) => void;
  title?: string;
  csv?: { fileStem: string; about: string[]; condition?: string };
  children?: ReactNode;
}) {
  const heads = useMemo(() => headwaterReaches(model), [model]);
  const series = useMemo(() => profileSeries(run, model, from, unitSystem), [run, model, from, unitSystem]);
  return (
    <section className="card space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <h2 className="grow">{title}</h2>
        <StartReachSelect id="profile-start" model={model} heads={heads} value={from} onChange={onFrom} />
        {csv && <ProfileCsvButton series={series} fileName={`${csv.fileStem}-profile-${from}.csv`} about={csv.about} condition={csv.condition} />}
      </div>
      {children}
      <ProfileChart series={series} />
    </section>
  );
}
