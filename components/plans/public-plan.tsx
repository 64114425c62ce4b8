"use client";
import { useMemo, useState } from "react";
import { AllocationTable } from "@/components/results/allocation-table";
import { PlanningCaution } from "@/components/results/planning-caution";
import { ProfileSection } from "@/components/results/profile-section";
import { TmdlSummary } from "@/components/results/tmdl-table";
import type { UnitSystem } from "@/db/schema";
import type { AllocationResult, ModelFile, RunResult } from "@/lib/model";
import { headwaterReaches } from "@/lib/results";

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
      <ProfileSection run={run} model={model} unitSystem={unitSystem} from={from} onFrom={setFrom} title="Dissolved oxygen with the allocated loads" />
    </div>
  );
}
