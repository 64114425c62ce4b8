"use client";
import type { FeatureCollection } from "geojson";
import { useMemo, useState, type ReactNode } from "react";
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

/**
 * What a published plan shows to anyone, as a TMDL documents it: the caution, allocations
 * (with CSV), the TMDL with its margin of safety and reserve, the critical conditions, the
 * methods (kinetics, reaeration, MOS), the DO map and profile, the comments received with
 * their responses, and the downloads (the PDF is the printable form of the same record).
 */
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
  conditionName,
  conditions,
  methods,
  responsiveness,
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
  /** The condition `run` is computed under (the governing one), named above the map and profile. */
  conditionName?: string;
  /** The critical-conditions table (server-rendered). */
  conditions?: ReactNode;
  /** Model, kinetics and reaeration, headwaters, allocation settings with MOS and reserve. */
  methods?: ReactNode;
  /** The comments received in review and their responses. */
  responsiveness?: ReactNode;
}) {
  const heads = useMemo(() => headwaterReaches(model), [model]);
  const [from, setFrom] = useState(heads[0]);
  return (
    <div className="space-y-6" data-testid="public-plan">
      <PlanningCaution />
      <section className="card space-y-3">
        <h2>Waste-load allocations</h2>
        <AllocationTable allocation={allocation} model={model} unitSystem={unitSystem} names={names} csvHref={`/api/basins/${basinId}/plans/${planId}/csv`} />
      </section>
      {allocation.tmdl && (
        <section className="card">
          <h2 className="mb-3">TMDL</h2>
          <TmdlSummary tmdl={allocation.tmdl} unitSystem={unitSystem} />
        </section>
      )}
      {conditions && (
        <section className="card space-y-3" aria-label="Critical conditions">
          <h2>Critical conditions</h2>
          <p className="text-sm text-ink-soft">
            The design conditions at which the allocation holds DO above the criterion, with every discharger at its allocated load; the governing
            condition is the one with the lowest DO.
          </p>
          {conditions}
        </section>
      )}
      {methods && (
        <section className="space-y-3" aria-label="Methods">
          <h2>Methods, margin of safety and reserve</h2>
          {methods}
        </section>
      )}
      {network.features.length > 0 && (
        <section className="grid gap-4 lg:grid-cols-[3fr_1fr]" aria-label="Map of dissolved oxygen">
          <DoMapLazy run={run} model={model} network={network} unitSystem={unitSystem} selectedReach={from} onSelectReach={setFrom} />
          <DoLegend criterionMgL={run.criterion_do_mg_l} />
        </section>
      )}
      <ProfileSection run={run} model={model} unitSystem={unitSystem} from={from} onFrom={setFrom} csv={{ fileStem, about: [], condition: conditionName }} title={conditionName ? `Dissolved oxygen with the allocated loads — ${conditionName}` : "Dissolved oxygen with the allocated loads"}>
        {conditionName && <p className="text-sm text-ink-soft" data-testid="shown-condition">Map and profile under {conditionName}, the governing condition.</p>}
        {network.features.length > 0 && <p className="text-sm text-ink-soft">Click a reach on the map, or choose one, to follow its water to the outlet.</p>}
      </ProfileSection>
      {responsiveness && (
        <section className="card space-y-3" aria-label="Comments and responses">
          <h2>Comments received and responses</h2>
          {responsiveness}
        </section>
      )}
      <PlanDownloads basinId={basinId} planId={planId} published />
    </div>
  );
}
