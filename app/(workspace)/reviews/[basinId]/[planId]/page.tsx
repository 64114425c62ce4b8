import type { Metadata } from "next";
import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { FollowButton } from "@/components/basins/follow-button";
import { FacilitiesMap } from "@/components/plans/facilities-map";
import { PlanView } from "@/components/plans/plan-view";
import { Denied } from "@/components/ui/denied";
import { getDb } from "@/db/client";
import { basinPageAccess } from "@/lib/auth/page-access";
import { currentActor } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { followState } from "@/lib/services/follows";
import { getPlanForReaderWithMap } from "@/lib/services/plan-readers";

export const metadata: Metadata = { title: "Plan under review" };

/**
 * A plan as a reader outside its basin sees it: the allocations, the review
 * period, a map of the facilities on the river, and the threads, with a comment box while
 * the review is open.
 * Members go on to the plan in their workspace; published plans to the public page.
 */
export default async function ReviewPlanPage({ params }: { params: Promise<{ basinId: string; planId: string }> }) {
  const { basinId, planId } = await params;
  if ((await basinPageAccess(basinId, "basin.read")).ok) redirect(`/basins/${basinId}/plans/${planId}`);
  const db = getDb();
  const actor = await currentActor();
  let found;
  try {
    found = await getPlanForReaderWithMap(db, actor, basinId, planId);
  } catch (e) {
    if (e instanceof AppError && e.status === 404) notFound();
    if (e instanceof AppError) return <Denied message={e.message} />;
    throw e;
  }
  const { plan, basin, network } = found;
  if (plan.status === "published") redirect(`/published/${basin.id}/${plan.id}`);
  return (
    <div>
      <p className="text-sm text-ink-soft">
        <Link href="/reviews">Plans under review</Link> · {basin.name}
      </p>
      <h1 className="mb-1">{plan.title}</h1>
      <div className="mb-4 flex flex-wrap items-start justify-between gap-4">
        <p className="max-w-xl text-sm text-ink-soft">You are reading this plan as a member of the public; your comments show your name and that role.</p>
        <div className="max-w-sm">
          <FollowButton basinId={basin.id} followed={(await followState(db, actor, basin.id)).followed} />
        </div>
      </div>
      {network.features.length > 0 && (
        <div className="mb-6">
          <FacilitiesMap
            network={network}
            threadIds={Object.fromEntries(plan.threads.filter((t) => t.permitId).map((t) => [t.permitId!, t.id]))}
          />
        </div>
      )}
      <PlanView
        basinId={basin.id}
        initial={plan}
        unitSystem={basin.unitSystem}
        can={{ signedIn: true, manageReview: false, publish: false, answer: false, myFacilityIds: [] }}
      />
    </div>
  );
}
