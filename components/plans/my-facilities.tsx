"use client";
import type { PlanSnapshot } from "@/lib/plans/snapshot";
import Link from "next/link";
import { useMemo, useState } from "react";
import { PlanningCaution } from "@/components/results/planning-caution";
import { ProfileChart } from "@/components/results/profile-chart";
import { Notice } from "@/components/ui/notice";
import type { UnitSystem } from "@/db/schema";
import { formatIn, formatNumber, formatPercent, unitLabel } from "@/lib/format/quantities";
import type { AllocationEntry, ModelFile } from "@/lib/model";
import { usePlanQuery, type PlanDto } from "@/lib/queries/plans";
import { isBelowCriterion } from "@/lib/results/do-scale";
import { downstreamOf, profileSeries } from "@/lib/results/profile-series";
import { formatWhen } from "@/lib/format/zoned-time";
import { PLAN_STAGE_TEXT, type PlanStage } from "@/lib/plans/review-rules";
import { runConditions } from "@/lib/results/run-conditions";
import { Thread } from "./plan-view";

export interface MyFacility {
  id: string;
  name: string;
  permitId: string;
}

/** A version as the navigation names it (lib/services/my-facilities: label by state and date). */
export interface MyPlanVersion {
  id: string;
  title: string;
  label: string;
  governing: boolean;
  stage: PlanStage;
}

/**
 * A discharger's page: for each facility it represents, the proposed allocation
 * beside today's load, the permit terms that follow from it, DO below its
 * outfall with the allocated loads (under the plan's governing condition, the
 * others a choice away), and its comment thread. Opens on the plan that
 * governs; every version is named by its state and date.
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
  plans: MyPlanVersion[];
  initial: PlanDto;
  unitSystem: UnitSystem;
}) {
  const { data } = usePlanQuery(basinId, initial.id, initial);
  const plan = data ?? initial;
  const snapshot = plan.snapshot;
  const model = snapshot.run.modelFiles[0].file;
  const open = plan.review?.open === true;
  const shown = plans.find((p) => p.id === plan.id);
  const governing = plans.find((p) => p.governing);
  const later = governing?.stage === "published" ? plans.filter((p) => p.stage === "open" || p.stage === "scheduled") : [];
  return (
    <div className="space-y-6" data-testid="my-facilities">
      <PlanningCaution />
      <div className="space-y-2">
        <p className="text-sm" data-testid="my-plan-shown">
          Showing <Link href={`/basins/${basinId}/plans/${plan.id}`}>{plan.title}</Link>: <strong>{shown?.label ?? `version ${plan.version} (${PLAN_STAGE_TEXT[plan.stage]})`}</strong>
          {shown?.governing && <span className="text-ink-soft"> — the plan that governs your allocation</span>}
        </p>
        {governing && shown && !shown.governing && (
          <Notice tone="warning" title="Not the plan that governs">
            The allocation in force is{" "}
            <Link href={`/basins/${basinId}/my-facilities?plan=${governing.id}`}>
              {governing.title}, {governing.label}
            </Link>
            .
          </Notice>
        )}
        {later
          .filter((p) => p.id !== plan.id)
          .map((p) => (
            <Notice key={p.id} tone="info" title="A later version is proposed">
              <Link href={`/basins/${basinId}/my-facilities?plan=${p.id}`}>
                {p.title}, {p.label}
              </Link>{" "}
              would change your allocation if it is published; the published plan stays in force until then.
            </Notice>
          ))}
        {plans.length > 1 && (
          <nav aria-label="Plan versions" className="text-sm">
            <h2 className="mb-1 text-sm font-semibold">Every version proposed to you</h2>
            <ul className="space-y-1" data-testid="my-plan-versions">
              {plans.map((p) => (
                <li key={p.id}>
                  {p.id === plan.id ? (
                    <span aria-current="page" className="font-semibold">
                      {p.label}
                    </span>
                  ) : (
                    <Link href={`/basins/${basinId}/my-facilities?plan=${p.id}`}>{p.label}</Link>
                  )}{" "}
                  <span className="text-ink-soft">{p.title}</span>
                </li>
              ))}
            </ul>
          </nav>
        )}
      </div>
      {open ? (
        <Notice tone="info" title="Review period open">
          You can comment on your allocation below until {formatWhen(new Date(plan.review!.endsAt), plan.review!.timeZone)}.
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
                <BelowOutfall result={snapshot.run.result} modelFiles={snapshot.run.modelFiles} permitId={f.permitId} unitSystem={unitSystem} />
              </>
            ) : (
              <Notice tone="warning">This plan allocates nothing to {f.name}: the facility was not a discharger in the network the plan was computed on.</Notice>
            )}
            {thread && <Thread basinId={basinId} planId={plan.id} thread={thread} canComment={open} canAnswer={false} mine />}
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
  const reduction = entry.reduction_pct === null ? "—" : `${formatPercent(entry.reduction_pct)} %`;
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
        <dd>{formatNumber("concentration", entry.bod5_mg_l)} mg/L</dd>
        <dt className="text-ink-soft">Effluent CBODu</dt>
        <dd>{formatNumber("concentration", entry.cbodu_mg_l)} mg/L</dd>
        <dt className="text-ink-soft">CBODu/BOD5 ratio</dt>
        <dd>
          {formatNumber("ratio", entry.cbodu_bod5_ratio)} (bottle rate {formatNumber("rate", entry.bottle_k_per_day)}/d)
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

/**
 * DO below the outfall under one condition of the plan's run: the governing one (lowest DO,
 * lib/results/governing) first, named, with the others a choice away when the run has several.
 */
function BelowOutfall({
  result,
  modelFiles,
  permitId,
  unitSystem,
}: {
  result: PlanSnapshot["run"]["result"];
  modelFiles: PlanSnapshot["run"]["modelFiles"];
  permitId: string;
  unitSystem: UnitSystem;
}) {
  // runConditions names an old run's own condition as the scenario does before the governing rule reads the binding checkpoints
  const governing = useMemo(() => {
    const index = runConditions(result).governing;
    return { index, name: result.conditions[index].name };
  }, [result]);
  const [index, setIndex] = useState(governing.index);
  const condition = result.conditions[index] ?? result.conditions[governing.index];
  // a condition's own file where the run kept one per condition; the geometry is the same in each
  const model = (modelFiles.find((f) => f.name === condition.name) ?? modelFiles[0]).file;
  const below = useMemo(() => {
    const reach = model.dischargers.find((d) => d.id === permitId)?.reach;
    return reach ? downstreamOf(profileSeries(condition.run, model, reach, unitSystem), permitId) : null;
  }, [condition, model, permitId, unitSystem]);
  if (!below) return null;
  const { series, lowest } = below;
  const criterion = series.criterion_mg_l;
  const isGoverning = index === governing.index;
  const selectId = `below-condition-${permitId}`;
  return (
    <div className="space-y-2" data-testid="below-outfall">
      <div className="flex flex-wrap items-end gap-3">
        <h3 className="grow font-semibold">DO below the outfall, with every discharger at its proposed allocation</h3>
        {result.conditions.length > 1 && (
          <div>
            <label htmlFor={selectId} className="field-label">
              Critical condition
            </label>
            <select id={selectId} className="field-input" value={index} onChange={(e) => setIndex(Number(e.target.value))}>
              {result.conditions.map((c, i) => (
                <option key={c.name} value={i}>
                  {c.name}
                  {i === governing.index ? " (governing)" : ""}
                </option>
              ))}
            </select>
          </div>
        )}
      </div>
      <p className="text-sm" data-testid="below-outfall-condition">
        Under <strong>{condition.name}</strong>
        {isGoverning
          ? result.conditions.length > 1
            ? `, the condition that governs the plan (lowest DO of its ${result.conditions.length} critical conditions).`
            : ", the plan's critical condition."
          : `, one of the plan's ${result.conditions.length} critical conditions; the governing one is ${governing.name}.`}
      </p>
      {lowest && (
        <p className="text-sm" data-testid="lowest-below-outfall">
          Lowest DO downstream: <strong>{lowest.do_mg_l < 0 ? "anoxic" : `${formatNumber("do", lowest.do_mg_l)} mg/L`}</strong>,{" "}
          {formatNumber("length", lowest.distance)} {series.unit} below the outfall in reach {lowest.reach} (criterion {formatNumber("do", criterion)} mg/L
          {isBelowCriterion(lowest.do_mg_l, criterion) ? ", not met" : ", met"}).
        </p>
      )}
      <ProfileChart series={series} height={300} />
    </div>
  );
}
