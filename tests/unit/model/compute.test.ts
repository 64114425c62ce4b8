import { readFileSync } from "node:fs";
import { afterAll, describe, expect, it } from "vitest";
import { ComputeError, ComputeTimeoutError, createComputePool } from "@/lib/compute";
import { ModelInputError, allocate, runModel, type ModelFile } from "@/lib/model";
import { bindingNetwork } from "../../reference/networks";

const file = (name: string): ModelFile => JSON.parse(readFileSync(`examples/${name}.json`, "utf8"));

describe("compute pool (worker threads)", () => {
  const pool = createComputePool({ size: 2 });
  afterAll(() => pool.close());

  it("runs a model and an allocation in workers with the same results as in-process", async () => {
    const [run, alloc] = await Promise.all([pool.run(file("tamsel-river")), pool.allocate(file("tamsel-river-allocate"))]);
    expect(run).toEqual(runModel(file("tamsel-river")));
    expect(alloc).toEqual(allocate(file("tamsel-river-allocate")));
  }, 30_000);

  it("keeps the event loop free while a job runs (an in-process solve would allow no tick until it ends)", async () => {
    const big = bindingNetwork(3, 1500, 60);
    big.allocation = { objective: "max-total" };
    const started = performance.now();
    let ticks = 0;
    const timer = setInterval(() => ticks++, 2);
    const result = await pool.allocate(big);
    clearInterval(timer);
    const ms = performance.now() - started;
    expect(result.feasible).toBe(true);
    expect(ms).toBeGreaterThan(40);
    expect(ticks).toBeGreaterThan(5);
  }, 60_000);

  it("re-creates bad-input errors with their field path", async () => {
    const bad = file("tamsel-river");
    bad.dischargers[0].km = 99;
    const err = await pool.run(bad).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ModelInputError);
    expect((err as ModelInputError).path).toEqual(["dischargers", 0, "km"]);
    const noAlloc = await pool.allocate(file("tamsel-river")).catch((e: unknown) => e);
    expect(noAlloc).toBeInstanceOf(ModelInputError);
  }, 30_000);

  it("times out a long job, replaces the worker, and refuses work after close", async () => {
    const slow = createComputePool({ timeoutMs: 1 });
    const err = await slow.run(file("tamsel-river")).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ComputeTimeoutError);
    await slow.close();
    await expect(slow.run(file("tamsel-river"))).rejects.toBeInstanceOf(ComputeError);
  }, 30_000);
});
