import { LARGE_JSON_BYTES, route } from "@/lib/api/route";
import { createScenario, listScenarios } from "@/lib/services/scenarios";
import { basinParams } from "@/lib/validation/params";
import { scenarioCreateSchema } from "@/lib/validation/scenario";

export const GET = route({ access: { basin: "scenario.read" }, params: basinParams }, ({ db, actor, params }) =>
  listScenarios(db, actor, params.basinId),
);

export const POST = route(
  { access: { basin: "scenario.edit" }, params: basinParams, body: scenarioCreateSchema, maxBodyBytes: LARGE_JSON_BYTES, status: 201 },
  ({ db, actor, params, body }) => createScenario(db, actor, params.basinId, body),
);
