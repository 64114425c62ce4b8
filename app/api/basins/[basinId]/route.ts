import { route } from "@/lib/api/route";
import { getBasin, updateBasin } from "@/lib/services/basins";
import { basinUpdateSchema } from "@/lib/validation/basin";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: "basin.read" }, params: basinParams }, ({ db, actor, params }) =>
  getBasin(db, actor, params.basinId),
);

export const PATCH = route(
  { access: { basin: "basin.update" }, params: basinParams, body: basinUpdateSchema },
  ({ db, actor, params, body }) => updateBasin(db, actor, params.basinId, body),
);
