import { route } from "@/lib/api/route";
import { extendReview, openReview } from "@/lib/services/plans";
import { planParams } from "@/lib/validation/params";
import { reviewExtendSchema, reviewOpenSchema } from "@/lib/validation/plan";

export const POST = route(
  { access: { basin: true }, params: planParams, body: reviewOpenSchema, status: 204 },
  ({ scope, params, body }) => openReview(scope, params.planId, body),
);

/** Extend the open review to a later end; the reason is required and kept. */
export const PATCH = route(
  { access: { basin: true }, params: planParams, body: reviewExtendSchema, status: 204 },
  ({ scope, params, body }) => extendReview(scope, params.planId, body),
);
