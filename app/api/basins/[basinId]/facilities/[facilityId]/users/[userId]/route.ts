import { route } from "@/lib/api/route";
import { unlinkUserFromFacility } from "@/lib/services/facilities";
import { facilityUserParams } from "@/lib/validation/params";

export const DELETE = route(
  { access: { basin: true }, params: facilityUserParams, status: 204 },
  ({ scope, params }) => unlinkUserFromFacility(scope, params.facilityId, params.userId),
);
