"use client";
import { When } from "@/components/layout/basin-zone";
import Link from "next/link";
import { Notice } from "@/components/ui/notice";
import { PLAN_STAGE_TEXT } from "@/lib/plans/review-rules";
import { usePlansQuery, type PlanSummaryDto } from "@/lib/queries/plans";

/** "version 1 of “Title”": the version a revision follows, as the reader can see it listed. */
function lineageTitle(plans: PlanSummaryDto[], p: PlanSummaryDto): string {
  const before = plans.filter((q) => q.lineageId === p.lineageId && q.version < p.version).sort((a, b) => b.version - a.version)[0];
  return before ? `version ${before.version}${before.title === p.title ? "" : ` of “${before.title}”`}` : `version ${p.version - 1}`;
}

export function PlanList({ basinId }: { basinId: string }) {
  const plans = usePlansQuery(basinId);
  if (plans.error) return <Notice tone="error">{plans.error.message}</Notice>;
  if (!plans.data) return <p className="text-ink-faint">Loading…</p>;
  if (plans.data.length === 0) {
    return <div className="card text-sm text-ink-soft">No plans yet. A planner proposes one from a finished allocation run.</div>;
  }
  return (
    <section className="card">
      <div className="overflow-x-auto">
      <table className="data-table" data-testid="plan-table">
        <thead>
          <tr>
            <th>Plan</th>
            <th>Version</th>
            <th>State</th>
            <th>Proposed</th>
          </tr>
        </thead>
        <tbody>
          {plans.data.map((p) => (
            <tr key={p.id}>
              <td>
                <Link href={`/basins/${basinId}/plans/${p.id}`} className="font-medium">
                  {p.title}
                </Link>
              </td>
              <td className="whitespace-nowrap">
                {/* versions count within a plan and its revisions */}
                version {p.version}
                {p.version > 1 && <span className="text-xs text-ink-faint"> · revises {lineageTitle(plans.data, p)}</span>}
              </td>
              <td>{PLAN_STAGE_TEXT[p.stage]}</td>
              <td className="text-xs">
                <When at={p.createdAt} day />
                {p.createdBy ? ` · ${p.createdBy}` : ""}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      </div>
    </section>
  );
}
