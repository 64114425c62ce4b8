import { route } from "@/lib/api/route";
import { GAUGE_RECORD_MAX_BYTES, listGaugeRecords, uploadGaugeRecord } from "@/lib/services/gauges";
import { gaugeUploadSchema } from "@/lib/validation/gauges";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: true }, params: basinParams }, ({ scope }) => listGaugeRecords(scope));

/** multipart/form-data: file (CSV date,flow or rdb text) + name, unit, climaticYearStart, optional stationCode and reachId. */
export const POST = route(
  {
    access: { basin: true },
    params: basinParams,
    body: gaugeUploadSchema,
    fileField: "file",
    maxUploadBytes: () => GAUGE_RECORD_MAX_BYTES + 64 * 1024,
    status: 201,
  },
  ({ scope, body, file }) => uploadGaugeRecord(scope, file!, body),
);
