import { route } from "@/lib/api/route";
import { requestPasswordReset } from "@/lib/services/accounts";
import { resetRequestSchema } from "@/lib/validation/account";

/** Always 202 with the same body: the answer never tells whether the address has an account. */
export const POST = route({ access: { public: true }, body: resetRequestSchema, status: 202 }, async ({ db, body }) => {
  await requestPasswordReset(db, body.email);
  return { message: "If an account uses this address, a link to choose a new password is on its way." };
});
