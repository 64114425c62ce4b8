import { route } from "@/lib/api/route";
import { resetPassword } from "@/lib/services/accounts";
import { resetConfirmSchema } from "@/lib/validation/account";

export const POST = route({ access: { public: true }, body: resetConfirmSchema }, ({ db, body }) => resetPassword(db, body));
