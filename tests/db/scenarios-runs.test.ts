import { sql } from "kysely";
import { beforeAll, describe, expect, it } from "vitest";
import * as runRoute from "@/app/api/basins/[basinId]/runs/[runId]/route";
import * as modelFileRoute from "@/app/api/basins/[basinId]/runs/[runId]/model-file/route";
import * as scenarioRoute from "@/app/api/basins/[basinId]/scenarios/[scenarioId]/route";
import * as scenarioRunsRoute from "@/app/api/basins/[basinId]/scenarios/[scenarioId]/runs/route";
import * as scenariosRoute from "@/app/api/basins/[basinId]/scenarios/route";
import * as duplicateRoute from "@/app/api/basins/[basinId]/scenarios/[scenarioId]/duplicate/route";
import { getBoss, RUN_QUEUE } from "@/lib/jobs/queue";
import { allocate, runModel, withAllocatedLoads, type ModelFile } from "@/lib/model";
import { getRun, processRun, sweepStuckRuns, type RunDto, type RunSummaryDto } from "@/lib/services/runs";
import type { ScenarioDto } from "@/lib/services/scenarios";
import { fileDb } from "../support/file-db";
import { callRoute } from "../support/call-route";
import { err } from "../support/errors";
import { commitDemo } from "../support/demo-network";
import { buildWorld, type World } from "../support/world";
import { scoped } from "../support/scoped";

const db = fileDb();
let w: World;
beforeAll(async () => {
  w = await buildWorld(db);
  await commitDemo(db, w.users.planner, w.basinId);
});

const as = (key: keyof World["users"]) => w.users[key].id;
const scenarioBody = (name: string, extra: Record<string, unknown> = {}) => ({
  name,
  inputs: { conditions: [{ name: "7Q10, August", temperatureC: 26 }], ...extra },
});
async function createScenario(name: string, extra: Record<string, unknown> = {}) {
  const res = await callRoute(scenariosRoute.POST, "POST", { userId: as("planner"), params: { basinId: w.basinId }, body: scenarioBody(name, extra) });
  expect(res.status).toBe(201);
  return res.json as ScenarioDto;
}
const queueRun = (scenarioId: string, kind: "model" | "allocation") =>
  callRoute(scenarioRunsRoute.POST, "POST", { userId: as("planner"), params: { basinId: w.basinId, scenarioId }, body: { kind } });
const readRun = async (runId: string) =>
  (await callRoute(runRoute.GET, "GET", { userId: as("lead"), params: { basinId: w.basinId, runId } })).json as RunDto;

describe("scenarios", () => {
  it("are created on the newest network with defaults filled in, and read back", async () => {
    const s = await createScenario("Base case");
    expect(s.version).toBe(1);
    expect(s.networkVersion).toBe(1);
    expect(s.inputs.kinetics.kd20PerDay).toBe(0.3);
    expect(s.inputs.allocation.floorBod5MgL).toBe(30);
  });

  it("catch concurrent edits: the second save from the same version gets 409 and nothing is lost", async () => {
    const s = await createScenario("Concurrent");
    const patch = (userId: string, body: unknown) =>
      callRoute(scenarioRoute.PATCH, "PATCH", { userId, params: { basinId: w.basinId, scenarioId: s.id }, body });
    const first = await patch(as("planner"), { version: 1, description: "first editor" });
    expect(first.status).toBe(200);
    expect((first.json as ScenarioDto).version).toBe(2);
    const second = await patch(as("lead"), { version: 1, description: "second editor" });
    expect(second.status).toBe(409);
    expect(err(second.json).message).toMatch(/after you opened it/);
    const now = (await callRoute(scenarioRoute.GET, "GET", { userId: as("lead"), params: { basinId: w.basinId, scenarioId: s.id } })).json as ScenarioDto;
    expect(now.description).toBe("first editor");
    expect(now.version).toBe(2);
  });

  it("refuse bad inputs naming the field", async () => {
    const res = await callRoute(scenariosRoute.POST, "POST", {
      userId: as("planner"),
      params: { basinId: w.basinId },
      body: scenarioBody("Bad", { kinetics: { kd20PerDay: -1 } }),
    });
    expect(res.status).toBe(422);
    expect(err(res.json).details![0].path).toBe("inputs.kinetics.kd20PerDay");
    const noConditions = await callRoute(scenariosRoute.POST, "POST", {
      userId: as("planner"),
      params: { basinId: w.basinId },
      body: { name: "None", inputs: { conditions: [] } },
    });
    expect(err(noConditions.json).details![0].path).toBe("inputs.conditions");
  });

  it("duplicate, and delete only while never run", async () => {
    const s = await createScenario("Original");
    const dup = await callRoute(duplicateRoute.POST, "POST", {
      userId: as("planner"),
      params: { basinId: w.basinId, scenarioId: s.id },
      body: { name: "Original (copy)" },
    });
    expect(dup.status).toBe(201);
    expect((dup.json as ScenarioDto).inputs).toEqual(s.inputs);
    const again = await callRoute(duplicateRoute.POST, "POST", {
      userId: as("planner"),
      params: { basinId: w.basinId, scenarioId: s.id },
      body: { name: "Original (copy)" },
    });
    expect(again.status).toBe(409);
    const del = (scenarioId: string) => callRoute(scenarioRoute.DELETE, "DELETE", { userId: as("planner"), params: { basinId: w.basinId, scenarioId } });
    expect((await del((dup.json as ScenarioDto).id)).status).toBe(204);
    await queueRun(s.id, "model");
    const kept = await del(s.id);
    expect(kept.status).toBe(409);
    expect(err(kept.json).message).toMatch(/traceable/);
  });
});

describe("runs", () => {
  it("a model run stores its inputs, hash, methods and the same result as the model run directly", async () => {
    const s = await createScenario("Model run");
    const queued = await queueRun(s.id, "model");
    expect(queued.status).toBe(202);
    const summary = queued.json as RunSummaryDto;
    expect(summary.status).toBe("queued");
    expect(summary.inputsHash).toMatch(/^[0-9a-f]{64}$/);
    await processRun(db, summary.id);
    const run = await readRun(summary.id);
    expect(run.status).toBe("done");
    expect(run.progress).toBe(1);
    expect(run.result!.conditions[0].run).toEqual(runModel(run.modelFiles[0].file));
    // the stored-text fast path gives the same document as the parsed one
    expect(run).toEqual(await scoped(getRun)(db, w.users.lead, w.basinId, summary.id));
    expect(run.methods).toMatchObject({ deoxygenation_theta_rule: "constant", saturation: expect.stringMatching(/Benson/) });
    expect(Object.keys(run.methods.reaeration as object)).toHaveLength(17);

    // the same inputs are served from the stored run
    const again = await queueRun(s.id, "model");
    expect(again.status).toBe(200);
    expect((again.json as RunSummaryDto & { reused: boolean }).id).toBe(summary.id);

    // the exported model file reproduces the stored result
    const exported = await callRoute(modelFileRoute.GET, "GET", { userId: as("planner"), params: { basinId: w.basinId, runId: summary.id } });
    expect(exported.headers.get("content-disposition")).toMatch(/attachment/);
    expect(runModel(exported.json as ModelFile)).toEqual(run.result!.conditions[0].run);
  });

  it("an allocation run stores the LP result and DO with the allocated loads", async () => {
    const s = await createScenario("Allocation run", { allocation: { objective: "equal-percent" } });
    const summary = (await queueRun(s.id, "allocation")).json as RunSummaryDto;
    await processRun(db, summary.id);
    const run = await readRun(summary.id);
    expect(run.status).toBe("done");
    // the file's own condition goes by the scenario's name ("base" only in the CLI's output)
    expect(run.result!.allocation).toEqual(allocate(run.modelFiles[0].file, { own_condition_name: "7Q10, August" }));
    if (run.result!.allocation!.feasible) {
      expect(run.result!.conditions[0].run.minimum.do_mg_l).toBeGreaterThanOrEqual(run.modelFiles[0].file.criterion_do_mg_l - 1e-6);
    }
  });

  it("an allocation run with two conditions stores DO with the allocated loads under each, named as the scenario names them", async () => {
    const conditions = [
      { name: "Design low flow", temperatureC: 24 },
      { name: "Hot, dry 7Q10", temperatureC: 29, flowScale: 0.8 },
    ];
    const s = await createScenario("Two conditions", { conditions, allocation: { objective: "max-total", floorBod5MgL: 5 } });
    const alloc = (await queueRun(s.id, "allocation")).json as RunSummaryDto;
    const model = (await queueRun(s.id, "model")).json as RunSummaryDto;
    await processRun(db, alloc.id);
    await processRun(db, model.id);
    const a = await readRun(alloc.id);
    const m = await readRun(model.id);
    expect(a.result!.conditions.map((c) => c.name)).toEqual(conditions.map((c) => c.name));
    const allocation = a.result!.allocation!;
    expect(allocation.conditions).toEqual(conditions.map((c) => c.name));
    for (const b of allocation.binding) expect(conditions.map((c) => c.name)).toContain(b.condition);
    // the model run's files are built one per condition on their own: with the allocated loads they give the stored DO
    a.result!.conditions.forEach((c, i) => {
      const independent = runModel(allocation.feasible ? withAllocatedLoads(m.modelFiles[i].file, allocation) : m.modelFiles[i].file);
      expect(c.run.minimum.do_mg_l).toBeCloseTo(independent.minimum.do_mg_l, 9);
      expect(c.run.minimum.reach).toBe(independent.minimum.reach);
    });
  });

  it("a failed run surfaces a readable reason", async () => {
    const s = await createScenario("Impossible floor", { allocation: { objective: "max-total", floorBod5MgL: 30, mosDoMgL: 4.9 } });
    const summary = (await queueRun(s.id, "allocation")).json as RunSummaryDto;
    // break the stored inputs the way a bad file would: a discharger beyond its reach
    const row = await db.selectFrom("runs").select("model_file").where("id", "=", summary.id).executeTakeFirstOrThrow();
    const inputs = row.model_file as unknown as { files: { file: ModelFile }[] };
    inputs.files[0].file.dischargers[0].km = 999;
    await db.updateTable("runs").set({ model_file: JSON.stringify(inputs) }).where("id", "=", summary.id).execute();
    await processRun(db, summary.id);
    const run = await readRun(summary.id);
    expect(run.status).toBe("failed");
    expect(run.error).toMatch(/^dischargers\.0\.km: /);
    expect(run.error).not.toMatch(/\n\s+at /);
  });

  it("a scenario the network cannot support is refused before queueing, naming the field", async () => {
    const other = await buildWorld(db);
    const { network } = await commitDemo(db, other.users.planner, other.basinId);
    await db.updateTable("reaches").set({ attributes: JSON.stringify({ velocityMps: 0.2 }) }).where("reach_key", "=", "SR-01").where("network_id", "=", network.id).execute();
    const created = await callRoute(scenariosRoute.POST, "POST", { userId: other.users.planner.id, params: { basinId: other.basinId }, body: scenarioBody("No depth") });
    const res = await callRoute(scenarioRunsRoute.POST, "POST", {
      userId: other.users.planner.id,
      params: { basinId: other.basinId, scenarioId: (created.json as ScenarioDto).id },
      body: { kind: "model" },
    });
    expect(res.status).toBe(422);
    expect(err(res.json).details![0].path).toMatch(/SR-01/);
    expect(await db.selectFrom("runs").select("id").where("basin_id", "=", other.basinId).execute()).toEqual([]);
  });

  it("a run that cannot finish on its own is failed by the sweeper with a reason; a finished one is never touched", async () => {
    // inputs no other test uses: equal inputs would be served from an earlier finished run
    const s = await createScenario("Swept", { stepKm: 0.37 });
    const ids: string[] = [];
    for (let i = 0; i < 5; i++) ids.push(((await queueRun(s.id, "model")).json as RunSummaryDto).id);
    expect(new Set(ids).size).toBe(5);
    const [lost, fresh, dead, timedOut, retrying] = ids;
    const ago = (ms: number) => new Date(Date.now() - ms);
    // created_at is not updatable through the app's types: queued ten minutes ago
    await sql`update runs set created_at = now() - interval '10 minutes' where id = any(${[lost, dead, timedOut, retrying]}::uuid[])`.execute(db);
    // the worker died mid-run: still "running", started past the time limit, its job still active
    await db.updateTable("runs").set({ status: "running", started_at: ago(3 * 3600_000) }).where("id", "in", [dead, retrying]).execute();
    const jobs: Record<string, { state: string; output: unknown } | null> = {
      [lost]: null,
      [fresh]: null,
      [dead]: { state: "active", output: null },
      [timedOut]: { state: "failed", output: { value: { message: "job failed by timeout in active state" } } },
      [retrying]: { state: "retry", output: null },
    };
    const failed = await sweepStuckRuns(db, async (id) => (id in jobs ? jobs[id] : { state: "created", output: null }));
    expect(failed).toBe(3);
    const rows = Object.fromEntries(
      (await db.selectFrom("runs").select(["id", "status", "error", "finished_at"]).where("id", "in", ids).execute()).map((r) => [r.id, r]),
    );
    expect(rows[lost]).toMatchObject({ status: "failed", error: expect.stringMatching(/no longer on the queue.*Run it again/) });
    expect(rows[dead]).toMatchObject({ status: "failed", error: expect.stringMatching(/worker stopped while computing/) });
    expect(rows[timedOut]).toMatchObject({ status: "failed", error: expect.stringMatching(/did not finish within its time limit of 10 minutes/) });
    expect(rows[lost].finished_at).not.toBeNull();
    // a job just queued may not be visible yet, and a job waiting for its retry will run again
    expect(rows[fresh].status).toBe("queued");
    expect(rows[retrying].status).toBe("running");

    // a late worker cannot overwrite the failure it was given
    await processRun(db, dead);
    expect((await readRun(dead)).status).toBe("failed");

    // the planner runs it again: a new run (a failed one is never served for equal inputs), computed anew
    const again = (await queueRun(s.id, "model")).json as RunSummaryDto & { reused: boolean };
    expect(again.reused).toBe(false);
    expect(ids).not.toContain(again.id);
    await processRun(db, again.id);
    expect((await readRun(again.id)).status).toBe("done");
    // and once done, equal inputs are served from it; the sweeper leaves it alone
    const third = (await queueRun(s.id, "model")).json as RunSummaryDto & { reused: boolean };
    expect(third).toMatchObject({ id: again.id, reused: true });
    await sweepStuckRuns(db, async (id) => (id === again.id ? null : { state: "created", output: null }), new Date(Date.now() + 86_400_000));
    expect((await readRun(again.id)).status).toBe("done");
  });

  it("a run's job is queued under the run's id, with one retry and a time limit", async () => {
    const s = await createScenario("Job id", { stepKm: 0.41 });
    const summary = (await queueRun(s.id, "model")).json as RunSummaryDto;
    const job = await (await getBoss(process.env.DATABASE_URL)).getJobById(RUN_QUEUE, summary.id);
    expect(job).toMatchObject({ id: summary.id, data: { runId: summary.id }, retryLimit: 1 });
    expect(job!.expireInSeconds).toBe(600);
  });

  it("runs off the request thread on the PostgreSQL job queue", async () => {
    const boss = await getBoss(process.env.DATABASE_URL);
    await boss.work<{ runId: string }>(RUN_QUEUE, { pollingIntervalSeconds: 0.5 }, async (jobs) => {
      for (const job of jobs) await processRun(db, job.data.runId);
    });
    const s = await createScenario("Queued", { stepKm: 0.25 });
    const queued = await queueRun(s.id, "model");
    expect(queued.status, JSON.stringify(queued.json)).toBe(202);
    const summary = queued.json as RunSummaryDto;
    // earlier tests leave runs on the shared queue; the worker takes them in order
    let run = await readRun(summary.id);
    const deadline = Date.now() + 100_000;
    while (Date.now() < deadline && run.status !== "done" && run.status !== "failed") {
      await new Promise((r) => setTimeout(r, 250));
      run = await readRun(summary.id);
    }
    expect(run.status).toBe("done");
    expect(run.startedAt).not.toBeNull();
  }, 120_000);
});
