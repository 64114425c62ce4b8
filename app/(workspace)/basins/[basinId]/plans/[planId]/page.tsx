import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { PlanView } from "@/components/plans/plan-view";
import { Denied } from "@/components/ui/denied";
import { basinPageAccess } from "@/lib/auth/page-access";
import { AppError } from "@/lib/errors";
import { myFacilityIds } from "@/lib/services/facilities";
import { getPlanIn } from "@/lib/services/plans";

export const metadata: Metadata = { title: "Plan" };

export default async function PlanPage({ params }: { params: Promise<{ basinId: string; planId: string }> }) {
  const { basinId, planId } = await params;
  const access = await basinPageAccess(basinId, "basin.read");
  if (!access.ok) return <Denied message={access.message} />;
  let plan;
  try {
    plan = await getPlanIn(access.scope, planId);
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
          manageReview: access.can("review.manage"),
          publish: access.can("plan.publish"),
          answer: access.can("comment.answer"),
          myFacilityIds: await myFacilityIds(access.scope),
        }}
      />
    </div>
  );
}
