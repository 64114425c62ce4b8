import { route } from "@/lib/api/route";
import { downloadResponse } from "@/lib/reports/download";
import { planReachesGeoJson } from "@/lib/services/plan-reports";
import { planParams } from "@/lib/validation/params";

/** Reaches with their DO results under the plan's allocation (GeoJSON); same access and audit as the report. */
export const GET = route({ access: { public: true }, params: planParams }, async ({ db, actor, params }) =>
  downloadResponse(await planReachesGeoJson(db, actor, params.basinId, params.planId)),
);
