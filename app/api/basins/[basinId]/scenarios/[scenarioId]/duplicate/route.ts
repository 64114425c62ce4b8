import { route } from "@/lib/api/route";
import { duplicateScenario } from "@/lib/services/scenarios";
import { scenarioParams } from "@/lib/validation/params";
import { scenarioDuplicateSchema } from "@/lib/validation/scenario";

export const POST = route(
  { access: { basin: true }, params: scenarioParams, body: scenarioDuplicateSchema, status: 201 },
  ({ scope, params, body }) => duplicateScenario(scope, params.scenarioId, body.name),
);
