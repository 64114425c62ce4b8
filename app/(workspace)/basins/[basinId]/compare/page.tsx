import type { Metadata } from "next";
import Link from "next/link";
import { ComparisonTable } from "@/components/results/comparison-table";
import { PlanningCaution } from "@/components/results/planning-caution";
import { Denied } from "@/components/ui/denied";
import { Notice } from "@/components/ui/notice";
import { getDb } from "@/db/client";
import { basinPageAccess } from "@/lib/auth/page-access";
import { getRun } from "@/lib/services/runs";

export const metadata: Metadata = { title: "Compare runs" };

export default async function ComparePage({
  params,
  searchParams,
}: {
  params: Promise<{ basinId: string }>;
  searchParams: Promise<{ runs?: string }>;
}) {
  const { basinId } = await params;
  const { runs = "" } = await searchParams;
  const access = await basinPageAccess(basinId, "scenario.read");
  if (!access.ok) return <Denied message={access.message} />;
  const ids = [...new Set(runs.split(",").filter(Boolean))].slice(0, 8);
  const loaded = await Promise.all(ids.map((id) => getRun(getDb(), access.actor, access.basin.id, id).catch(() => null)));
  const done = loaded.filter((r) => r?.status === "done" && r.result);
  return (
    <div className="space-y-4">
      <h2>Compare runs</h2>
      <PlanningCaution />
      {done.length < 2 ? (
        <Notice tone="warning">Pick two or more finished runs on the scenarios page to compare them.</Notice>
      ) : (
        <section className="card overflow-x-auto">
          <ComparisonTable
            unitSystem={access.basin.unitSystem}
            runs={done.map((r) => ({
              label: `${r!.scenarioName} · ${r!.kind} · ${new Date(r!.createdAt).toLocaleString("en-CA", { dateStyle: "short", timeStyle: "short" })}`,
              run: r!.result!.conditions[0].run,
              allocation: r!.result!.allocation,
            }))}
          />
        </section>
      )}
      <Link href={`/basins/${access.basin.id}/scenarios`}>Back to scenarios and runs</Link>
    </div>
  );
}
