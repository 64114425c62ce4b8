import { route } from "@/lib/api/route";
import { getRun } from "@/lib/services/runs";
import { runParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: "scenario.read" }, params: runParams }, ({ db, actor, params }) =>
  getRun(db, actor, params.basinId, params.runId),
);
