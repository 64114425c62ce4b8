import { route } from "@/lib/api/route";
import { listBasinImports, uploadImport, uploadLimitBytes } from "@/lib/services/imports";
import { uploadFieldsSchema } from "@/lib/validation/network";
import { basinParams } from "@/lib/validation/params";

export const GET = route({ access: { basin: true }, params: basinParams }, ({ scope }) =>
  listBasinImports(scope),
);

/** multipart/form-data: file + layer (reaches | dischargers), optional epsg and CSV column names. */
export const POST = route(
  {
    access: { basin: true },
    params: basinParams,
    body: uploadFieldsSchema,
    fileField: "file",
    // the file itself is checked against the limit again; this refuses an oversized request unread (form fields add a little)
    maxUploadBytes: () => uploadLimitBytes() + 64 * 1024,
    status: 201,
  },
  ({ scope, body, file }) => uploadImport(scope, file!, body),
);
