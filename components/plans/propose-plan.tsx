"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { usePlanAction } from "@/lib/queries/plans";

/** Turn a feasible allocation run into a draft plan (a frozen snapshot of it). */
export function ProposePlan({ basinId, runId, defaultTitle }: { basinId: string; runId: string; defaultTitle: string }) {
  const router = useRouter();
  const action = usePlanAction(basinId);
  const [title, setTitle] = useState(defaultTitle);
  const [failure, setFailure] = useState<string | null>(null);
  return (
    <section className="card space-y-2" aria-label="Propose a plan">
      <h2>Propose as a plan</h2>
      <p className="text-sm text-ink-soft">The plan keeps a copy of this run; later edits to the scenario do not change it.</p>
      {failure && <Notice tone="error">{failure}</Notice>}
      <div className="flex flex-wrap items-end gap-3">
        <div className="grow">
          <label htmlFor="plan-title" className="field-label">
            Plan title
          </label>
          <input id="plan-title" className="field-input" value={title} onChange={(e) => setTitle(e.target.value)} />
        </div>
        <Button
          disabled={title.trim().length < 3 || action.isPending}
          onClick={async () => {
            setFailure(null);
            try {
              const plan = (await action.mutateAsync({ path: "/plans", json: { runId, title } })) as { id: string };
              router.push(`/basins/${basinId}/plans/${plan.id}`);
            } catch (e) {
              setFailure(e instanceof Error ? e.message : String(e));
            }
          }}
        >
          Propose plan
        </Button>
      </div>
    </section>
  );
}
