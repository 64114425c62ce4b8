import { route } from "@/lib/api/route";
import { getRunStatus } from "@/lib/services/runs";
import { runParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: true }, params: runParams }, ({ scope, params }) =>
  getRunStatus(scope, params.runId),
);
