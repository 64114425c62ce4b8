"use client";
import type { FeatureCollection } from "geojson";
import { useMemo, useState } from "react";
import { AllocationTable } from "@/components/results/allocation-table";
import { DoLegend } from "@/components/results/do-legend";
import { DoMapLazy } from "@/components/results/do-map-lazy";
import { PlanningCaution } from "@/components/results/planning-caution";
import { ProfileSection } from "@/components/results/profile-section";
import { TmdlSummary } from "@/components/results/tmdl-table";
import type { UnitSystem } from "@/db/schema";
import type { AllocationResult, ModelFile, RunResult } from "@/lib/model";
import { headwaterReaches } from "@/lib/results";
import { PlanDownloads } from "./plan-downloads";

/** What a published plan shows to anyone: allocations (with CSV), TMDL, the DO map and profile, downloads, and the caution. */
export function PublicPlan({
  basinId,
  planId,
  allocation,
  model,
  run,
  network,
  unitSystem,
  fileStem,
  names,
}: {
  basinId: string;
  planId: string;
  allocation: AllocationResult;
  model: ModelFile;
  run: RunResult;
  /** Reach lines of the network version the plan was computed on (an empty collection leaves the map out). */
  network: FeatureCollection;
  unitSystem: UnitSystem;
  fileStem: string;
  /** Facility names by permit id. */
  names?: Record<string, string>;
}) {
  const heads = useMemo(() => headwaterReaches(model), [model]);
  const [from, setFrom] = useState(heads[0]);
  return (
    <div className="space-y-6" data-testid="public-plan">
      <PlanningCaution />
      <section className="card space-y-3">
        <h2>Waste-load allocations</h2>
        <AllocationTable allocation={allocation} model={model} unitSystem={unitSystem} fileName={`${fileStem}-allocations.csv`} names={names} />
      </section>
      {allocation.tmdl && (
        <section className="card">
          <h2 className="mb-3">TMDL</h2>
          <TmdlSummary tmdl={allocation.tmdl} unitSystem={unitSystem} />
        </section>
      )}
      {network.features.length > 0 && (
        <section className="grid gap-4 lg:grid-cols-[3fr_1fr]" aria-label="Map of dissolved oxygen">
          <DoMapLazy run={run} model={model} network={network} unitSystem={unitSystem} selectedReach={from} onSelectReach={setFrom} />
          <DoLegend criterionMgL={run.criterion_do_mg_l} />
        </section>
      )}
      <ProfileSection run={run} model={model} unitSystem={unitSystem} from={from} onFrom={setFrom} title="Dissolved oxygen with the allocated loads">
        {network.features.length > 0 && <p className="text-sm text-ink-soft">Click a reach on the map, or choose one, to follow its water to the outlet.</p>}
      </ProfileSection>
      <PlanDownloads basinId={basinId} planId={planId} published />
    </div>
  );
}
