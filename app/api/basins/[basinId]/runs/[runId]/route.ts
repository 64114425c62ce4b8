import { route } from "@/lib/api/route";
import { getRunJson } from "@/lib/services/runs";
import { runParams } from "@/lib/validation/params";

/** A run with its stored result; a finished run never changes, so it carries an ETag. */
export const GET = route({ access: { basin: true }, params: runParams }, async ({ scope, params, req }) => {
  const { json, etag } = await getRunJson(scope, params.runId);
  const headers = { "content-type": "application/json", etag, "cache-control": "private, no-cache" };
  if (req.headers.get("if-none-match") === etag) return new Response(null, { status: 304, headers });
  return new Response(json, { headers });
});
