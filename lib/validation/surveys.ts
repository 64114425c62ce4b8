import { z } from "zod";
import { IMPORT_DEFAULTS, SURVEY_MAPPABLE_COLUMNS as MAPPABLE } from "@/lib/domain";

/**
 * The planner's column mapping (JSON text in the multipart form): Sagline's column → the
 * file's column name. Empty names are dropped.
 */
const columnsSchema = z
  .string()
  .optional()
  .transform((text, ctx) => {
    if (!text) return undefined;
    try {
      return JSON.parse(text) as unknown;
    } catch {
      ctx.addIssue({ code: "custom", message: "the column mapping must be JSON: {\"do\": \"DO_MGL\", …}" });
      return z.NEVER;
    }
  })
  .pipe(
    z
      .partialRecord(z.enum(MAPPABLE, { message: `a mapped column must be one of ${MAPPABLE.join(", ")}` }), z.string().trim().max(200, "a column name must be at most 200 characters"))
      .optional()
      .transform((m) => (m ? Object.fromEntries(Object.entries(m).filter(([, v]) => v !== "")) : undefined)),
  );

/** The form fields of a synoptic survey's upload (multipart, beside the file). */
export const surveyUploadSchema = z.object({
  name: z.string({ message: "name the survey" }).trim().min(1, "name the survey").max(120, "the survey's name must be at most 120 characters"),
  temperatureUnit: z.enum(["C", "F"], { message: "temperature unit must be C or F" }).default("C"),
  flowUnit: z.enum(["m3/s", "cfs"], { message: "flow unit must be m3/s or cfs" }).default("m3/s"),
  bodKind: z.enum(["bod5", "cbodu"], { message: 'what a "bod" column holds must be bod5 or cbodu' }).default("bod5"),
  epsg: z.coerce.number({ message: "EPSG must be a number" }).int("EPSG must be a whole number").min(1024).max(999_999).optional(),
  maxSnapDistanceM: z.coerce
    .number({ message: "the snapping limit must be a number of metres" })
    .positive("the snapping limit must be above 0 m")
    .max(50_000, "the snapping limit must be at most 50 000 m")
    .default(IMPORT_DEFAULTS.maxSnapDistanceM),
  columns: columnsSchema,
});
export type SurveyUpload = z.infer<typeof surveyUploadSchema>;
