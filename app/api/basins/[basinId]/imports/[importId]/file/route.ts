import { route } from "@/lib/api/route";
import { importFile } from "@/lib/services/imports";
import { importParams } from "@/lib/validation/params";

const TYPES = { shapefile: "application/zip", geojson: "application/geo+json", csv: "text/csv" } as const;

/** The original uploaded bytes, unchanged (with their SHA-256 in a header). */
export const GET = route({ access: { basin: true }, params: importParams }, async ({ scope, params }) => {
  const f = await importFile(scope, params.importId);
  return new Response(new Uint8Array(f.content), {
    headers: {
      "content-type": TYPES[f.format],
      "content-disposition": `attachment; filename="${f.fileName.replace(/["\\\r\n]/g, "_")}"`,
      "x-content-sha256": f.sha256,
    },
  });
});
