import { describe, expect, it } from "vitest";
import { DEMO_STRESS_SCENARIO } from "@/lib/services/demo";
import { createRun, getRun, processRun } from "@/lib/services/runs";
import { createScenario } from "@/lib/services/scenarios";
import { scenarioCreateSchema } from "@/lib/validation/scenario";
import { fileDb } from "../support/file-db";
import { commitDemo } from "../support/demo-network";
import { buildWorld } from "../support/world";
import { scoped } from "../support/scoped";

const db = fileDb();

/** The demo ships a scenario meant to show allocation at work: it must keep doing so. */
describe("the demo's stressed scenario", () => {
  it("misses the criterion at today's loads, and its allocation meets it with real reductions", async () => {
    const w = await buildWorld(db);
    await commitDemo(db, w.users.planner, w.basinId);
    const scenario = await scoped(createScenario)(db, w.users.planner, w.basinId, scenarioCreateSchema.parse(DEMO_STRESS_SCENARIO));
    const model = await scoped(createRun)(db, w.users.planner, w.basinId, scenario.id, "model");
    await processRun(db, model.id);
    const today = await scoped(getRun)(db, w.users.planner, w.basinId, model.id);
    const run = today.result!.conditions[0].run;
    expect(run.minimum.do_mg_l).toBeLessThan(run.criterion_do_mg_l);

    const alloc = await scoped(createRun)(db, w.users.planner, w.basinId, scenario.id, "allocation");
    await processRun(db, alloc.id);
    const allocation = (await scoped(getRun)(db, w.users.planner, w.basinId, alloc.id)).result!.allocation!;
    expect(allocation.feasible).toBe(true);
    expect(Math.max(...allocation.allocations.map((a) => a.reduction_pct ?? 0))).toBeGreaterThan(5);
  });
});
