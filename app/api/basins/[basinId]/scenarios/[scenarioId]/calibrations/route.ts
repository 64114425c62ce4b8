import { route } from "@/lib/api/route";
import { createCalibrationRun } from "@/lib/services/runs";
import { calibrationRunSchema } from "@/lib/validation/calibration";
import { scenarioParams } from "@/lib/validation/params";

/**
 * Queue a calibration of the scenario to a survey (202; docs/calibration.md): `{ surveyId,
 * condition, fit: [{ parameter, reaches: "all" | [ids], min, max, start }] }`. It is a run of
 * kind "calibration": its status, progress and result are read like any run's; an identical
 * finished calibration is returned instead (200).
 */
export const POST = route(
  { access: { basin: true }, params: scenarioParams, body: calibrationRunSchema, status: 202 },
  async ({ scope, params, body }) => {
    const run = await createCalibrationRun(scope, params.scenarioId, body);
    return Response.json(run, { status: run.reused ? 200 : 202 });
  },
);
