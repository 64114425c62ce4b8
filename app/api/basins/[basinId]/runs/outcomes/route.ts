import { route } from "@/lib/api/route";
import { listRunOutcomes } from "@/lib/services/basin-overview";
import { basinParams } from "@/lib/validation/params";

/** What each finished run came to (lowest DO under the governing condition, feasible), for the runs list. */
export const GET = route({ access: { basin: true }, params: basinParams }, ({ scope }) =>
  listRunOutcomes(scope),
);
