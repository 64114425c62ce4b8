"use client";
import type { FeatureCollection } from "geojson";
import { useMemo, useState } from "react";
import { AllocationTable } from "@/components/results/allocation-table";
import { BindingTable } from "@/components/results/binding-table";
import { ComparisonTable } from "@/components/results/comparison-table";
import { DiagnosisTable } from "@/components/results/diagnosis-table";
import { DoLegend } from "@/components/results/do-legend";
import { DoMapLazy } from "@/components/results/do-map-lazy";
import { PlanningCaution } from "@/components/results/planning-caution";
import { ProfileChart } from "@/components/results/profile-chart";
import { ProfileCsvButton } from "@/components/results/profile-csv-button";
import { ReachResultsTable } from "@/components/results/reach-results-table";
import { ResultsGeoJsonButton } from "@/components/results/results-geojson-button";
import { TmdlSummary } from "@/components/results/tmdl-table";
import type { UnitSystem } from "@/db/schema";
import type { AllocationResult, ModelFile, RunResult } from "@/lib/model";
import { profileSeries } from "@/lib/results/profile-series";

export function PreviewClient(p: {
  model: ModelFile;
  run: RunResult;
  allocation: AllocationResult;
  network: FeatureCollection;
  unitSystem: UnitSystem;
  other: { run: RunResult; allocation: AllocationResult };
}) {
  const [reach, setReach] = useState("TR-01");
  const series = useMemo(() => profileSeries(p.run, p.model, reach, p.unitSystem), [p.run, p.model, reach, p.unitSystem]);
  return (
    <main className="mx-auto max-w-6xl space-y-6 p-6">
      <PlanningCaution />
      <div className="grid gap-4 md:grid-cols-[1fr_240px]">
        <DoMapLazy run={p.run} model={p.model} network={p.network} unitSystem={p.unitSystem} selectedReach={reach} onSelectReach={setReach} />
        <DoLegend criterionMgL={p.run.criterion_do_mg_l} />
      </div>
      <section className="card">
        <div className="mb-2 flex justify-between">
          <h2>Profile from {reach}</h2>
          <div className="flex gap-2">
            <ProfileCsvButton series={series} />
            <ResultsGeoJsonButton run={p.run} model={p.model} network={p.network} />
          </div>
        </div>
        <ProfileChart series={series} />
      </section>
      <section className="card">
        <h2>Reaches</h2>
        <ReachResultsTable run={p.run} unitSystem={p.unitSystem} selectedReach={reach} onSelectReach={setReach} />
      </section>
      {p.allocation.feasible ? (
        <>
          <section className="card">
            <h2>Allocation</h2>
            <AllocationTable allocation={p.allocation} model={p.model} unitSystem={p.unitSystem} />
          </section>
          <section className="card">
            <h2>Binding checkpoints</h2>
            <BindingTable allocation={p.allocation} unitSystem={p.unitSystem} />
          </section>
          <section className="card">
            <h2>TMDL</h2>
            {p.allocation.tmdl && <TmdlSummary tmdl={p.allocation.tmdl} unitSystem={p.unitSystem} />}
          </section>
        </>
      ) : (
        <section className="card">
          <h2>Diagnosis</h2>
          <DiagnosisTable diagnosis={p.allocation.diagnosis ?? []} unitSystem={p.unitSystem} />
        </section>
      )}
      <section className="card">
        <h2>Comparison</h2>
        <ComparisonTable
          unitSystem={p.unitSystem}
          runs={[
            { label: "Most total load", run: p.run, allocation: p.allocation },
            { label: "Equal percent", ...p.other },
          ]}
        />
      </section>
    </main>
  );
}
