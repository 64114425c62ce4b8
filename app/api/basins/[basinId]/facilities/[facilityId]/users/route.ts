import { route } from "@/lib/api/route";
import { linkUserToFacility } from "@/lib/services/facilities";
import { facilityLinkSchema } from "@/lib/validation/member";
import { facilityParams } from "@/lib/validation/params";

export const POST = route(
  { access: { basin: true }, params: facilityParams, body: facilityLinkSchema, status: 201 },
  ({ scope, params, body }) => linkUserToFacility(scope, params.facilityId, body),
);
