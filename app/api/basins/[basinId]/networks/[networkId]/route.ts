import { route } from "@/lib/api/route";
import { getNetwork } from "@/lib/services/networks";
import { networkParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: "scenario.read" }, params: networkParams }, ({ db, actor, params }) =>
  getNetwork(db, actor, params.basinId, params.networkId),
);
