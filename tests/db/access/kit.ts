import { afterAll, beforeAll } from "vitest";
import { createDb, getDb, type Db } from "@/db/client";
import { stopBoss } from "@/lib/jobs/queue";
import { DEMO_DISCHARGER_MAPPING, DEMO_REACH_MAPPING } from "@/db/seed/demo-gis";
import { createRun, processRun } from "@/lib/services/runs";
import { createScenario } from "@/lib/services/scenarios";
import { scenarioCreateSchema } from "@/lib/validation/scenario";
import { planAt, type PlanStage } from "../../support/plan-fixture";
import { commitDemo, uploadDemo } from "../../support/demo-network";
import type { World } from "../../support/world";
import { scoped } from "../../support/scoped";

/** The matrix's database, opened by `openMatrixDb()` before any case runs. */
export const matrix: { db: Db } = { db: undefined as unknown as Db };

/** Opens the matrix's database for a test file, and closes it, the job queue and the shared pool after. */
export function openMatrixDb(): void {
  beforeAll(() => {
    matrix.db = createDb(process.env.DATABASE_URL, 3);
  });
  afterAll(async () => {
    await stopBoss();
    await matrix.db.destroy();
    await getDb().destroy();
  });
}

/**
 * Every API route × every kind of caller → the expected status. The first
 * test fails when a route file or an exported method has no entry here, so a
 * new route cannot ship without its access rules being written down.
 */
export type Caller = "anon" | "admin" | "lead" | "planner" | "discharger" | "stakeholder" | "outsider";
export const CALLERS: Caller[] = ["anon", "admin", "lead", "planner", "discharger", "stakeholder", "outsider"];

export type Expect = Record<Caller, number>;
export const all = (status: number, overrides: Partial<Expect> = {}): Expect => ({
  anon: status,
  admin: status,
  lead: status,
  planner: status,
  discharger: status,
  stakeholder: status,
  outsider: status,
  ...overrides,
});
/** Signed-in only: anon gets 401, the rest as given. */
export const signedIn = (status: number, overrides: Partial<Expect> = {}) => all(status, { anon: 401, ...overrides });
export const denied = (overrides: Partial<Expect>) => signedIn(403, overrides);

export interface Case {
  expect: Expect;
  /** Builds what the request needs (an upload, a network) as the world's planner. */
  prepare?: (w: World) => Promise<Record<string, string>>;
  params?: (w: World, prepared: Record<string, string>) => Record<string, string>;
  body?: (w: World, prepared: Record<string, string>) => unknown;
}
export type RouteModule = Record<string, unknown>;
export interface Entry {
  load: () => Promise<RouteModule>;
  methods: Record<string, Case>;
  /** Routes not built with lib/api/route (third-party handlers) say why they are skipped. */
  skip?: string;
}

export const basin = (w: World) => ({ basinId: w.basinId });
/** Planner-and-lead work (scenario.read / network.import): admins look after settings, not models. */
export const planners = (ok: number) => denied({ lead: ok, planner: ok });
export const withDraft = async (w: World) => {
  const draft = await uploadDemo(matrix.db, w.users.planner, w.basinId);
  return { reachImportId: draft.reachImportId, dischargerImportId: draft.dischargerImportId! };
};
export const SCENARIO = { name: "Matrix scenario", inputs: { conditions: [{ name: "7Q10" }] } };
export const withScenario = async (w: World) => {
  await commitDemo(matrix.db, w.users.planner, w.basinId);
  const s = await scoped(createScenario)(matrix.db, w.users.planner, w.basinId, scenarioCreateSchema.parse(SCENARIO));
  return { scenarioId: s.id };
};
export const withRun = async (w: World) => {
  const { scenarioId } = await withScenario(w);
  const run = await scoped(createRun)(matrix.db, w.users.planner, w.basinId, scenarioId, "model");
  await processRun(matrix.db, run.id);
  return { scenarioId, runId: run.id };
};
export const scenarioOf = (w: World, p: Record<string, string>) => ({ basinId: w.basinId, scenarioId: p.scenarioId });
export const planOf = (w: World, p: Record<string, string>) => ({ basinId: w.basinId, planId: p.planId });
export const threadOf = (w: World, p: Record<string, string>) => ({ basinId: w.basinId, threadId: p.planThreadId });
export const plan = (stage: PlanStage) => async (w: World) => {
  const p = await planAt(matrix.db, w, stage);
  return { planId: p.planId, planThreadId: p.planThreadId };
};
export const withAllocationRun = async (w: World) => {
  const { scenarioId } = await withScenario(w);
  const run = await scoped(createRun)(matrix.db, w.users.planner, w.basinId, scenarioId, "allocation");
  await processRun(matrix.db, run.id);
  return { runId: run.id };
};
export const lead = (ok: number) => denied({ lead: ok });
export const period = () => ({
  startsAt: new Date(Date.now() - 60_000).toISOString(),
  endsAt: new Date(Date.now() + 31 * 86_400_000).toISOString(),
  timeZone: "Europe/Dublin",
});
export const runOf = (w: World, p: Record<string, string>) => ({ basinId: w.basinId, runId: p.runId });
export const draftOf = (p: Record<string, string>) => ({
  reachImportId: p.reachImportId,
  reachMapping: DEMO_REACH_MAPPING,
  dischargerImportId: p.dischargerImportId,
  dischargerMapping: DEMO_DISCHARGER_MAPPING,
});
export const uniq = () => Math.random().toString(36).slice(2, 8);

