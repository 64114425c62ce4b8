"use client";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { PLAN_STAGE_TEXT } from "@/lib/plans/review-rules";
import { useProposePlanMutation, usePlansQuery, type PlanSummaryDto } from "@/lib/queries/plans";
import { useRunQuery } from "@/lib/queries/scenarios";

/** Each lineage (a plan and its revisions) by its newest version, newest lineage first. */
function lineages(plans: PlanSummaryDto[]): PlanSummaryDto[] {
  const newest = new Map<string, PlanSummaryDto>();
  for (const p of plans) if (!newest.has(p.lineageId) || newest.get(p.lineageId)!.version < p.version) newest.set(p.lineageId, p);
  return [...newest.values()];
}

/**
 * Turn a feasible allocation run into a draft plan (a frozen snapshot of it): either a
 * revision of an earlier plan (its next version) or a plan of its own (version 1). The
 * choice starts at the plan this run's scenario last produced, as the server would.
 */
export function ProposePlan({ basinId, runId, defaultTitle }: { basinId: string; runId: string; defaultTitle: string }) {
  const router = useRouter();
  const propose = useProposePlanMutation(basinId);
  const plans = usePlansQuery(basinId).data;
  const scenarioId = useRunQuery(basinId, runId).data?.scenarioId;
  const [title, setTitle] = useState(defaultTitle);
  const [choice, setChoice] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const heads = useMemo(() => lineages(plans ?? []), [plans]);
  // the server's default: the newest plan from the same scenario (plans come newest first)
  const fromScenario = plans?.find((p) => p.scenarioId === scenarioId);
  const revises = choice ?? (fromScenario ? heads.find((h) => h.lineageId === fromScenario.lineageId)!.id : "new");
  const revised = heads.find((h) => h.id === revises);
  return (
    <section className="card space-y-2" aria-label="Propose a plan">
      <h2>Propose as a plan</h2>
      <p className="text-sm text-ink-soft">The plan keeps a copy of this run; later edits to the scenario do not change it.</p>
      {failure && <Notice tone="error">{failure}</Notice>}
      <div className="flex flex-wrap items-end gap-3">
        <div className="min-w-64 grow">
          <label htmlFor="plan-title" className="field-label">
            Plan title
          </label>
          <input id="plan-title" className="field-input" value={title} onChange={(e) => setTitle(e.target.value)} />
        </div>
        {heads.length > 0 && (
          <div className="min-w-64 grow">
            <label htmlFor="plan-revises" className="field-label">
              This plan is
            </label>
            <select id="plan-revises" className="field-input" value={revises} onChange={(e) => setChoice(e.target.value)}>
              <option value="new">A plan of its own (version 1)</option>
              {heads.map((h) => (
                <option key={h.id} value={h.id}>
                  A revision of “{h.title}” (version {h.version}, {PLAN_STAGE_TEXT[h.stage]}) → version {h.version + 1}
                </option>
              ))}
            </select>
          </div>
        )}
        <Button
          disabled={title.trim().length < 3 || propose.isPending || plans === undefined}
          onClick={async () => {
            setFailure(null);
            try {
              const plan = await propose.mutateAsync({ runId, title, revises: revised ? revised.id : null });
              router.push(`/basins/${basinId}/plans/${plan.id}`);
            } catch (e) {
              setFailure(e instanceof Error ? e.message : String(e));
            }
          }}
        >
          Propose plan
        </Button>
      </div>
      <p className="text-xs text-ink-faint">
        A revision replaces the earlier version once published (the earlier one is marked superseded); a plan of its own stands beside the others.
      </p>
    </section>
  );
}
