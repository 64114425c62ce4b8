import { z } from "zod";
import { temperatureUnitSchema } from "@/lib/hydrology/read-record";
import { optionalText } from "./gauges";

/** The form fields of a daily water-temperature record's upload (multipart, beside the file). */
export const temperatureRecordUploadSchema = z.object({
  name: z.string({ message: "name the record" }).trim().min(1, "name the record").max(120, "the record's name must be at most 120 characters"),
  stationCode: optionalText(40, "the station code"),
  reachId: optionalText(100, "the reach id"),
  unit: temperatureUnitSchema.default("C"),
});
export type TemperatureRecordUpload = z.infer<typeof temperatureRecordUploadSchema>;
