import { z } from "zod";
import { DEFAULT_CLIMATIC_YEAR_START } from "@/lib/hydrology/low-flow";
import { flowUnitSchema } from "@/lib/hydrology/read-record";

/** MM-DD, not 29 February: the day each climatic year of low-flow statistics starts (the CLI and the upload). */
export const climaticYearStartSchema = z
  .string()
  .trim()
  .regex(/^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, "climatic year start must be MM-DD, e.g. 04-01")
  .refine((s) => s !== "02-29", "climatic year start cannot be 29 February")
  .default(DEFAULT_CLIMATIC_YEAR_START);

/** An optional trimmed text field of a multipart form: empty is absent. */
export const optionalText = (max: number, what: string) =>
  z
    .string()
    .trim()
    .max(max, `${what} must be at most ${max} characters`)
    .optional()
    .transform((s) => (s ? s : undefined));

/** The form fields of a daily flow record's upload (multipart, beside the file). */
export const gaugeUploadSchema = z.object({
  name: z.string({ message: "name the gauge" }).trim().min(1, "name the gauge").max(120, "the gauge's name must be at most 120 characters"),
  stationCode: optionalText(40, "the station code"),
  reachId: optionalText(100, "the reach id"),
  unit: flowUnitSchema.default("m3/s"),
  climaticYearStart: climaticYearStartSchema,
});
export type GaugeUpload = z.infer<typeof gaugeUploadSchema>;
