import { route } from "@/lib/api/route";
import { AppError } from "@/lib/errors";
import { AUDIT_AREAS, isAuditArea, listBasinAudit } from "@/lib/services/audit";
import { basinParams } from "@/lib/validation/params";

/** The basin's audit trail, newest first; `?area=plans|members|network|scenarios` and `?before=<event id>` page through it. */
export const GET = route({ access: { basin: "audit.read" }, params: basinParams }, ({ db, actor, params, req }) => {
  const query = req.nextUrl.searchParams;
  const area = query.get("area") ?? undefined;
  if (area !== undefined && !isAuditArea(area)) {
    throw new AppError("invalid", `Unknown area; use one of ${Object.keys(AUDIT_AREAS).join(", ")}`, [{ path: "area", message: "Unknown area" }]);
  }
  return listBasinAudit(db, actor, params.basinId, { area, beforeId: query.get("before") ?? undefined });
});
