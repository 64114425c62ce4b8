import { route } from "@/lib/api/route";
import { commitNetwork, listNetworks } from "@/lib/services/networks";
import { networkCommitSchema } from "@/lib/validation/network";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: "scenario.read" }, params: basinParams }, ({ db, actor, params }) =>
  listNetworks(db, actor, params.basinId),
);

export const POST = route(
  { access: { basin: "network.import" }, params: basinParams, body: networkCommitSchema, status: 201 },
  ({ db, actor, params, body }) => commitNetwork(db, actor, params.basinId, body),
);
