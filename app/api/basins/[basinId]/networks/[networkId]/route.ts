import { route } from "@/lib/api/route";
import { getNetwork } from "@/lib/services/networks";
import { networkParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: true }, params: networkParams }, ({ scope, params }) =>
  getNetwork(scope, params.networkId),
);
