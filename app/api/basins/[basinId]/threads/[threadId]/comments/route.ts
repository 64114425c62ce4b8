import { route } from "@/lib/api/route";
import { addComment } from "@/lib/services/plans";
import { threadParams } from "@/lib/validation/params";
import { commentSchema } from "@/lib/validation/plan";

/** Any signed-in person may comment while the plan's review period is open (checked in the service). */
export const POST = route({ access: { signedIn: true }, params: threadParams, body: commentSchema, status: 201 }, ({ db, actor, params, body }) =>
  addComment(db, actor, params.basinId, params.threadId, body.body),
);
