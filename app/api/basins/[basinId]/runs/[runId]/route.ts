import { route } from "@/lib/api/route";
import { getRunJson } from "@/lib/services/runs";
import { runParams } from "@/lib/validation/params";

/** A run with its stored result; a finished run never changes, so it carries an ETag. */
export const GET = route({ access: { basin: true }, params: runParams }, async ({ scope, params, req }) => {
  const { bytes, etag } = await getRunJson(scope, params.runId);
  const headers = { "content-type": "application/json", etag, "cache-control": "private, no-cache" };
  if (req.headers.get("if-none-match") === etag) return new Response(null, { status: 304, headers });
  // one body in one piece with its length: Next writes it out without chunked encoding
  return new Response(bytes, { headers: { ...headers, "content-length": String(bytes.byteLength) } });
});
