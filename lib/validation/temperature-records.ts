import { z } from "zod";
import { temperatureUnitSchema } from "@/lib/hydrology/read-record";

const optionalText = (max: number, what: string) =>
  z
    .string()
    .trim()
    .max(max, `${what} must be at most ${max} characters`)
    .optional()
    .transform((s) => (s ? s : undefined));

/** The form fields of a daily water-temperature record's upload (multipart, beside the file). */
export const temperatureRecordUploadSchema = z.object({
  name: z.string({ message: "name the record" }).trim().min(1, "name the record").max(120, "the record's name must be at most 120 characters"),
  stationCode: optionalText(40, "the station code"),
  reachId: optionalText(100, "the reach id"),
  unit: temperatureUnitSchema.default("C"),
});
export type TemperatureRecordUpload = z.infer<typeof temperatureRecordUploadSchema>;
