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
  { access: { basin: "network.import" }, params: basinParams, body: networkDraftSchema, query: validateQuerySchema },
  async ({ db, actor, params, body, query }) => {
    const key = query.progress;
    const track = key ? (stage: Parameters<typeof setProgress>[3], fraction?: number) => setProgress(key, params.basinId, actor!.id, stage, fraction) : undefined;
    track?.("queued");
    try {
      const json = await validateDraftJson(db, actor, params.basinId, body, track);
      track?.("done");
      return bytesResponse(json, "application/json");
    } catch (e) {
      track?.("failed");
      throw e;
    }
  },
);
