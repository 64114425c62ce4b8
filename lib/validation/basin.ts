import { z } from "zod";

export const unitSystemSchema = z.enum(["SI", "US"]);

/** Basin settings, shared by the create/edit forms and the basins API. */
export const basinCreateSchema = z.object({
  name: z.string().trim().min(2, "Name must be at least 2 characters").max(120),
  slug: z
    .string()
    .trim()
    .min(2, "Short name must be at least 2 characters")
    .max(60)
    .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, "Use lower-case letters, digits and single hyphens"),
  description: z.string().trim().max(2000),
  doCriterionMgL: z.coerce
    .number({ message: "DO criterion must be a number" })
    .gt(0, "DO criterion must be above 0 mg/L")
    .lt(20, "DO criterion must be below 20 mg/L"),
  unitSystem: unitSystemSchema,
});
export type BasinCreateInput = z.infer<typeof basinCreateSchema>;

export const basinUpdateSchema = basinCreateSchema
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: "Give at least one setting to change" });
export type BasinUpdateInput = z.infer<typeof basinUpdateSchema>;
