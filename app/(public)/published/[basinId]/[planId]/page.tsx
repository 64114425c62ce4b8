import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PublicPlan } from "@/components/plans/public-plan";
import { CriticalConditions, MethodGroups, ResponsivenessRecord } from "@/components/plans/public-plan-record";
import { Notice } from "@/components/ui/notice";
import { getDb } from "@/db/client";
import { formatWhen } from "@/lib/format/zoned-time";
import { planReport, readSnapshot } from "@/lib/reports/plan-report-data";
import { governingCondition } from "@/lib/results/governing";
import { acknowledgementSummary, responsivenessRows } from "@/lib/results/responsiveness";
import { getPublishedPlanWithMap } from "@/lib/services/plan-reports";

export const metadata: Metadata = { title: "Published plan" };
// The same for every reader (the header learns who is signed in in the browser), so the
// rendered page is stored the first time it is asked for and served from the store while
// it carries the plan's current publication tag (`data-publication` below; checked by one
// row read per request in lib/cache/next-cache-handler.cjs): a plan withdrawn, superseded
// or renamed is rendered afresh at once, in every process. Sent with `s-maxage=300`, so a
// shared cache keeps it at most five minutes, like the downloads.
export const revalidate = 300;
export const dynamicParams = true;
/** No page is rendered at build time (there is no database then); each on its first request. */
export function generateStaticParams(): { basinId: string; planId: string }[] {
  return [];
}

/** A published plan, readable without signing in. */
export default async function PublishedPlanPage({ params }: { params: Promise<{ basinId: string; planId: string }> }) {
  const { basinId, planId } = await params;
  const found = await getPublishedPlanWithMap(getDb(), basinId, planId);
  if (!found) notFound();
  const { plan, basin, network } = found;
  // checked against its schema when the plan was read (lib/plans/snapshot.ts)
  const snapshot = plan.snapshot;
  const record = readSnapshot(plan.snapshot);
  // the PDF's methods, word for word; the critical conditions get their own table below
  const methods = planReport(plan, { name: basin.name, unitSystem: basin.unitSystem }, null).methods.filter((g) => g.heading !== "Critical conditions");
  const timeZone = plan.review?.timeZone ?? "UTC";
  const ack = plan.publicationAcknowledgement;
  return (
    <main className="mx-auto max-w-6xl px-6 py-10" data-publication={found.publication}>
      <p className="text-sm text-ink-soft">
        <Link href="/published">Published plans</Link> · {basin.name}
      </p>
      <h1 className="mt-2">{plan.title}</h1>
      <p className="text-sm text-ink-soft" data-testid="published-line">
        {basin.name} · version {plan.version} · published {plan.publishedAt ? formatWhen(new Date(plan.publishedAt), timeZone) : ""}
      </p>
      {plan.review && (
        <p className="mb-6 text-sm text-ink-soft" data-testid="review-line">
          Public review from {formatWhen(new Date(plan.review.startsAt), timeZone)} to {formatWhen(new Date(plan.review.closedAt ?? plan.review.endsAt), timeZone)}.
        </p>
      )}
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
        run={governingCondition(record.run.result).run}
        unitSystem={basin.unitSystem}
        fileStem={`${basin.slug}-plan-v${plan.version}`}
        names={Object.fromEntries(plan.allocations.map((a) => [a.permitId, a.facilityName]))}
        conditionName={governingCondition(record.run.result).name}
        conditions={<CriticalConditions inputs={record.scenario.inputs.conditions} result={record.run.result} unitSystem={basin.unitSystem} />}
        methods={<MethodGroups groups={methods} />}
        responsiveness={
          <ResponsivenessRecord
            rows={responsivenessRows(plan.threads, ack)}
            acknowledgement={ack ? acknowledgementSummary(ack, timeZone) : null}
            timeZone={timeZone}
            respondedAt={Object.fromEntries(plan.threads.map((t) => [t.facilityName ?? "The plan as a whole", t.respondedAt]))}
          />
        }
      />
    </main>
  );
}
