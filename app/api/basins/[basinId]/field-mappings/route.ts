import { route } from "@/lib/api/route";
import { listMappings, saveMapping } from "@/lib/services/imports";
import { fieldMappingSaveSchema } from "@/lib/validation/network";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: "network.import" }, params: basinParams }, ({ db, actor, params }) =>
  listMappings(db, actor, params.basinId),
);

export const POST = route(
  { access: { basin: "network.import" }, params: basinParams, body: fieldMappingSaveSchema, status: 201 },
  ({ db, actor, params, body }) => saveMapping(db, actor, params.basinId, body),
);
