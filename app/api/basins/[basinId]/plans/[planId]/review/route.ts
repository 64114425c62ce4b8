import { route } from "@/lib/api/route";
import { extendReview, openReview } from "@/lib/services/plans";
import { planParams } from "@/lib/validation/params";
import { reviewExtendSchema, reviewOpenSchema } from "@/lib/validation/plan";

export const POST = route(
  { access: { basin: "review.manage" }, params: planParams, body: reviewOpenSchema, status: 204 },
  ({ db, actor, params, body }) => openReview(db, actor, params.basinId, params.planId, body),
);

/** Extend the open review to a later end; the reason is required and kept. */
export const PATCH = route(
  { access: { basin: "review.manage" }, params: planParams, body: reviewExtendSchema, status: 204 },
  ({ db, actor, params, body }) => extendReview(db, actor, params.basinId, params.planId, body),
);
