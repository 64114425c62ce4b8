import { LARGE_JSON_BYTES, route } from "@/lib/api/route";
import { deleteScenario, getScenario, updateScenario } from "@/lib/services/scenarios";
import { scenarioParams } from "@/lib/validation/params";
import { scenarioUpdateSchema } from "@/lib/validation/scenario";

export const GET = route({ access: { basin: "scenario.read" }, params: scenarioParams }, ({ db, actor, params }) =>
  getScenario(db, actor, params.basinId, params.scenarioId),
);

export const PATCH = route(
  { access: { basin: "scenario.edit" }, params: scenarioParams, body: scenarioUpdateSchema, maxBodyBytes: LARGE_JSON_BYTES },
  ({ db, actor, params, body }) => updateScenario(db, actor, params.basinId, params.scenarioId, body),
);

export const DELETE = route({ access: { basin: "scenario.edit" }, params: scenarioParams, status: 204 }, ({ db, actor, params }) =>
  deleteScenario(db, actor, params.basinId, params.scenarioId),
);
