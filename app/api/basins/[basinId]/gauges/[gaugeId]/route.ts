import { route } from "@/lib/api/route";
import { getGaugeRecord } from "@/lib/services/gauges";
import { gaugeParams } from "@/lib/validation/params";

/** A gauge record with its low-flow statistics, LP3 fits and annual minima (flows in m³/s). */
export const GET = route({ access: { basin: true }, params: gaugeParams }, ({ scope, params }) => getGaugeRecord(scope, params.gaugeId));
