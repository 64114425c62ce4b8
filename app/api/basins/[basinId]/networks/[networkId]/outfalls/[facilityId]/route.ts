import { route } from "@/lib/api/route";
import { editOutfall } from "@/lib/services/network-edits";
import { outfallEditSchema } from "@/lib/validation/network";
import { outfallParams } from "@/lib/validation/params";

export const PATCH = route(
  { access: { basin: true }, params: outfallParams, body: outfallEditSchema, status: 204 },
  ({ scope, params, body }) => editOutfall(scope, params.networkId, params.facilityId, body),
);
