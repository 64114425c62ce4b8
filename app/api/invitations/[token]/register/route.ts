import { route } from "@/lib/api/route";
import { acceptInvitationAsNewAccount } from "@/lib/services/invitations";
import { invitationRegisterSchema, tokenParams } from "@/lib/validation/account";

// Signed out: create the invited account (confirmed by the invitation itself) and join the basin.
export const POST = route(
  { access: { public: true }, params: tokenParams, body: invitationRegisterSchema, status: 201 },
  ({ db, params, body }) => acceptInvitationAsNewAccount(db, params.token, body),
);
