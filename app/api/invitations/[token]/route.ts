import { route } from "@/lib/api/route";
import { previewInvitation } from "@/lib/services/invitations";
import { tokenParams } from "@/lib/validation/account";

// Whoever holds the link may read what it invites to (the link was e-mailed to the invited address).
export const GET = route({ access: { public: true }, params: tokenParams }, ({ db, params }) => previewInvitation(db, params.token));
