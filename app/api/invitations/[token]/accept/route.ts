import { route } from "@/lib/api/route";
import { acceptInvitation } from "@/lib/services/invitations";
import { tokenParams } from "@/lib/validation/account";

export const POST = route({ access: { signedIn: true }, params: tokenParams }, ({ db, actor, params }) =>
  acceptInvitation(db, actor, params.token),
);
