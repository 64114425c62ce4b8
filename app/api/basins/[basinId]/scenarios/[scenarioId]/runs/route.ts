import { route } from "@/lib/api/route";
import { createRun, listRuns } from "@/lib/services/runs";
import { scenarioParams } from "@/lib/validation/params";
import { runCreateSchema } from "@/lib/validation/scenario";

export const GET = route({ access: { basin: "scenario.read" }, params: scenarioParams }, ({ db, actor, params }) =>
  listRuns(db, actor, params.basinId, params.scenarioId),
);

/** Queue a model or allocation run (202); an identical finished run is returned instead (200). */
export const POST = route(
  { access: { basin: "scenario.run" }, params: scenarioParams, body: runCreateSchema, status: 202 },
  async ({ db, actor, params, body }) => {
    const run = await createRun(db, actor, params.basinId, params.scenarioId, body.kind);
    return Response.json(run, { status: run.reused ? 200 : 202 });
  },
);
