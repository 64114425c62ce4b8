import { route } from "@/lib/api/route";
import { clientAddress } from "@/lib/security/client-address";
import { limited } from "@/lib/security/rate-limit";
import { register } from "@/lib/services/accounts";
import { registerSchema } from "@/lib/validation/account";

// Signed out: anyone may create a stakeholder account; it signs in once the e-mailed link confirms the address.
// Limited per client address (lib/security/rate-limit.ts), 429 with Retry-After beyond it.
export const POST = route({ access: { public: true }, body: registerSchema, status: 201 }, ({ db, req, body }) =>
  limited([["register_address", clientAddress(req.headers)]], () => register(db, body)),
);
