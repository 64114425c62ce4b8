import type { Db } from "@/db/client";
import { findFacilityByPermit, linkFacilityUser } from "@/db/queries/facilities";
import { closeDueReviews, openReview, proposePlan, publishPlan } from "@/lib/services/plans";
import { createRun, processRun } from "@/lib/services/runs";
import { createScenario } from "@/lib/services/scenarios";
import { scenarioCreateSchema, type ConditionInputs } from "@/lib/validation/scenario";
import { commitDemo } from "./demo-network";
import type { World } from "./world";
import { scoped } from "./scoped";

/** A demo discharger (db/seed/demo-gis dischargers file), to link the world's discharger to. */
export const DEMO_PERMIT = "DP-1001";

/**
 * The demo network committed in the world's basin, with the world's discharger also
 * linked to a demo facility (the world's own facility is in no network), so My facilities
 * has an allocation to show. Returns that facility.
 */
export async function readerBasin(db: Db, w: World, permitId = DEMO_PERMIT) {
  await commitDemo(db, w.users.planner, w.basinId);
  const facility = await findFacilityByPermit(db, w.basinId, permitId);
  if (!facility) throw new Error(`No demo facility ${permitId} in the basin`);
  await linkFacilityUser(db, facility.id, w.users.discharger.id);
  return facility;
}

export type ReaderStage = "draft" | "open" | "closed" | "published";

/**
 * A plan of the demo allocation under `conditions` in a basin that has its network
 * (readerBasin), taken to `stage` by the world's planner and lead. "closed" and
 * "published" run the site-wide closing job past the review's end, as plan-fixture does.
 */
export async function readerPlan(
  db: Db,
  w: World,
  { stage, conditions = [{ name: "7Q10" }], title = "Tamsel River DO plan" }: { stage: ReaderStage; conditions?: Partial<ConditionInputs>[]; title?: string },
) {
  const scenario = await scoped(createScenario)(db, w.users.planner, w.basinId, scenarioCreateSchema.parse({ name: `Reader basis ${Math.random()}`, inputs: { conditions } }));
  const run = await scoped(createRun)(db, w.users.planner, w.basinId, scenario.id, "allocation");
  await processRun(db, run.id);
  const plan = await scoped(proposePlan)(db, w.users.planner, w.basinId, { runId: run.id, title });
  if (stage !== "draft") {
    const now = Date.now();
    await scoped(openReview)(db, w.users.lead, w.basinId, plan.id, {
      startsAt: new Date(now - 60_000).toISOString(),
      endsAt: new Date(now + 31 * 86_400_000).toISOString(),
      timeZone: "America/Chicago",
    });
  }
  if (stage === "closed" || stage === "published") await closeDueReviews(db, new Date(Date.now() + 32 * 86_400_000));
  if (stage === "published") await scoped(publishPlan)(db, w.users.lead, w.basinId, plan.id);
  return { planId: plan.id, runId: run.id, version: plan.version };
}
