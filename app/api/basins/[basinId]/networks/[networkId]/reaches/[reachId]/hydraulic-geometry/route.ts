import { route } from "@/lib/api/route";
import { fitReachHydraulicGeometry } from "@/lib/services/hydraulic-fit";
import { hydraulicFitSchema } from "@/lib/validation/network";
import { reachParams } from "@/lib/validation/params";

/**
 * Fit the reach's hydraulic geometry (U = a·Q^b, H = c·Q^f) to the surveys' measurements of
 * flow, velocity and depth on it, and write it on the reach (newest network only).
 */
export const POST = route({ access: { basin: true }, params: reachParams, body: hydraulicFitSchema }, ({ scope, params, body }) =>
  fitReachHydraulicGeometry(scope, params.networkId, params.reachId, body.surveyIds),
);
