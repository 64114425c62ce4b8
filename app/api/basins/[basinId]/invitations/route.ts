import { route } from "@/lib/api/route";
import { createInvitation, listInvitations } from "@/lib/services/invitations";
import { invitationCreateSchema } from "@/lib/validation/account";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: "members.manage" }, params: basinParams }, ({ db, actor, params }) =>
  listInvitations(db, actor, params.basinId),
);

export const POST = route(
  { access: { basin: "members.manage" }, params: basinParams, body: invitationCreateSchema, status: 201 },
  ({ db, actor, params, body }) => createInvitation(db, actor, params.basinId, body),
);
