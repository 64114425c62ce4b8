import { route } from "@/lib/api/route";
import { revokeInvitation } from "@/lib/services/invitations";
import { invitationParams } from "@/lib/validation/account";

export const DELETE = route({ access: { basin: "members.manage" }, params: invitationParams, status: 204 }, ({ db, actor, params }) =>
  revokeInvitation(db, actor, params.basinId, params.invitationId),
);
