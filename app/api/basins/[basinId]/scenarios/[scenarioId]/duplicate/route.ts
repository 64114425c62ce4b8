import { route } from "@/lib/api/route";
import { duplicateScenario } from "@/lib/services/scenarios";
import { scenarioParams } from "@/lib/validation/params";
import { scenarioDuplicateSchema } from "@/lib/validation/scenario";

export const POST = route(
  { access: { basin: "scenario.edit" }, params: scenarioParams, body: scenarioDuplicateSchema, status: 201 },
  ({ db, actor, params, body }) => duplicateScenario(db, actor, params.basinId, params.scenarioId, body.name),
);
