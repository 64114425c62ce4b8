import { route } from "@/lib/api/route";
import { listBasinAudit } from "@/lib/services/audit";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: "audit.read" }, params: basinParams }, ({ db, actor, params }) =>
  listBasinAudit(db, actor, params.basinId),
);
