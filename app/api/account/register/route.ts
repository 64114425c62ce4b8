import { route } from "@/lib/api/route";
import { register } from "@/lib/services/accounts";
import { registerSchema } from "@/lib/validation/account";

// Signed out: anyone may create a stakeholder account; it signs in once the e-mailed link confirms the address.
// No rate limit yet (see docs/accounts.md).
export const POST = route({ access: { public: true }, body: registerSchema, status: 201 }, ({ db, body }) => register(db, body));
