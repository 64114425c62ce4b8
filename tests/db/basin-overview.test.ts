import { beforeAll, describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { runConditions } from "@/lib/results/run-conditions";
import { basinOverview, listRunOutcomes } from "@/lib/services/basin-overview";
import { createRun, getRun, processRun } from "@/lib/services/runs";
import { createScenario } from "@/lib/services/scenarios";
import { scenarioCreateSchema } from "@/lib/validation/scenario";
import { fileDb } from "../support/file-db";
import { planAt } from "../support/plan-fixture";
import { buildWorld, type World } from "../support/world";
import { scoped } from "../support/scoped";

const db = fileDb();

/**
 * The basin hub with a plan in review (network v1, its scenario's allocation run), then a
 * draft plan (network v2, a second scenario), then a model run on a third scenario on v2.
 */
let w: World;
let review: Awaited<ReturnType<typeof planAt>>;
let draft: Awaited<ReturnType<typeof planAt>>;
let modelRunId: string;
let modelScenarioId: string;

beforeAll(async () => {
  w = await buildWorld(db);
  review = await planAt(db, w, "review");
  draft = await planAt(db, w, "draft");
  const s = await scoped(createScenario)(db, w.users.planner, w.basinId, scenarioCreateSchema.parse({ name: "Model only", inputs: { conditions: [{ name: "7Q10" }, { name: "Hot", temperatureC: 30 }] } }));
  modelScenarioId = s.id;
  const run = await scoped(createRun)(db, w.users.planner, w.basinId, s.id, "model");
  await processRun(db, run.id);
  modelRunId = run.id;
}, 120_000);

/** The lowest DO and its condition as the run page's headline reads them (full result, runConditions). */
async function headline(runId: string) {
  const run = await scoped(getRun)(db, w.users.planner, w.basinId, runId);
  const rc = runConditions(run.result!);
  const c = rc.conditions[rc.governing];
  return { condition: c.name, doMgL: c.run.minimum.do_mg_l, feasible: rc.allocation?.feasible ?? null };
}

describe("basinOverview: what each role sees", () => {
  it("a lead sees the network, every scenario with its latest run's outcome, every plan and recent activity", async () => {
    const o = await scoped(basinOverview)(db, w.users.lead, w.basinId);
    expect(o.network?.version).toBe(2);
    expect(o.network?.reachCount).toBeGreaterThan(0);
    expect(o.network?.outfallCount).toBeGreaterThan(0);
    expect(o.network?.createdBy).toBe(w.users.planner.name);

    expect(o.scenarios).toHaveLength(3);
    const model = o.scenarios!.find((s) => s.id === modelScenarioId)!;
    // the first plan's scenario stayed on network v1; the second one's is on v2 (the newest)
    const onV1 = o.scenarios!.find((s) => s.networkVersion === 1)!;
    const onV2 = o.scenarios!.find((s) => s.networkVersion === 2 && s.id !== modelScenarioId)!;
    expect(onV1.newerNetwork).toBe(true);
    expect(onV2.newerNetwork).toBe(false);
    expect(model.newerNetwork).toBe(false);
    expect(onV1.latestRun!.id).toBe(review.runId);
    // equal inputs are served from the stored run: the second plan reused the first one's run
    expect(draft.runId).toBe(review.runId);
    expect(onV2.latestRun).toBeNull();
    for (const s of [onV1, model]) {
      const h = await headline(s.latestRun!.id);
      expect(s.latestRun!.outcome!.condition).toBe(h.condition);
      expect(s.latestRun!.outcome!.lowestDoMgL).toBe(h.doMgL);
      expect(s.latestRun!.outcome!.feasible).toBe(h.feasible);
    }
    expect(onV1.latestRun!.outcome!.feasible).toBe(true);
    expect(model.latestRun!.kind).toBe("model");
    expect(model.latestRun!.outcome!.conditionCount).toBe(2);
    expect(model.latestRun!.outcome!.feasible).toBeNull();

    expect(o.plans.map((p) => [p.id, p.stage])).toEqual([
      [draft.planId, "draft"],
      [review.planId, "open"],
    ]);
    expect(o.plans[1].review).not.toBeNull();
    expect(o.plans[1].stageText).toBe("in review");

    expect(o.activity).not.toBeNull();
    expect(o.activity!.length).toBeGreaterThan(0);
    expect(o.activity!.length).toBeLessThanOrEqual(6);
    expect(o.activity![0].action).toBe("run.queued");
  });

  it("a planner sees the same without the audit trail", async () => {
    const o = await scoped(basinOverview)(db, w.users.planner, w.basinId);
    expect(o.network?.version).toBe(2);
    expect(o.scenarios).toHaveLength(3);
    expect(o.plans).toHaveLength(2);
    expect(o.activity).toBeNull();
  });

  it.each(["discharger", "stakeholder"] as const)("a %s sees only plans in or after review: no network, scenarios or activity", async (role) => {
    const o = await scoped(basinOverview)(db, w.users[role], w.basinId);
    expect(o.network).toBeNull();
    expect(o.scenarios).toBeNull();
    expect(o.activity).toBeNull();
    expect(o.plans.map((p) => p.id)).toEqual([review.planId]);
  });

  it("a site admin sees plans in review and the activity, not the models", async () => {
    const o = await scoped(basinOverview)(db, w.users.admin, w.basinId);
    expect(o.scenarios).toBeNull();
    expect(o.network).toBeNull();
    expect(o.plans.map((p) => p.id)).toEqual([review.planId]);
    expect(o.activity).not.toBeNull();
  });

  it("refuses someone who is not a member, and the signed-out", async () => {
    await expect(scoped(basinOverview)(db, w.users.outsider, w.basinId)).rejects.toMatchObject({ status: 403 });
    await expect(scoped(basinOverview)(db, null, w.basinId)).rejects.toBeInstanceOf(AppError);
  });
});

describe("listRunOutcomes (the runs list's outcome column)", () => {
  it("gives each finished run its governing lowest DO and the newest network version, to planners only", async () => {
    const o = await scoped(listRunOutcomes)(db, w.users.planner, w.basinId);
    expect(o.latestNetworkVersion).toBe(2);
    for (const runId of [review.runId, modelRunId]) {
      const h = await headline(runId);
      expect(o.runs[runId]?.lowestDoMgL).toBe(h.doMgL);
      expect(o.runs[runId]?.condition).toBe(h.condition);
    }
    await expect(scoped(listRunOutcomes)(db, w.users.discharger, w.basinId)).rejects.toMatchObject({ status: 403 });
    await expect(scoped(listRunOutcomes)(db, w.users.stakeholder, w.basinId)).rejects.toMatchObject({ status: 403 });
  });
});
