import { route } from "@/lib/api/route";
import { listMappings, saveMapping } from "@/lib/services/imports";
import { fieldMappingSaveSchema } from "@/lib/validation/network";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: true }, params: basinParams }, ({ scope }) =>
  listMappings(scope),
);

export const POST = route(
  { access: { basin: true }, params: basinParams, body: fieldMappingSaveSchema, status: 201 },
  ({ scope, body }) => saveMapping(scope, body),
);
