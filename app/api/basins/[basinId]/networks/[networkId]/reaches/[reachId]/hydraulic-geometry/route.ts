import { z } from "zod";
import { route } from "@/lib/api/route";
import { fitReachHydraulicGeometry } from "@/lib/services/hydraulic-fit";
import { reachParams } from "@/lib/validation/params";

const body = z.strictObject({
  surveyIds: z.array(z.uuid("a survey id")).min(1, "name at least one survey").max(20, "at most 20 surveys"),
});

/**
 * Fit the reach's hydraulic geometry (U = a·Q^b, H = c·Q^f) to the surveys' measurements of
 * flow, velocity and depth on it, and write it on the reach (newest network only).
 */
export const POST = route({ access: { basin: true }, params: reachParams, body }, ({ scope, params, body }) =>
  fitReachHydraulicGeometry(scope, params.networkId, params.reachId, body.surveyIds),
);
