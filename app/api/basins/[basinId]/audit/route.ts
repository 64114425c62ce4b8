import { route } from "@/lib/api/route";
import { listBasinAudit } from "@/lib/services/audit";
import { auditQuerySchema } from "@/lib/validation/audit";
import { basinParams } from "@/lib/validation/params";

/** The basin's audit trail, newest first; `?area=plans|members|network|scenarios` and `?before=<event id>` page through it. */
export const GET = route({ access: { basin: true }, params: basinParams, query: auditQuerySchema }, ({ scope, query }) =>
  listBasinAudit(scope, query),
);
