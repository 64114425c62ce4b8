import { route } from "@/lib/api/route";
import { validateDraft } from "@/lib/services/networks";
import { networkDraftSchema } from "@/lib/validation/network";
import { basinParams } from "@/lib/validation/params";

/** Validate a draft network; saves nothing. */
export const POST = route(
  { access: { basin: "network.import" }, params: basinParams, body: networkDraftSchema },
  ({ db, actor, params, body }) => validateDraft(db, actor, params.basinId, body),
);
