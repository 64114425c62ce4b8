"use client";
import Link from "next/link";
import { Notice } from "@/components/ui/notice";
import { PLAN_STAGE_TEXT } from "@/lib/plans/review-rules";
import { usePlansQuery } from "@/lib/queries/plans";


export function PlanList({ basinId }: { basinId: string }) {
  const plans = usePlansQuery(basinId);
  if (plans.error) return <Notice tone="error">{plans.error.message}</Notice>;
  if (!plans.data) return <p className="text-ink-faint">Loading…</p>;
  if (plans.data.length === 0) {
    return <div className="card text-sm text-ink-soft">No plans yet. A planner proposes one from a finished allocation run.</div>;
  }
  return (
    <section className="card">
      <table className="data-table" data-testid="plan-table">
        <thead>
          <tr>
            <th>Version</th>
            <th>Plan</th>
            <th>State</th>
            <th>Proposed</th>
          </tr>
        </thead>
        <tbody>
          {plans.data.map((p) => (
            <tr key={p.id}>
              <td>v{p.version}</td>
              <td>
                <Link href={`/basins/${basinId}/plans/${p.id}`} className="font-medium">
                  {p.title}
                </Link>
              </td>
              <td>{PLAN_STAGE_TEXT[p.stage]}</td>
              <td className="text-xs">
                {new Date(p.createdAt).toLocaleDateString("en-CA")}
                {p.createdBy ? ` · ${p.createdBy}` : ""}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}
