import { route } from "@/lib/api/route";
import { withdrawPlan } from "@/lib/services/plans";
import { planParams } from "@/lib/validation/params";

export const POST = route({ access: { basin: true }, params: planParams, status: 204 }, ({ scope, params }) =>
  withdrawPlan(scope, params.planId),
);
