import { route } from "@/lib/api/route";
import { withdrawPlan } from "@/lib/services/plans";
import { planParams } from "@/lib/validation/params";

export const POST = route({ access: { basin: "review.manage" }, params: planParams, status: 204 }, ({ db, actor, params }) =>
  withdrawPlan(db, actor, params.basinId, params.planId),
);
