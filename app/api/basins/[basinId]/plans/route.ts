import { route } from "@/lib/api/route";
import { listPlans, proposePlan } from "@/lib/services/plans";
import { basinParams } from "@/lib/validation/params";
import { planProposeSchema } from "@/lib/validation/plan";

/** Plans visible to the caller: drafts to planners and leads, plans in review to anyone signed in, published plans to all. */
export const GET = route({ access: { public: true }, params: basinParams }, ({ db, actor, params }) => listPlans(db, actor, params.basinId));

export const POST = route(
  { access: { basin: true }, params: basinParams, body: planProposeSchema, status: 201 },
  ({ scope, body }) => proposePlan(scope, body),
);
