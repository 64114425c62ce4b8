import { route } from "@/lib/api/route";
import { unlinkUserFromFacility } from "@/lib/services/facilities";
import { facilityUserParams } from "@/lib/validation/params";

export const DELETE = route(
  { access: { basin: "members.manage" }, params: facilityUserParams, status: 204 },
  ({ db, actor, params }) => unlinkUserFromFacility(db, actor, params.basinId, params.facilityId, params.userId),
);
