import { route } from "@/lib/api/route";
import { commitNetwork, listNetworks } from "@/lib/services/networks";
import { networkCommitSchema } from "@/lib/validation/network";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: true }, params: basinParams }, ({ scope }) =>
  listNetworks(scope),
);

export const POST = route(
  { access: { basin: true }, params: basinParams, body: networkCommitSchema, status: 201 },
  ({ scope, body }) => commitNetwork(scope, body),
);
