import { route } from "@/lib/api/route";
import { revokeInvitation } from "@/lib/services/invitations";
import { invitationParams } from "@/lib/validation/account";

export const DELETE = route({ access: { basin: true }, params: invitationParams, status: 204 }, ({ scope, params }) =>
  revokeInvitation(scope, params.invitationId),
);
