import { route } from "@/lib/api/route";
import { changeMemberRole, removeMember } from "@/lib/services/members";
import { memberUpdateSchema } from "@/lib/validation/member";
import { memberParams } from "@/lib/validation/params";

export const PATCH = route(
  { access: { basin: true }, params: memberParams, body: memberUpdateSchema },
  ({ scope, params, body }) => changeMemberRole(scope, params.userId, body),
);

export const DELETE = route(
  { access: { basin: true }, params: memberParams, status: 204 },
  ({ scope, params }) => removeMember(scope, params.userId),
);
