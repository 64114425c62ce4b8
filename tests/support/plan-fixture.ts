import type { Db } from "@/db/client";
import { closeDueReviews, openReview, proposePlan, publishPlan } from "@/lib/services/plans";
import { createRun, processRun } from "@/lib/services/runs";
import { createScenario } from "@/lib/services/scenarios";
import { scenarioCreateSchema } from "@/lib/validation/scenario";
import { commitDemo } from "./demo-network";
import type { World } from "./world";
import { scoped } from "./scoped";

export type PlanStage = "draft" | "review" | "closed" | "published";

/** A plan of the demo allocation in the world's basin, taken to `stage` by the world's planner and lead. */
export async function planAt(db: Db, w: World, stage: PlanStage, opts: { revises?: string | null } = {}) {
  await commitDemo(db, w.users.planner, w.basinId);
  const scenario = await scoped(createScenario)(db, w.users.planner, w.basinId, scenarioCreateSchema.parse({ name: `Plan basis ${Math.random()}`, inputs: { conditions: [{ name: "7Q10" }] } }));
  const run = await scoped(createRun)(db, w.users.planner, w.basinId, scenario.id, "allocation");
  await processRun(db, run.id);
  const plan = await scoped(proposePlan)(db, w.users.planner, w.basinId, { runId: run.id, title: "Tamsel River DO plan", ...opts });
  if (stage !== "draft") {
    const now = Date.now();
    // opens now (a minute back, within the grace for a clock a little off) and runs the default shortest review
    await scoped(openReview)(db, w.users.lead, w.basinId, plan.id, {
      startsAt: new Date(now - 60_000).toISOString(),
      endsAt: new Date(now + 31 * 86_400_000).toISOString(),
      timeZone: "America/Chicago",
    });
  }
  if (stage === "closed" || stage === "published") await closeDueReviews(db, new Date(Date.now() + 32 * 86_400_000));
  // the fixture's threads have no comments: nothing to acknowledge
  if (stage === "published") await scoped(publishPlan)(db, w.users.lead, w.basinId, plan.id, { acknowledgedThreadIds: [], statement: "" });
  const threads = await db.selectFrom("threads").select(["id", "facility_id"]).where("plan_id", "=", plan.id).execute();
  return { planId: plan.id, runId: run.id, planThreadId: threads.find((t) => t.facility_id === null)!.id, threads };
}
