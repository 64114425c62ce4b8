import { route } from "@/lib/api/route";
import { editReach } from "@/lib/services/network-edits";
import { reachEditSchema } from "@/lib/validation/network";
import { reachParams } from "@/lib/validation/params";

export const PATCH = route(
  { access: { basin: true }, params: reachParams, body: reachEditSchema, status: 204 },
  ({ scope, params, body }) => editReach(scope, params.networkId, params.reachId, body),
);
