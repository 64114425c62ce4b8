import { route } from "@/lib/api/route";
import { getBasin, updateBasin } from "@/lib/services/basins";
import { basinUpdateSchema } from "@/lib/validation/basin";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: true }, params: basinParams }, ({ scope }) =>
  getBasin(scope),
);

export const PATCH = route(
  { access: { basin: true }, params: basinParams, body: basinUpdateSchema },
  ({ scope, body }) => updateBasin(scope, body),
);
