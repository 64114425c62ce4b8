import { route } from "@/lib/api/route";
import { createFacility, listFacilities } from "@/lib/services/facilities";
import { facilityCreateSchema } from "@/lib/validation/member";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: "facilities.read" }, params: basinParams }, ({ db, actor, params }) =>
  listFacilities(db, actor, params.basinId),
);

export const POST = route(
  { access: { basin: "facilities.manage" }, params: basinParams, body: facilityCreateSchema, status: 201 },
  ({ db, actor, params, body }) => createFacility(db, actor, params.basinId, body),
);
