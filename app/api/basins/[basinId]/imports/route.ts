import { route } from "@/lib/api/route";
import { listBasinImports, uploadImport } from "@/lib/services/imports";
import { uploadFieldsSchema } from "@/lib/validation/network";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: "scenario.read" }, params: basinParams }, ({ db, actor, params }) =>
  listBasinImports(db, actor, params.basinId),
);

/** multipart/form-data: file + layer (reaches | dischargers), optional epsg and CSV column names. */
export const POST = route(
  { access: { basin: "network.import" }, params: basinParams, body: uploadFieldsSchema, fileField: "file", status: 201 },
  ({ db, actor, params, body, file }) => uploadImport(db, actor, params.basinId, file!, body),
);
