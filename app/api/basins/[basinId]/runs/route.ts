import { route } from "@/lib/api/route";
import { listRuns } from "@/lib/services/runs";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: true }, params: basinParams }, ({ scope }) =>
  listRuns(scope),
);
