import { z } from "zod";
import { route } from "@/lib/api/route";
import { downloadResponse } from "@/lib/reports/download";
import { EXPORT_LAYERS } from "@/lib/results/results-geojson";
import { planReachesGeoJson } from "@/lib/services/plan-reports";
import { planParams } from "@/lib/validation/params";

/**
 * ?condition= names one of the plan's design conditions (left out, the governing one);
 * ?layer= is reaches (the default), pieces or dischargers (docs/exports.md).
 */
const query = z.object({
  condition: z.string().trim().min(1, "Name one of the plan's conditions").max(200).optional(),
  layer: z.enum(EXPORT_LAYERS, { message: `Choose a layer: ${EXPORT_LAYERS.join(", ")}` }).optional(),
});

/** One layer of the plan's results under its allocation (GeoJSON); same access and audit as the report. */
export const GET = route({ access: { public: true }, params: planParams, query }, async ({ db, actor, params, query, req }) =>
  downloadResponse(await planReachesGeoJson(db, actor, params.basinId, params.planId, query.condition, query.layer), req.headers.get("if-none-match")),
);
