import { LARGE_JSON_BYTES, route } from "@/lib/api/route";
import { createScenario, listScenarios } from "@/lib/services/scenarios";
import { basinParams } from "@/lib/validation/params";
import { scenarioCreateSchema } from "@/lib/validation/scenario";

export const GET = route({ access: { basin: true }, params: basinParams }, ({ scope }) =>
  listScenarios(scope),
);

export const POST = route(
  { access: { basin: true }, params: basinParams, body: scenarioCreateSchema, maxBodyBytes: LARGE_JSON_BYTES, status: 201 },
  ({ scope, body }) => createScenario(scope, body),
);
