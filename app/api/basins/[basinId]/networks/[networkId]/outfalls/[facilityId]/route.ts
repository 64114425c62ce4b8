import { route } from "@/lib/api/route";
import { editOutfall } from "@/lib/services/network-edits";
import { outfallEditSchema } from "@/lib/validation/network";
import { outfallParams } from "@/lib/validation/params";

export const PATCH = route(
  { access: { basin: "network.import" }, params: outfallParams, body: outfallEditSchema, status: 204 },
  ({ db, actor, params, body }) => editOutfall(db, actor, params.basinId, params.networkId, params.facilityId, body),
);
