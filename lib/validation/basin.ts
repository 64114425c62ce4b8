import { z } from "zod";
import { UNIT_SYSTEMS } from "@/lib/domain";
import { timeZoneSchema } from "./time-zone";

export const unitSystemSchema = z.enum(UNIT_SYSTEMS);

const minReviewDaysSchema = z.coerce
  .number({ message: "The shortest review must be a number of days" })
  .int("The shortest review is a whole number of days")
  .min(0, "The shortest review cannot be negative (0 means no minimum)")
  .max(365, "The shortest review can be at most 365 days");

/** Basin settings, shared by the create/edit forms and the basins API. */
const basinFields = z.object({
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
  minReviewDays: minReviewDaysSchema,
  /** Every date and time of the basin is shown in this zone; null leaves it to the first review. */
  timeZone: z.preprocess((v) => (v === "" ? null : v), timeZoneSchema.nullable()),
});

/** A new basin: the shortest review defaults to 30 days (common practice for a formal comment period). */
export const basinCreateSchema = basinFields.extend({ minReviewDays: minReviewDaysSchema.default(30), timeZone: z.preprocess((v) => (v === "" || v === undefined ? null : v), timeZoneSchema.nullable()) });
export type BasinCreateInput = z.infer<typeof basinCreateSchema>;

// from the fields without defaults: a setting left out of a change is left as it is
export const basinUpdateSchema = basinFields
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: "Give at least one setting to change" });
export type BasinUpdateInput = z.infer<typeof basinUpdateSchema>;
