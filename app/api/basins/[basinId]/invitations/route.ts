import { route } from "@/lib/api/route";
import { limited } from "@/lib/security/rate-limit";
import { createInvitation, listInvitations } from "@/lib/services/invitations";
import { invitationCreateSchema } from "@/lib/validation/account";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: true }, params: basinParams }, ({ scope }) =>
  listInvitations(scope),
);

export const POST = route(
  { access: { basin: true }, params: basinParams, body: invitationCreateSchema, status: 201 },
  // each invitation is an e-mail to an address the sender chose: limited per sender (429 with Retry-After beyond it)
  ({ scope, body }) => limited([["invite_actor", scope.actor.id]], () => createInvitation(scope, body)),
);
