import { route } from "@/lib/api/route";
import { limited } from "@/lib/security/rate-limit";
import { addComment } from "@/lib/services/plans";
import { threadParams } from "@/lib/validation/params";
import { commentSchema } from "@/lib/validation/plan";

/**
 * Any signed-in person may comment while the plan's review period is open
 * (checked in the service); each person is limited to a number of comments
 * per window (429 with Retry-After beyond it).
 */
export const POST = route({ access: { basin: true }, params: threadParams, body: commentSchema, status: 201 }, ({ scope, params, body }) =>
  limited([["comment_actor", scope.actor.id]], () => addComment(scope, params.threadId, body.body)),
);
