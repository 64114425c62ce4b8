import { route } from "@/lib/api/route";
import { downloadResponse } from "@/lib/reports/download";
import { planAllocationsCsv } from "@/lib/services/plan-reports";
import { planParams } from "@/lib/validation/params";

/** The plan's allocation table (CSV), for a plain download link; same access and audit as the report. */
export const GET = route({ access: { public: true }, params: planParams }, async ({ db, actor, params, req }) =>
  downloadResponse(await planAllocationsCsv(db, actor, params.basinId, params.planId), req.headers.get("if-none-match")),
);
