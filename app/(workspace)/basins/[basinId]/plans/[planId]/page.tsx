import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { PlanView } from "@/components/plans/plan-view";
import { Denied } from "@/components/ui/denied";
import { getDb } from "@/db/client";
import { basinPageAccess } from "@/lib/auth/page-access";
import { AppError } from "@/lib/errors";
import { myFacilityIds } from "@/lib/services/facilities";
import { getPlan } from "@/lib/services/plans";

export const metadata: Metadata = { title: "Plan" };

export default async function PlanPage({ params }: { params: Promise<{ basinId: string; planId: string }> }) {
  const { basinId, planId } = await params;
  const access = await basinPageAccess(basinId, "basin.read");
  if (!access.ok) return <Denied message={access.message} />;
  const db = getDb();
  let plan;
  try {
    plan = await getPlan(db, access.actor, access.basin.id, planId);
  } catch (e) {
    if (e instanceof AppError && e.status === 404) notFound();
    if (e instanceof AppError) return <Denied message={e.message} />;
    throw e;
  }
  return (
    <div>
      <h2 className="mb-4">{plan.title}</h2>
      <PlanView
        basinId={access.basin.id}
        initial={plan}
        unitSystem={access.basin.unitSystem}
        can={{
          signedIn: true,
          manageReview: await access.can("review.manage"),
          publish: await access.can("plan.publish"),
          answer: await access.can("comment.answer"),
          myFacilityIds: await myFacilityIds(db, access.actor, access.basin.id),
        }}
      />
    </div>
  );
}
