import { route } from "@/lib/api/route";
import { respondToThread } from "@/lib/services/plans";
import { threadParams } from "@/lib/validation/params";
import { responseSchema } from "@/lib/validation/plan";

export const POST = route({ access: { basin: "comment.answer" }, params: threadParams, body: responseSchema, status: 204 }, ({ db, actor, params, body }) =>
  respondToThread(db, actor, params.basinId, params.threadId, body.response),
);
