import { route } from "@/lib/api/route";
import { afterResponse } from "@/lib/security/after-response";
import { clientAddress } from "@/lib/security/client-address";
import { limited } from "@/lib/security/rate-limit";
import { requestPasswordReset } from "@/lib/services/accounts";
import { resetRequestSchema } from "@/lib/validation/account";

/**
 * Always 202 with the same body, and in the same time: the look-up, the link
 * and the e-mail happen after the answer (lib/security/after-response), so
 * neither the body nor the timing tells whether the address has an account.
 * Limited per e-mail address (known or not, so a 429 tells nothing either)
 * and per client address.
 */
export const POST = route({ access: { public: true }, body: resetRequestSchema, status: 202 }, async ({ db, req, body }) =>
  limited(
    [
      ["reset_address", clientAddress(req.headers)],
      ["reset_email", body.email.trim().toLowerCase()],
    ],
    async () => {
      afterResponse("password reset request", () => requestPasswordReset(db, body.email));
      return { message: "If an account uses this address, a link to choose a new password is on its way." };
    },
  ),
);
