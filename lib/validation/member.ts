import { z } from "zod";
import { BASIN_ROLES } from "@/lib/domain";

export const basinRoleSchema = z.enum(BASIN_ROLES, { message: `Role must be ${BASIN_ROLES.slice(0, -1).join(", ")} or ${BASIN_ROLES[BASIN_ROLES.length - 1]}` });

export const memberAddSchema = z.object({
  email: z.string().trim().toLowerCase().pipe(z.email("Enter a valid e-mail address")),
  role: basinRoleSchema,
});
export type MemberAddInput = z.infer<typeof memberAddSchema>;

export const memberUpdateSchema = z.object({ role: basinRoleSchema });
export type MemberUpdateInput = z.infer<typeof memberUpdateSchema>;

export const facilityCreateSchema = z.object({
  name: z.string().trim().min(2, "Facility name must be at least 2 characters").max(160),
  permitId: z.string().trim().min(1, "Permit id is required").max(60),
});
export type FacilityCreateInput = z.infer<typeof facilityCreateSchema>;

export const facilityLinkSchema = z.object({ userId: z.uuid("userId must be a user id") });
export type FacilityLinkInput = z.infer<typeof facilityLinkSchema>;
