import { route } from "@/lib/api/route";
import { getRun } from "@/lib/services/runs";
import { runParams } from "@/lib/validation/params";

/**
 * The run's model file in the MODEL.md format (the first condition's file for
 * a model run), which `npm run model` / `npm run allocate` reproduce exactly.
 */
export const GET = route({ access: { basin: true }, params: runParams }, async ({ scope, params }) => {
  const run = await getRun(scope, params.runId);
  const file = run.modelFiles[0].file;
  return new Response(JSON.stringify(file, null, 2), {
    headers: {
      "content-type": "application/json",
      "content-disposition": `attachment; filename="sagline-run-${run.id.slice(0, 8)}-${run.kind}.json"`,
    },
  });
});
