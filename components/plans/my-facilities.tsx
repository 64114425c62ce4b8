"use client";
import Link from "next/link";
import { useMemo } from "react";
import { PlanningCaution } from "@/components/results/planning-caution";
import { ProfileChart } from "@/components/results/profile-chart";
import { Notice } from "@/components/ui/notice";
import type { UnitSystem } from "@/db/schema";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import type { AllocationEntry, AllocationResult, ModelFile, RunResult } from "@/lib/model";
import { usePlanQuery, type PlanDto } from "@/lib/queries/plans";
import { isBelowCriterion } from "@/lib/results/do-scale";
import { downstreamOf, profileSeries } from "@/lib/results/profile-series";
import { PLAN_STAGE_TEXT } from "@/lib/plans/review-rules";
import { usePlanActs } from "./plan-acts";
import { Thread } from "./plan-view";

interface Snapshot {
  run: { result: { allocation: AllocationResult; conditions: { name: string; run: RunResult }[] }; modelFiles: { file: ModelFile }[] };
}

export interface MyFacility {
  id: string;
  name: string;
  permitId: string;
}

/**
 * A discharger's page: for each facility it represents, the proposed allocation
 * beside today's load, the permit terms that follow from it, DO below its
 * outfall with the allocated loads, and its comment thread.
 */
export function MyFacilities({
  basinId,
  facilities,
  plans,
  initial,
  unitSystem,
}: {
  basinId: string;
  facilities: MyFacility[];
  plans: { id: string; version: number; title: string; status: string }[];
  initial: PlanDto;
  unitSystem: UnitSystem;
}) {
  const { data } = usePlanQuery(basinId, initial.id, initial);
  const plan = data ?? initial;
  const { act, failure } = usePlanActs(basinId, plan.id);
  const snapshot = plan.snapshot as unknown as Snapshot;
  const model = snapshot.run.modelFiles[0].file;
  const run = snapshot.run.result.conditions[0].run;
  const open = plan.review?.open === true;
  return (
    <div className="space-y-6" data-testid="my-facilities">
      <PlanningCaution />
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <span>
          Showing <Link href={`/basins/${basinId}/plans/${plan.id}`}>{plan.title}</Link>, version {plan.version} ({PLAN_STAGE_TEXT[plan.stage]})
        </span>
        {plans.length > 1 && (
          <nav aria-label="Other plan versions" className="flex gap-2">
            {plans
              .filter((p) => p.id !== plan.id)
              .map((p) => (
                <Link key={p.id} href={`/basins/${basinId}/my-facilities?plan=${p.id}`}>
                  version {p.version}
                </Link>
              ))}
          </nav>
        )}
      </div>
      {open ? (
        <Notice tone="info" title="Review period open">
          You can comment on your allocation below until {new Date(plan.review!.endsAt).toLocaleString("en-CA", { dateStyle: "medium", timeStyle: "short", timeZone: plan.review!.timeZone })} ({plan.review!.timeZone}).
        </Notice>
      ) : (
        <p className="text-sm text-ink-soft">Comments are accepted only while a review period is open.</p>
      )}
      {facilities.map((f) => {
        const thread = plan.threads.find((t) => t.facilityId === f.id);
        const entry = snapshot.run.result.allocation.allocations.find((a) => a.id === f.permitId);
        return (
          <section key={f.id} className="space-y-4 rounded-lg border-2 border-ochre-500 p-4" aria-label={`Facility ${f.name}`} data-testid="my-facility">
            <h2>
              {f.name} <span className="font-mono text-sm text-ink-soft">{f.permitId}</span>
            </h2>
            {entry ? (
              <>
                <AllocationTerms entry={entry} model={model} permitId={f.permitId} unitSystem={unitSystem} />
                <BelowOutfall run={run} model={model} permitId={f.permitId} unitSystem={unitSystem} />
              </>
            ) : (
              <Notice tone="warning">This plan allocates nothing to {f.name}: the facility was not a discharger in the network the plan was computed on.</Notice>
            )}
            {thread && <Thread thread={thread} canComment={open} canAnswer={false} act={act} failure={failure} mine />}
          </section>
        );
      })}
    </div>
  );
}

function AllocationTerms({ entry, model, permitId, unitSystem }: { entry: AllocationEntry; model: ModelFile; permitId: string; unitSystem: UnitSystem }) {
  const load = unitLabel("load", unitSystem);
  const flow = unitLabel("flow", unitSystem);
  const discharger = model.dischargers.find((d) => d.id === permitId);
  const reduction = entry.reduction_pct === null ? "—" : `${Math.abs(entry.reduction_pct) < 0.05 ? "0.0" : entry.reduction_pct.toFixed(1)} %`;
  const rows: [string, string, string][] = [
    ["Ultimate CBOD (CBODu)", `${formatIn("load", entry.today_cbodu_kg_day, unitSystem)} ${load}`, `${formatIn("load", entry.cbodu_kg_day, unitSystem)} ${load}`],
    ["BOD5", `${formatIn("load", entry.today_cbodu_kg_day / entry.cbodu_bod5_ratio, unitSystem)} ${load}`, `${formatIn("load", entry.bod5_kg_day, unitSystem)} ${load}`],
  ];
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <table className="data-table" data-testid="my-allocation">
        <caption className="mb-1 text-left text-sm font-semibold">Proposed allocation beside today&apos;s load</caption>
        <thead>
          <tr>
            <th>Load</th>
            <th className="num">Today</th>
            <th className="num">Proposed</th>
          </tr>
        </thead>
        <tbody>
          {rows.map(([label, today, proposed]) => (
            <tr key={label}>
              <td>{label}</td>
              <td className="num">{today}</td>
              <td className="num font-semibold">{proposed}</td>
            </tr>
          ))}
          <tr>
            <td>Reduction from today</td>
            <td />
            <td className="num font-semibold">{reduction}</td>
          </tr>
        </tbody>
      </table>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm" data-testid="my-permit-terms">
        <dt className="col-span-2 mb-1 font-semibold">Permit terms at design flow</dt>
        {discharger && (
          <>
            <dt className="text-ink-soft">Design flow</dt>
            <dd>
              {formatIn("flow", discharger.flow_m3_s, unitSystem)} {flow}
            </dd>
          </>
        )}
        <dt className="text-ink-soft">Effluent BOD5</dt>
        <dd>{entry.bod5_mg_l.toFixed(1)} mg/L</dd>
        <dt className="text-ink-soft">Effluent CBODu</dt>
        <dd>{entry.cbodu_mg_l.toFixed(1)} mg/L</dd>
        <dt className="text-ink-soft">CBODu/BOD5 ratio</dt>
        <dd>
          {entry.cbodu_bod5_ratio.toFixed(2)} (bottle rate {entry.bottle_k_per_day.toFixed(2)}/d)
        </dd>
        <dt className="text-ink-soft">Allowed range</dt>
        <dd>
          {entry.max_kg_day - entry.min_kg_day <= 1e-6 * Math.max(1, entry.max_kg_day)
            ? "held at today's load (already at or below the technology floor)"
            : `${formatIn("load", entry.min_kg_day, unitSystem)}–${formatIn("load", entry.max_kg_day, unitSystem)} ${load} CBODu (floor to today's load)`}
        </dd>
      </dl>
    </div>
  );
}

function BelowOutfall({ run, model, permitId, unitSystem }: { run: RunResult; model: ModelFile; permitId: string; unitSystem: UnitSystem }) {
  const below = useMemo(() => {
    const reach = model.dischargers.find((d) => d.id === permitId)?.reach;
    return reach ? downstreamOf(profileSeries(run, model, reach, unitSystem), permitId) : null;
  }, [run, model, permitId, unitSystem]);
  if (!below) return null;
  const { series, lowest } = below;
  const criterion = series.criterion_mg_l;
  return (
    <div className="space-y-2">
      <h3 className="font-semibold">DO below the outfall, with every discharger at its proposed allocation</h3>
      {lowest && (
        <p className="text-sm" data-testid="lowest-below-outfall">
          Lowest DO downstream: <strong>{lowest.do_mg_l < 0 ? "anoxic" : `${lowest.do_mg_l.toFixed(2)} mg/L`}</strong>,{" "}
          {lowest.distance.toFixed(1)} {series.unit} below the outfall in reach {lowest.reach} (criterion {criterion.toFixed(1)} mg/L
          {isBelowCriterion(lowest.do_mg_l, criterion) ? ", not met" : ", met"}).
        </p>
      )}
      <ProfileChart series={series} height={300} />
    </div>
  );
}
