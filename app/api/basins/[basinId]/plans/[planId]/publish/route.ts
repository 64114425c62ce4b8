import { route } from "@/lib/api/route";
import { publishPlan } from "@/lib/services/plans";
import { planParams } from "@/lib/validation/params";

export const POST = route({ access: { basin: "plan.publish" }, params: planParams, status: 204 }, ({ db, actor, params }) =>
  publishPlan(db, actor, params.basinId, params.planId),
);
