import { route } from "@/lib/api/route";
import { editReach } from "@/lib/services/network-edits";
import { reachEditSchema } from "@/lib/validation/network";
import { reachParams } from "@/lib/validation/params";

export const PATCH = route(
  { access: { basin: "network.import" }, params: reachParams, body: reachEditSchema, status: 204 },
  ({ db, actor, params, body }) => editReach(db, actor, params.basinId, params.networkId, params.reachId, body),
);
