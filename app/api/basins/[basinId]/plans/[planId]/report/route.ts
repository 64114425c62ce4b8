import { route } from "@/lib/api/route";
import { downloadResponse } from "@/lib/reports/download";
import { planReportPdf } from "@/lib/services/plan-reports";
import { planParams } from "@/lib/validation/params";

/** The plan report (PDF). Who may read it depends on the plan's state (checked in the service); exports of unpublished plans are audited. */
export const GET = route({ access: { public: true }, params: planParams }, async ({ db, actor, params, req }) =>
  downloadResponse(await planReportPdf(db, actor, params.basinId, params.planId), req.headers.get("if-none-match")),
);
