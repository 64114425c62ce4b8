import { route } from "@/lib/api/route";
import { getRunStatus } from "@/lib/services/runs";
import { runParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: "scenario.read" }, params: runParams }, ({ db, actor, params }) =>
  getRunStatus(db, actor, params.basinId, params.runId),
);
