import { route } from "@/lib/api/route";
import { changeMemberRole, removeMember } from "@/lib/services/members";
import { memberUpdateSchema } from "@/lib/validation/member";
import { memberParams } from "@/lib/validation/params";

export const PATCH = route(
  { access: { basin: "members.manage" }, params: memberParams, body: memberUpdateSchema },
  ({ db, actor, params, body }) => changeMemberRole(db, actor, params.basinId, params.userId, body),
);

export const DELETE = route(
  { access: { basin: "members.manage" }, params: memberParams, status: 204 },
  ({ db, actor, params }) => removeMember(db, actor, params.basinId, params.userId),
);
