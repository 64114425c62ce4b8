import { z } from "zod";
import type { AllocationResult } from "@/lib/model/allocation/types";
import type { RunResult } from "@/lib/model/network/run";
import type { ModelFile } from "@/lib/model/types";
import { modelFileSchema } from "@/lib/validation/model-file";
import { scenarioInputsSchema, type ScenarioInputs } from "@/lib/validation/scenario";

/**
 * The frozen record a plan keeps of what its run used and produced. A published plan can
 * never be changed, so every reader (pages, PDF, exports, e-mails) reads it through
 * `readPlanSnapshot`, which checks the stored JSON against this schema and returns it as
 * stored — nothing is filled in or rewritten. A change to what runs store must keep every
 * earlier shape readable: add a version here (and a fixture in tests/fixtures/plans/)
 * rather than change one. Objects are loose: fields added later travel along untouched.
 *
 * Versions: 1 — every snapshot written up to and including 3 Dec 2026 (they carry no
 * `snapshotVersion`): allocation runs stored either one condition (the model file's own,
 * its binding checkpoints named "base") or every condition; lib/results/run-conditions.ts
 * reads both.
 */
export const PLAN_SNAPSHOT_VERSION = 1;

const num = z.number();
const point = z.looseObject({ km: num, do_mg_l: num });

const runResultSchema = z.looseObject({
  reaches: z.array(
    z.looseObject({
      id: z.string(),
      points: z.array(point),
      critical: z.looseObject({ km: num, do_mg_l: num }),
      anoxic: z.boolean(),
      segments: z.array(z.looseObject({ km_start: num, km_end: num, ka_method: z.string() })),
    }),
  ),
  minimum: z.looseObject({ reach: z.string(), km: num, do_mg_l: num }),
  criterion_do_mg_l: num,
  below_criterion: z.array(z.looseObject({ reach: z.string(), km: num, do_mg_l: num })),
  kinetics: z.looseObject({ deoxygenation_rule: z.enum(["constant", "piecewise"]) }),
});

const allocationSchema = z.looseObject({
  feasible: z.boolean(),
  objective: z.string(),
  objective_value: num.nullable(),
  objective_units: z.string(),
  allocations: z.array(
    z.looseObject({
      id: z.string(),
      cbodu_kg_day: num,
      bod5_kg_day: num,
      bod5_mg_l: num,
      cbodu_mg_l: num,
      today_cbodu_kg_day: num,
      reduction_pct: num.nullable(),
      min_kg_day: num,
      max_kg_day: num,
    }),
  ),
  binding: z.array(z.looseObject({ condition: z.string(), reach: z.string(), km: num, do_mg_l: num })),
  tmdl: z.looseObject({}).nullable(),
  diagnosis: z.array(z.looseObject({ condition: z.string(), reach: z.string(), km: num })).optional(),
  conditions: z.array(z.string()),
});

/** A stored model file: checked against the model-file contract, kept as stored. */
const storedModelFile = z.unknown().superRefine((value, ctx) => {
  const parsed = modelFileSchema.safeParse(value);
  if (!parsed.success) for (const issue of parsed.error.issues) ctx.addIssue({ code: "custom", message: issue.message, path: issue.path });
});

const snapshotV1 = z.looseObject({
  snapshotVersion: z.literal(1).optional(),
  run: z.looseObject({
    id: z.string(),
    kind: z.literal("allocation"),
    scenarioName: z.string(),
    scenarioVersion: num,
    modelVersion: z.string(),
    inputsHash: z.string(),
    methods: z.record(z.string(), z.unknown()),
    finishedAt: z.string().nullable(),
    modelFiles: z.array(z.looseObject({ name: z.string(), file: storedModelFile })).min(1),
    result: z.looseObject({
      warnings: z.array(z.string()),
      conditions: z.array(z.looseObject({ name: z.string(), run: runResultSchema })).min(1),
      allocation: allocationSchema,
    }),
  }),
  scenario: z.looseObject({
    id: z.string(),
    name: z.string(),
    version: num,
    networkId: z.string(),
    inputs: z.unknown().superRefine((value, ctx) => {
      const parsed = scenarioInputsSchema.safeParse(value);
      if (!parsed.success) for (const issue of parsed.error.issues) ctx.addIssue({ code: "custom", message: issue.message, path: issue.path });
    }),
  }),
});

/** A plan's snapshot as every reader sees it (the model's own types for the run's parts). */
export type PlanSnapshot = {
  snapshotVersion?: 1;
  run: {
    id: string;
    kind: "allocation";
    scenarioName: string;
    scenarioVersion: number;
    modelVersion: string;
    inputsHash: string;
    methods: Record<string, unknown>;
    finishedAt: string | null;
    modelFiles: { name: string; file: ModelFile }[];
    result: { warnings: string[]; conditions: { name: string; run: RunResult }[]; allocation: AllocationResult };
    [key: string]: unknown;
  };
  scenario: { id: string; name: string; version: number; networkId: string; inputs: ScenarioInputs };
};

/** A stored snapshot that no version of the schema reads: the plan cannot be shown honestly. */
export class PlanSnapshotError extends Error {
  constructor(
    readonly planId: string,
    readonly issues: { path: string; message: string }[],
  ) {
    super(`Plan ${planId}: its stored snapshot does not match any known version (${issues.slice(0, 3).map((i) => `${i.path}: ${i.message}`).join("; ")})`);
    this.name = "PlanSnapshotError";
  }
}

/**
 * The stored snapshot of plan `planId`, checked and returned exactly as stored. Throws
 * PlanSnapshotError naming the fields at fault when it matches no known version.
 */
export function readPlanSnapshot(planId: string, stored: unknown): PlanSnapshot {
  const parsed = snapshotV1.safeParse(stored);
  if (!parsed.success) throw new PlanSnapshotError(planId, parsed.error.issues.map((i) => ({ path: i.path.join("."), message: i.message })));
  return stored as PlanSnapshot;
}
