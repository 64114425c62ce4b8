import { route } from "@/lib/api/route";
import { addMember, listMembers } from "@/lib/services/members";
import { memberAddSchema } from "@/lib/validation/member";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: true }, params: basinParams }, ({ scope }) =>
  listMembers(scope),
);

export const POST = route(
  { access: { basin: true }, params: basinParams, body: memberAddSchema, status: 201 },
  ({ scope, body }) => addMember(scope, body),
);
