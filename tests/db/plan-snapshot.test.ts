import { sql } from "kysely";
import { beforeAll, describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { getPlan, proposePlan } from "@/lib/services/plans";
import { planReport, readSnapshot } from "@/lib/reports/plan-report-data";
import { createRun, processRun } from "@/lib/services/runs";
import { createScenario, updateScenario } from "@/lib/services/scenarios";
import { scenarioCreateSchema, scenarioInputsSchema } from "@/lib/validation/scenario";
import { commitDemo } from "../support/demo-network";
import { fileDb } from "../support/file-db";
import { buildWorld, type World } from "../support/world";
import { scoped } from "../support/scoped";

// A plan must record what its run used. The scenario is edited between the run
// and the proposal; the plan, its report and its snapshot must still say what was run.
const db = fileDb();
let w: World;
beforeAll(async () => {
  w = await buildWorld(db);
  await commitDemo(db, w.users.planner, w.basinId);
});

async function runThenEdit(name: string) {
  const inputs = scenarioInputsSchema.parse({ conditions: [{ name: "Hot, dry 7Q10" }], kinetics: { kd20PerDay: 0.3 }, allocation: { mosFraction: 0 } });
  const scenario = await scoped(createScenario)(db, w.users.planner, w.basinId, scenarioCreateSchema.parse({ name, inputs }));
  const run = await scoped(createRun)(db, w.users.planner, w.basinId, scenario.id, "allocation");
  await processRun(db, run.id);
  const edited = scenarioInputsSchema.parse({
    ...inputs,
    conditions: [{ name: "EDITED-AFTER-RUN" }],
    kinetics: { ...inputs.kinetics, kd20PerDay: 4.9 },
    allocation: { ...inputs.allocation, mosFraction: 0.5 },
  });
  await scoped(updateScenario)(db, w.users.planner, w.basinId, scenario.id, { version: scenario.version, name: `${name} (renamed)`, inputs: edited });
  return { scenario, run };
}

describe("a plan proposed from a run after its scenario was edited", () => {
  it("snapshots the run's own inputs, name and version, not the scenario's current ones", async () => {
    const { scenario, run } = await runThenEdit("Snapshot basis");
    const plan = await scoped(proposePlan)(db, w.users.planner, w.basinId, { runId: run.id, title: "Snapshot plan" });
    const read = await getPlan(db, w.users.planner, w.basinId, plan.id);
    const s = readSnapshot(read.snapshot as Record<string, unknown>);
    expect(s.scenario.version).toBe(scenario.version);
    expect(s.scenario.name).toBe("Snapshot basis");
    expect(s.scenario.inputs.kinetics.kd20PerDay).toBe(0.3);
    expect(s.scenario.inputs.allocation.mosFraction).toBe(0);
    expect(s.scenario.inputs.conditions.map((c) => c.name)).toEqual(["Hot, dry 7Q10"]);
    expect((s.run as unknown as { scenarioName: string }).scenarioName).toBe("Snapshot basis");
    // and the report printed from it
    const report = JSON.stringify(planReport(read, { name: "Basin", unitSystem: "SI" }, null));
    expect(report).toContain("Hot, dry 7Q10");
    expect(report).not.toContain("EDITED-AFTER-RUN");
    expect(report).not.toContain("4.900");
    expect(report).toContain("Snapshot basis, version 1");
  });

  it("refuses a run stored without its own inputs once the scenario has moved on (409), rather than guess", async () => {
    const { run } = await runThenEdit("Old-style run");
    // a run from before runs kept their scenario record
    await sql`UPDATE runs SET model_file = model_file - 'scenario' WHERE id = ${run.id}`.execute(db);
    const e = await scoped(proposePlan)(db, w.users.planner, w.basinId, { runId: run.id, title: "Old" }).then(() => null, (x: AppError) => x);
    expect(e).toBeInstanceOf(AppError);
    expect(e?.code).toBe("conflict");
    expect(e?.message).toMatch(/edited since this run/);
  });
});
