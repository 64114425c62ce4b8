import { route } from "@/lib/api/route";
import { respondToThread } from "@/lib/services/plans";
import { threadParams } from "@/lib/validation/params";
import { responseSchema } from "@/lib/validation/plan";

export const POST = route({ access: { basin: true }, params: threadParams, body: responseSchema, status: 204 }, ({ scope, params, body }) =>
  respondToThread(scope, params.threadId, body.response),
);
