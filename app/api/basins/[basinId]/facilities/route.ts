import { route } from "@/lib/api/route";
import { createFacility, listFacilities } from "@/lib/services/facilities";
import { facilityCreateSchema } from "@/lib/validation/member";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: true }, params: basinParams }, ({ scope }) =>
  listFacilities(scope),
);

export const POST = route(
  { access: { basin: true }, params: basinParams, body: facilityCreateSchema, status: 201 },
  ({ scope, body }) => createFacility(scope, body),
);
