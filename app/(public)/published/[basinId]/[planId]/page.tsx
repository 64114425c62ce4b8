import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { NameMark } from "@/components/brand/name-mark";
import { PublicPlan } from "@/components/plans/public-plan";
import { Notice } from "@/components/ui/notice";
import { getDb } from "@/db/client";
import { currentActor } from "@/lib/auth/session";
import type { AllocationResult, ModelFile, RunResult } from "@/lib/model";
import { getPublishedPlanWithMap } from "@/lib/services/plan-reports";

export const metadata: Metadata = { title: "Published plan" };
export const dynamic = "force-dynamic";

interface Snapshot {
  run: { result: { allocation: AllocationResult; conditions: { run: RunResult }[] }; modelFiles: { file: ModelFile }[] };
}

/** A published plan, readable without signing in. */
export default async function PublishedPlanPage({ params }: { params: Promise<{ basinId: string; planId: string }> }) {
  const { basinId, planId } = await params;
  const found = await getPublishedPlanWithMap(getDb(), await currentActor(), basinId, planId);
  if (!found) notFound();
  const { plan, basin, network } = found;
  const snapshot = plan.snapshot as unknown as Snapshot;
  return (
    <main className="mx-auto max-w-6xl px-6 py-10">
      <Link href="/" className="no-underline hover:no-underline" aria-label="Sagline home">
        <NameMark />
      </Link>
      <h1 className="mt-6">{plan.title}</h1>
      <p className="mb-6 text-sm text-ink-soft">
        {basin.name} · version {plan.version} · published {plan.publishedAt ? new Date(plan.publishedAt).toLocaleDateString("en-CA") : ""}
      </p>
      {found.supersededBy && (
        <div className="mb-6">
          <Notice tone="warning" title="Superseded">
            A later version of this plan has been published:{" "}
            <Link href={`/published/${basinId}/${found.supersededBy.id}`}>version {found.supersededBy.version}</Link>. This version stays readable as it was
            published.
          </Notice>
        </div>
      )}
      <PublicPlan
        basinId={basinId}
        planId={plan.id}
        network={network}
        allocation={snapshot.run.result.allocation}
        model={snapshot.run.modelFiles[0].file}
        run={snapshot.run.result.conditions[0].run}
        unitSystem={basin.unitSystem}
        fileStem={`${basin.slug}-plan-v${plan.version}`}
        names={Object.fromEntries(plan.allocations.map((a) => [a.permitId, a.facilityName]))}
      />
    </main>
  );
}
