import { route } from "@/lib/api/route";
import { publishPlan } from "@/lib/services/plans";
import { planParams } from "@/lib/validation/params";
import { planPublishSchema } from "@/lib/validation/plan";

/** Approve and publish a closed review's plan; unanswered threads are acknowledged by id, with a statement. */
export const POST = route({ access: { basin: true }, params: planParams, body: planPublishSchema, status: 204 }, ({ scope, params, body }) =>
  publishPlan(scope, params.planId, body),
);
