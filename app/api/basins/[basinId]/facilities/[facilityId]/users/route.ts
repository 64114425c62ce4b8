import { route } from "@/lib/api/route";
import { linkUserToFacility } from "@/lib/services/facilities";
import { facilityLinkSchema } from "@/lib/validation/member";
import { facilityParams } from "@/lib/validation/params";

export const POST = route(
  { access: { basin: "members.manage" }, params: facilityParams, body: facilityLinkSchema, status: 201 },
  ({ db, actor, params, body }) => linkUserToFacility(db, actor, params.basinId, params.facilityId, body),
);
