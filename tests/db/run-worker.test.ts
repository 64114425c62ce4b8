import PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { databaseUrl } from "@/db/client";
import { createComputePool, type ComputePool } from "@/lib/compute/pool";
import { RUN_QUEUE } from "@/lib/jobs/queue";
import { createRun, getRun, processRun, type RunCompute } from "@/lib/services/runs";
import { createScenario } from "@/lib/services/scenarios";
import { scenarioCreateSchema } from "@/lib/validation/scenario";
import { commitDemo } from "../support/demo-network";
import { fileDb } from "../support/file-db";
import { buildWorld, type World } from "../support/world";
import { scoped } from "../support/scoped";

/** The background worker's way of computing runs: a worker thread with a time limit, and several workers on one queue. */
const db = fileDb();
let w: World;
let pool: ComputePool;
const pooled = (p: ComputePool): RunCompute => (job, onProgress) => p.payload(job, onProgress);

async function scenario(name: string, flowScale = 1) {
  return scoped(createScenario)(db, w.users.planner, w.basinId, scenarioCreateSchema.parse({ name, inputs: { conditions: [{ name: "7Q10", flowScale }] } }));
}

beforeAll(async () => {
  w = await buildWorld(db);
  await commitDemo(db, w.users.planner, w.basinId);
  pool = createComputePool({ size: 1, timeoutMs: 60_000 });
}, 60_000);
afterAll(async () => {
  await pool.close();
});

describe("a run computed in the compute worker thread", () => {
  it("stores the same result as the same computation in this thread, with its progress", async () => {
    const s = await scenario("Worker thread");
    const a = await scoped(createRun)(db, w.users.planner, w.basinId, s.id, "allocation");
    const seen: number[] = [];
    await processRun(db, a.id, (job, onProgress) =>
      pool.payload(job, (done) => {
        seen.push(done);
        onProgress(done);
      }),
    );
    const threaded = await scoped(getRun)(db, w.users.planner, w.basinId, a.id);
    expect(threaded.status).toBe("done");
    expect(seen.length).toBeGreaterThan(0);
    expect(seen.at(-1)).toBeLessThanOrEqual(1);
    const { computeRunPayload } = await import("@/lib/model");
    const inline = computeRunPayload("allocation", threaded.modelFiles, threaded.result!.warnings);
    expect(threaded.result).toEqual(JSON.parse(JSON.stringify(inline)));
  });

  it("fails a run whose computation passes its time limit, with the reason, logged once with the run id", async () => {
    const s = await scenario("Too slow for its limit", 0.9);
    const run = await scoped(createRun)(db, w.users.planner, w.basinId, s.id, "model");
    // a limit shorter than starting the thread: the computation cannot finish in it
    const tight = createComputePool({ size: 1, timeoutMs: 1 });
    const errors = vi.spyOn(console, "error").mockImplementation(() => {});
    let logged: unknown[][] = [];
    try {
      await processRun(db, run.id, pooled(tight));
    } finally {
      await tight.close();
      logged = [...errors.mock.calls];
      errors.mockRestore();
    }
    const failed = await scoped(getRun)(db, w.users.planner, w.basinId, run.id);
    expect(failed.status).toBe("failed");
    expect(failed.error).toMatch(/did not finish within the run's time limit \(0 s\) and was stopped/);
    expect(logged.filter((c) => String(c[0]).includes(run.id))).toHaveLength(1);
  });

  it("a model input the computation refuses fails the run naming the field, without an operator log", async () => {
    const s = await scenario("Bad input in the thread", 0.8);
    const run = await scoped(createRun)(db, w.users.planner, w.basinId, s.id, "model");
    // the stored inputs made unusable (a negative length): the model refuses them by field
    await db
      .updateTable("runs")
      .set((eb) => ({ model_file: eb.fn("jsonb_set", [eb.ref("model_file"), eb.val("{files,0,file,reaches,0,length_km}"), eb.val("-1")]) }))
      .where("id", "=", run.id)
      .execute();
    const errors = vi.spyOn(console, "error").mockImplementation(() => {});
    let logged: unknown[][] = [];
    try {
      await processRun(db, run.id, pooled(pool));
    } finally {
      logged = [...errors.mock.calls];
      errors.mockRestore();
    }
    const failed = await scoped(getRun)(db, w.users.planner, w.basinId, run.id);
    expect(failed.status).toBe("failed");
    expect(failed.error).toMatch(/^reaches\.0\.length_km: /);
    expect(logged).toEqual([]);
  });
});

describe("two workers on one queue", () => {
  it("share the runs without computing any twice", async () => {
    const runIds: string[] = [];
    for (let i = 0; i < 6; i++) {
      const s = await scenario(`Queue share ${i}`, 0.5 + i * 0.05);
      runIds.push((await scoped(createRun)(db, w.users.planner, w.basinId, s.id, "model")).id);
    }
    const taken: Array<{ worker: number; runId: string }> = [];
    const bosses = await Promise.all(
      [1, 2].map(async (n) => {
        const boss = new PgBoss({ connectionString: databaseUrl(), max: 2 });
        boss.on("error", () => {});
        await boss.start();
        await boss.work<{ runId: string }>(RUN_QUEUE, { pollingIntervalSeconds: 0.5, batchSize: 1 }, async (jobs) => {
          for (const job of jobs) {
            taken.push({ worker: n, runId: job.data.runId });
            await processRun(db, job.data.runId, pooled(pool));
          }
        });
        return boss;
      }),
    );
    try {
      const deadline = Date.now() + 60_000;
      for (;;) {
        const states = await db.selectFrom("runs").select("status").where("id", "in", runIds).execute();
        if (states.every((r) => r.status === "done")) break;
        if (Date.now() > deadline) throw new Error(`runs not finished: ${states.map((r) => r.status).join(", ")}`);
        await new Promise((r) => setTimeout(r, 300));
      }
    } finally {
      await Promise.all(bosses.map((b) => b.stop({ graceful: true, wait: true })));
    }
    const mine = taken.filter((t) => runIds.includes(t.runId));
    // every run taken exactly once, by one worker or the other
    expect(mine.map((t) => t.runId).sort()).toEqual([...runIds].sort());
  }, 90_000);
});
