import { route } from "@/lib/api/route";
import { listSurveys, SURVEY_MAX_BYTES, uploadSurvey } from "@/lib/services/surveys";
import { basinParams } from "@/lib/validation/params";
import { surveyUploadSchema } from "@/lib/validation/surveys";

export const GET = route({ access: { basin: true }, params: basinParams }, ({ scope }) => listSurveys(scope));

/**
 * multipart/form-data: file (CSV, GeoJSON or zipped point shapefile; docs/surveys.md) + name,
 * temperatureUnit (C|F), flowUnit (m3/s|cfs), bodKind (bod5|cbodu), optional epsg and maxSnapDistanceM.
 */
export const POST = route(
  {
    access: { basin: true },
    params: basinParams,
    body: surveyUploadSchema,
    fileField: "file",
    maxUploadBytes: () => SURVEY_MAX_BYTES + 64 * 1024,
    status: 201,
  },
  ({ scope, body, file }) => uploadSurvey(scope, file!, body),
);
