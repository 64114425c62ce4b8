import { route } from "@/lib/api/route";
import { getPlan } from "@/lib/services/plans";
import { planParams } from "@/lib/validation/params";

/** One plan; who may read it depends on its state (checked in the service). */
export const GET = route({ access: { public: true }, params: planParams }, ({ db, actor, params }) => getPlan(db, actor, params.basinId, params.planId));
