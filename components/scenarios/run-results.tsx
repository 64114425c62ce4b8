"use client";
import { nameOf, RUN_KIND_NAMES, RUN_STATUS_NAMES, THETA_RULE_NAMES } from "@/lib/format/labels";
import { useBasinZone } from "@/components/layout/basin-zone";
import { formatWhen } from "@/lib/format/zoned-time";
import type { FeatureCollection } from "geojson";
import Link from "next/link";
import { useMemo, useState } from "react";
import { ProposePlan } from "@/components/plans/propose-plan";
import { AllocationTable } from "@/components/results/allocation-table";
import { BindingTable } from "@/components/results/binding-table";
import { ConditionSummary } from "@/components/results/condition-summary";
import { DiagnosisTable } from "@/components/results/diagnosis-table";
import { DoLegend } from "@/components/results/do-legend";
import { DoMapLazy } from "@/components/results/do-map-lazy";
import { PlanningCaution } from "@/components/results/planning-caution";
import { ProfileSection } from "@/components/results/profile-section";
import { ReachResultsTable } from "@/components/results/reach-results-table";
import { ResultsGeoJsonButton } from "@/components/results/results-geojson-button";
import { SurveyComparison } from "@/components/results/survey-comparison";
import { CalibrationReport } from "@/components/calibration/calibration-report";
import { TmdlSummary } from "@/components/results/tmdl-table";
import { Notice } from "@/components/ui/notice";
import { DEFAULT_THETA_RULE, type UnitSystem } from "@/lib/domain";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import { useRunQuery } from "@/lib/queries/scenarios";
import { headwaterReaches } from "@/lib/results";
import { formatDo, isBelowCriterion } from "@/lib/results/do-scale";
import { conditionRows, conditionsLine, governingHeadline, quoted, runConditions } from "@/lib/results/run-conditions";
import { sagBelowOutlet } from "@/lib/results/sag-below-outlet";
import type { RunDto } from "@/lib/services/runs";

/** Everything a finished run shows: map, profile, tables, allocation, exports, and the caution. */
export function RunResults({
  basinId,
  basinName,
  initial,
  network,
  unitSystem,
  canPropose = false,
  runNetwork,
  canReadSurveys = false,
}: {
  basinId: string;
  basinName: string;
  initial: RunDto;
  network: FeatureCollection;
  unitSystem: UnitSystem;
  canPropose?: boolean;
  /** The network version the run used (a survey placed on another one is flagged). */
  runNetwork: { id: string; version: number };
  /** May read the basin's surveys: only then is the survey comparison shown (and the surveys asked for). */
  canReadSurveys?: boolean;
}) {
  const query = useRunQuery(basinId, initial.id);
  const run = query.data ?? initial;
  const zone = useBasinZone();
  // null: the governing condition, until the planner picks another
  const [picked, setPicked] = useState<number | null>(null);
  const [startReach, setStartReach] = useState<string | null>(null);
  const [observedOnMap, setObservedOnMap] = useState<FeatureCollection | null>(null);

  const result = run.result;
  const read = useMemo(() => (result?.conditions.length ? runConditions(result) : null), [result]);
  const conditionIndex = picked ?? read?.governing ?? 0;
  const condition = result?.conditions[conditionIndex];
  // an allocation run keeps one model file (its other conditions inside); the network drawn is the same under each
  const model = run.modelFiles[Math.min(conditionIndex, run.modelFiles.length - 1)].file;
  const heads = useMemo(() => headwaterReaches(model), [model]);
  const reachNames = useMemo(() => {
    const names: Record<string, string | null> = {};
    for (const f of network.features) {
      const p = f.properties;
      if (p?.kind === "reach" && typeof p.id === "string") names[p.id] = typeof p.name === "string" && p.name.trim() ? p.name : null;
    }
    return names;
  }, [network]);
  const from = startReach ?? heads[0];
  const about = [
    `${basinName} — scenario "${run.scenarioName}" v${run.scenarioVersion}`,
    `run ${run.id} (${nameOf(RUN_KIND_NAMES, run.kind).toLowerCase()})${run.finishedAt ? `, finished ${formatWhen(new Date(run.finishedAt), zone)}` : ""}`,
    ...(result?.conditions.length ? [conditionsLine(result)] : []),
  ];
  const stem = `${run.scenarioName.replace(/[^\w-]+/g, "-").toLowerCase()}-${run.kind}`;

  if (run.status === "queued" || run.status === "running") {
    return (
      <Notice tone="info">
        {nameOf(RUN_STATUS_NAMES, run.status)} ({Math.round(run.progress * 100)} %). The page updates by itself.
      </Notice>
    );
  }
  if (run.status === "failed" || !result || !condition || !read) {
    return (
      <Notice tone="error" title="This run failed">
        {run.error ?? "No result was stored."}
      </Notice>
    );
  }
  const r = condition.run;
  // points a hair under the criterion are the allocation's binding checkpoints, held to the solver's tolerance
  const below = r.below_criterion.filter((b) => isBelowCriterion(b.do_mg_l, r.criterion_do_mg_l));
  const allocation = read.allocation;
  const several = result.conditions.length > 1;
  const rows = conditionRows(result);
  const sag = sagBelowOutlet(r, model.reaches);
  const fileStem = (name: string) => `${stem}-${name.replace(/[^\w-]+/g, "-").toLowerCase()}`;
  const profile = {
    run: r,
    model,
    unitSystem,
    from,
    onFrom: setStartReach,
    title: several ? `DO along the river under ${quoted(condition.name)}` : undefined,
    csv: { fileStem: several ? fileStem(condition.name) : stem, about, condition: condition.name },
  };
  const profileHint = <p className="text-sm text-ink-soft">Click a reach on the map, or choose one, to follow its water to the outlet.</p>;
  return (
    <div className="space-y-6" data-testid="run-results">
      <PlanningCaution />
      {result.calibration && <CalibrationReport calibration={result.calibration} unitSystem={unitSystem} />}
      <section className="card space-y-3">
        <p className="text-xs text-ink-faint">{run.kind === "calibration" ? "The calibrated model: DO with the fitted coefficients, on today's loads" : run.kind !== "allocation" ? "Model run on today's loads" : allocation?.feasible ? "Allocation: DO with the allocated loads" : "Allocation: no allocation meets the criterion; DO with today's loads"}</p>
        <p className="text-xl font-semibold" data-testid="run-headline">
          {governingHeadline(result)}
        </p>
        {several && (
          <ConditionSummary rows={rows} unitSystem={unitSystem} selected={conditionIndex} onSelect={(i) => setPicked(i)} />
        )}
      </section>
      <div className="flex flex-wrap items-end gap-4">
        <dl className="grid grow grid-cols-2 gap-4 sm:grid-cols-3">
          <Stat label={`Lowest DO under ${quoted(condition.name)}`} value={r.minimum.do_mg_l < 0 ? "anoxic" : `${r.minimum.do_mg_l.toFixed(2)} mg/L`} />
          <Stat label="Where" value={`${r.minimum.reach}, ${formatIn("length", r.minimum.km, unitSystem)} ${unitLabel("length", unitSystem)}`} />
          <Stat label="Criterion" value={`${r.criterion_do_mg_l.toFixed(1)} mg/L`} />
        </dl>
        {several && (
          <div>
            <label htmlFor="condition" className="field-label">
              Condition on the map and profile
            </label>
            <select id="condition" className="field-input" value={conditionIndex} onChange={(e) => setPicked(Number(e.target.value))}>
              {result.conditions.map((c, i) => (
                <option key={c.name} value={i}>
                  {c.name}
                  {i === read.governing ? " (governing)" : ""}
                </option>
              ))}
            </select>
          </div>
        )}
      </div>
      {below.length > 0 ? (
        <Notice tone="warning">
          DO falls below the criterion at {below.length} point(s) in {[...new Set(below.map((b) => b.reach))].join(", ")} under “{condition.name}”.
        </Notice>
      ) : (
        <Notice tone="success">DO stays at or above the criterion everywhere under “{condition.name}”.</Notice>
      )}
      {sag && (
        <Notice tone="warning" title="The sag continues below the modelled network">
          <span data-testid="sag-below-outlet">
            The lowest DO under “{condition.name}”, {sag.doMgL < 0 ? "anoxic" : `${formatDo(sag.doMgL)} mg/L`}, is at the
            downstream end of {sag.reach}
            {reachNames[sag.reach] ? ` (${reachNames[sag.reach]})` : ""}, where the network ends, and DO is still falling
            there. Below the outlet DO will be lower still, so the critical point is not in these results: extend the
            network downstream to find it before relying on them.
          </span>
        </Notice>
      )}
      {result.warnings.length > 0 && (
        <Notice tone="warning" title="Assumptions made while building the model file">
          <ul className="list-disc pl-5">
            {result.warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </Notice>
      )}

      <section className="grid gap-4 lg:grid-cols-[3fr_1fr]">
        <DoMapLazy run={r} model={model} network={network} unitSystem={unitSystem} selectedReach={from} onSelectReach={setStartReach} observed={observedOnMap} />
        <DoLegend criterionMgL={r.criterion_do_mg_l} />
        {observedOnMap && (
          <p className="text-xs text-ink-soft" data-testid="map-observed-note">
            Amber dots: the compared survey&apos;s {observedOnMap.features.length} samples with coordinates, where they were placed; hover one for its observed and modelled DO.
          </p>
        )}
      </section>

      {canReadSurveys ? (
        <SurveyComparison basinId={basinId} runNetwork={runNetwork} condition={condition.name} profile={{ ...profile, children: profileHint }} onObserved={setObservedOnMap} />
      ) : (
        <ProfileSection {...profile}>{profileHint}</ProfileSection>
      )}

      <section className="card">
        <h2 className="mb-3">Reaches{several ? ` under ${quoted(condition.name)}` : ""}</h2>
        <ReachResultsTable run={r} unitSystem={unitSystem} selectedReach={from} onSelectReach={setStartReach} reachNames={reachNames} />
      </section>

      {allocation && (
        <>
          <section className="card space-y-3">
            <h2>Allocation — {allocation.feasible ? "feasible" : "no allocation meets the criterion"}</h2>
            {allocation.feasible ? (
              <AllocationTable allocation={allocation} model={run.modelFiles[0].file} unitSystem={unitSystem} fileName={`${stem}-allocation.csv`} about={about} />
            ) : (
              <DiagnosisTable diagnosis={allocation.diagnosis ?? []} unitSystem={unitSystem} />
            )}
          </section>
          {allocation.tmdl && (
            <section className="card">
              <h2 className="mb-3">TMDL</h2>
              <TmdlSummary tmdl={allocation.tmdl} unitSystem={unitSystem} />
            </section>
          )}
          {allocation.feasible && canPropose && (
            <ProposePlan basinId={basinId} runId={run.id} defaultTitle={`${basinName}: DO waste-load allocation (${run.scenarioName})`} />
          )}
          {allocation.binding.length > 0 && (
            <section className="card">
              <h2 className="mb-3">Checkpoints that bind</h2>
              <BindingTable allocation={allocation} unitSystem={unitSystem} />
            </section>
          )}
        </>
      )}

      <section className="card space-y-2">
        <h2>Exports and methods</h2>
        <div className="flex flex-wrap gap-3">
          <a className="rounded-md border border-rule-strong px-3 py-1.5 text-sm" href={`/api/basins/${basinId}/runs/${run.id}/model-file`}>
            Download the model file (JSON)
          </a>
          {result.conditions.map((c, i) => (
            <ResultsGeoJsonButton
              key={c.name}
              run={c.run}
              model={run.modelFiles[Math.min(i, run.modelFiles.length - 1)].file}
              network={network}
              condition={c.name}
              unitSystem={unitSystem}
              label={several ? `Reaches GeoJSON, ${quoted(c.name)}` : "Reaches GeoJSON"}
              fileName={several ? `${fileStem(c.name)}-reaches.geojson` : `${stem}-reaches.geojson`}
              about={about}
            />
          ))}
        </div>
        <p className="text-sm text-ink-soft">
          Every export names the condition it holds; the profile CSV follows the condition shown on the map.
        </p>
        <p className="text-sm text-ink-soft">
          Model {run.modelVersion}; deoxygenation temperature correction: {nameOf(THETA_RULE_NAMES, run.methods.deoxygenation_theta_rule ?? DEFAULT_THETA_RULE)}; saturation:{" "}
          {String(run.methods.saturation ?? "")}. The model file reproduces this run with <code>npm run model</code> or{" "}
          <code>npm run allocate</code>. Inputs hash <span className="font-mono text-xs">{run.inputsHash.slice(0, 16)}…</span>
        </p>
        <Link href={`/basins/${basinId}/scenarios/${run.scenarioId}`}>Back to the scenario</Link>
      </section>
    </div>
  );
}

function Stat({ label, value }: { label: string; value: string }) {
  return (
    <div className="card py-3">
      <dt className="text-xs text-ink-faint">{label}</dt>
      <dd className="text-lg font-semibold tabular-nums">{value}</dd>
    </div>
  );
}
