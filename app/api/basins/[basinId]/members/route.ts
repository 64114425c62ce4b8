import { route } from "@/lib/api/route";
import { addMember, listMembers } from "@/lib/services/members";
import { memberAddSchema } from "@/lib/validation/member";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: "members.read" }, params: basinParams }, ({ db, actor, params }) =>
  listMembers(db, actor, params.basinId),
);

export const POST = route(
  { access: { basin: "members.manage" }, params: basinParams, body: memberAddSchema, status: 201 },
  ({ db, actor, params, body }) => addMember(db, actor, params.basinId, body),
);
