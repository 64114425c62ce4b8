import { bytesResponse } from "@/lib/api/respond";
import { route } from "@/lib/api/route";
import { setProgress } from "@/lib/compute/import-progress";
import { validateDraftJson } from "@/lib/services/networks";
import { networkDraftSchema, validateQuerySchema } from "@/lib/validation/network";
import { basinParams } from "@/lib/validation/params";

/**
 * Validate a draft network; saves nothing. The work runs in an import worker thread;
 * with `?progress=<uuid>` its stages can be followed at GET ./<uuid> meanwhile.
 */
export const POST = route(
  { access: { basin: true }, params: basinParams, body: networkDraftSchema, query: validateQuerySchema },
  async ({ scope, body, query }) => {
    const key = query.progress;
    const track = key ? (stage: Parameters<typeof setProgress>[3], fraction?: number) => setProgress(key, scope.basin.id, scope.actor.id, stage, fraction) : undefined;
    track?.("queued");
    try {
      const json = await validateDraftJson(scope, body, track);
      track?.("done");
      return bytesResponse(json, "application/json");
    } catch (e) {
      track?.("failed");
      throw e;
    }
  },
);
