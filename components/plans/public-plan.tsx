"use client";
import { useMemo, useState } from "react";
import { AllocationTable } from "@/components/results/allocation-table";
import { PlanningCaution } from "@/components/results/planning-caution";
import { ProfileChart } from "@/components/results/profile-chart";
import { TmdlSummary } from "@/components/results/tmdl-table";
import type { UnitSystem } from "@/db/schema";
import type { AllocationResult, ModelFile, RunResult } from "@/lib/model";
import { headwaterReaches, profileSeries } from "@/lib/results";

/** What a published plan shows to anyone: allocations (with CSV), TMDL, the DO profile, and the caution. */
export function PublicPlan({
  allocation,
  model,
  run,
  unitSystem,
  fileStem,
}: {
  allocation: AllocationResult;
  model: ModelFile;
  run: RunResult;
  unitSystem: UnitSystem;
  fileStem: string;
}) {
  const heads = useMemo(() => headwaterReaches(model), [model]);
  const [from, setFrom] = useState(heads[0]);
  const series = useMemo(() => profileSeries(run, model, from, unitSystem), [run, model, from, unitSystem]);
  return (
    <div className="space-y-6" data-testid="public-plan">
      <PlanningCaution />
      <section className="card space-y-3">
        <h2>Waste-load allocations</h2>
        <AllocationTable allocation={allocation} model={model} unitSystem={unitSystem} fileName={`${fileStem}-allocations.csv`} />
      </section>
      {allocation.tmdl && (
        <section className="card">
          <h2 className="mb-3">TMDL</h2>
          <TmdlSummary tmdl={allocation.tmdl} unitSystem={unitSystem} />
        </section>
      )}
      <section className="card space-y-3">
        <div className="flex flex-wrap items-end gap-3">
          <h2 className="grow">Dissolved oxygen with the allocated loads</h2>
          <div>
            <label htmlFor="public-from" className="field-label">
              From
            </label>
            <select id="public-from" className="field-input" value={from} onChange={(e) => setFrom(e.target.value)}>
              {model.reaches.map((r) => (
                <option key={r.id} value={r.id}>
                  {r.id}
                </option>
              ))}
            </select>
          </div>
        </div>
        <ProfileChart series={series} />
      </section>
    </div>
  );
}
