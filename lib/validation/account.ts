import { z } from "zod";
import { basinRoleSchema } from "./member";

/** The sign-in error for a right password on an address not confirmed yet (thrown by authorize, read by the sign-in form). */
export const EMAIL_NOT_CONFIRMED = "EmailNotConfirmed";

/** Password rules shared by registration, reset and accepting an invitation as a new account. */
export const PASSWORD_MIN = 10;
const email = z.string().trim().toLowerCase().pipe(z.email("Enter a valid e-mail address"));
const name = z.string().trim().min(2, "Name must be at least 2 characters").max(120, "Name must be at most 120 characters");
const password = z
  .string()
  .min(PASSWORD_MIN, `Password must be at least ${PASSWORD_MIN} characters`)
  .max(200, "Password must be at most 200 characters");

/** The e-mailed token: 32 random bytes, base64url (43 characters). */
export const tokenSchema = z.string().regex(/^[A-Za-z0-9_-]{43}$/, "This link is not valid; open the link from the e-mail again");

const confirmed = <T extends { password: string; confirmPassword: string }>(v: T, ctx: z.RefinementCtx) => {
  if (v.password !== v.confirmPassword) {
    ctx.addIssue({ code: "custom", path: ["confirmPassword"], message: "The two passwords do not match" });
  }
};

export const newPasswordSchema = z.object({ password, confirmPassword: z.string() }).superRefine(confirmed);

export const registerSchema = z.object({ name, email, password, confirmPassword: z.string() }).superRefine(confirmed);
export type RegisterInput = z.infer<typeof registerSchema>;

export const verifyEmailSchema = z.object({ token: tokenSchema });

export const resetRequestSchema = z.object({ email });
export type ResetRequestInput = z.infer<typeof resetRequestSchema>;

export const resetConfirmSchema = z.object({ token: tokenSchema, password, confirmPassword: z.string() }).superRefine(confirmed);
export type ResetConfirmInput = z.infer<typeof resetConfirmSchema>;

/** A lead's invitation: a discharger invitation names one facility of the basin; other roles name none. */
export const invitationCreateSchema = z
  .object({
    email,
    role: basinRoleSchema,
    facilityId: z.uuid("facilityId must be a facility id").optional().nullable(),
  })
  .superRefine((v, ctx) => {
    if (v.role === "discharger" && !v.facilityId) {
      ctx.addIssue({ code: "custom", path: ["facilityId"], message: "Choose the facility this discharger represents" });
    }
    if (v.role !== "discharger" && v.facilityId) {
      ctx.addIssue({ code: "custom", path: ["facilityId"], message: "Only a discharger invitation names a facility" });
    }
  });
export type InvitationCreateInput = z.infer<typeof invitationCreateSchema>;

/** Accepting an invitation by creating the invited account. */
export const invitationRegisterSchema = z.object({ name, password, confirmPassword: z.string() }).superRefine(confirmed);
export type InvitationRegisterInput = z.infer<typeof invitationRegisterSchema>;

export const tokenParams = z.object({ token: tokenSchema });
export const invitationParams = z.object({
  basinId: z.uuid("basinId is not a valid id"),
  invitationId: z.uuid("invitationId is not a valid id"),
});
