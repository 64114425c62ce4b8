import { route } from "@/lib/api/route";
import { getProgress } from "@/lib/compute/import-progress";
import { notFound } from "@/lib/errors";
import { validationProgressParams } from "@/lib/validation/network";

/** Where a validation started with `?progress=<id>` has got to: `{ stage, percent }`. Only its starter sees it. */
export const GET = route({ access: { basin: "network.import" }, params: validationProgressParams }, async ({ actor, params }) => {
  const p = getProgress(params.progressId);
  if (!p || p.basinId !== params.basinId || p.userId !== actor!.id) throw notFound("Validation");
  return { stage: p.stage, percent: p.percent };
});
