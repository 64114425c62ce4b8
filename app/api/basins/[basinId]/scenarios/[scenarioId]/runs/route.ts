import { route } from "@/lib/api/route";
import { createRun, listRuns } from "@/lib/services/runs";
import { scenarioParams } from "@/lib/validation/params";
import { runCreateSchema } from "@/lib/validation/scenario";

export const GET = route({ access: { basin: true }, params: scenarioParams }, ({ scope, params }) =>
  listRuns(scope, params.scenarioId),
);

/** Queue a model or allocation run (202); an identical finished run is returned instead (200). */
export const POST = route(
  { access: { basin: true }, params: scenarioParams, body: runCreateSchema, status: 202 },
  async ({ scope, params, body }) => {
    const run = await createRun(scope, params.scenarioId, body.kind);
    return Response.json(run, { status: run.reused ? 200 : 202 });
  },
);
