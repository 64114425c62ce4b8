import { route } from "@/lib/api/route";
import { verifyEmail } from "@/lib/services/accounts";
import { verifyEmailSchema } from "@/lib/validation/account";

export const POST = route({ access: { public: true }, body: verifyEmailSchema }, ({ db, body }) => verifyEmail(db, body.token));
