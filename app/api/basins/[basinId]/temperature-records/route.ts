import { route } from "@/lib/api/route";
import { listTemperatureRecords, TEMPERATURE_RECORD_MAX_BYTES, uploadTemperatureRecord } from "@/lib/services/temperature-records";
import { basinParams } from "@/lib/validation/params";
import { temperatureRecordUploadSchema } from "@/lib/validation/temperature-records";

export const GET = route({ access: { basin: true }, params: basinParams }, ({ scope }) => listTemperatureRecords(scope));

/** multipart/form-data: file (CSV date,temperature or rdb text) + name, unit (C|F), optional stationCode and reachId. */
export const POST = route(
  {
    access: { basin: true },
    params: basinParams,
    body: temperatureRecordUploadSchema,
    fileField: "file",
    maxUploadBytes: () => TEMPERATURE_RECORD_MAX_BYTES + 64 * 1024,
    status: 201,
  },
  ({ scope, body, file }) => uploadTemperatureRecord(scope, file!, body),
);
