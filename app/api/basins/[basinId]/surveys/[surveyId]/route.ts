import { route } from "@/lib/api/route";
import { getSurvey } from "@/lib/services/surveys";
import { surveyParams } from "@/lib/validation/params";

/** A survey with every sample as placed on the network (reach, km, snap distance) in mg/L, °C and m³/s. */
export const GET = route({ access: { basin: true }, params: surveyParams }, ({ scope, params }) => getSurvey(scope, params.surveyId));
