import { LARGE_JSON_BYTES, route } from "@/lib/api/route";
import { deleteScenario, getScenario, updateScenario } from "@/lib/services/scenarios";
import { scenarioParams } from "@/lib/validation/params";
import { scenarioUpdateSchema } from "@/lib/validation/scenario";

export const GET = route({ access: { basin: true }, params: scenarioParams }, ({ scope, params }) =>
  getScenario(scope, params.scenarioId),
);

export const PATCH = route(
  { access: { basin: true }, params: scenarioParams, body: scenarioUpdateSchema, maxBodyBytes: LARGE_JSON_BYTES },
  ({ scope, params, body }) => updateScenario(scope, params.scenarioId, body),
);

export const DELETE = route({ access: { basin: true }, params: scenarioParams, status: 204 }, ({ scope, params }) =>
  deleteScenario(scope, params.scenarioId),
);
