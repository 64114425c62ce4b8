import { describe, expect, it } from "vitest";
import type { z } from "zod";
import {
  ALLOCATION_OBJECTIVES,
  BASIN_ROLES,
  DEPTH_VELOCITY_FORMULAS,
  IMPORT_DEFAULTS,
  IMPORT_LAYERS,
  KA_FORMULAS,
  KA_METHODS,
  LOAD_OBJECTIVES,
  OBJECTIVE_NAMES,
  ONE_RULE_OBJECTIVES,
  PLAN_STATUSES,
  PLAN_STATUS_NAMES,
  REAERATION_NAMES,
  ROLE_GROUP_NAMES,
  ROLE_NAMES,
  RUN_KINDS,
  RUN_KIND_NAMES,
  RUN_STATUSES,
  RUN_STATUS_NAMES,
  THETA_RULES,
  THETA_RULE_NAMES,
  THREAD_STATUSES,
  THREAD_STATUS_NAMES,
  UNIT_SYSTEMS,
  UNIT_SYSTEM_NAMES,
  UNIT_SYSTEM_UNITS,
} from "@/lib/domain";
import { BASIN_ROLES as PERMISSION_ROLES, ROLE_PERMISSIONS } from "@/lib/auth/permissions";
import * as labels from "@/lib/format/labels";
import { readShapefileZip, validateImport } from "@/geo";
import { DEMO_REACH_MAPPING } from "@/db/seed/demo-gis";
import { UNITS as OBJECTIVE_UNITS } from "@/lib/model/allocation/report";
import { selectByDepthVelocity } from "@/lib/model/reaeration";
import { unitSystemSchema } from "@/lib/validation/basin";
import { basinRoleSchema } from "@/lib/validation/member";
import { allocationSchema, kaMethodSchema, kineticsSchema as fileKineticsSchema } from "@/lib/validation/model-file";
import { importLayerSchema, networkDraftSchema, networkOptionsSchema } from "@/lib/validation/network";
import { fixtureBytes } from "../geo/helpers";
import { allocationSettingsSchema, kineticsSchema, reachOverrideSchema, runCreateSchema } from "@/lib/validation/scenario";

const sorted = (xs: readonly string[]) => [...xs].sort();

/** What a schema accepts, probed value by value: every tuple value, and nothing else that looks like one. */
function accepts(schema: z.ZodType, tuple: readonly string[]) {
  for (const v of tuple) expect(schema.safeParse(v).success, `${v} is accepted`).toBe(true);
  for (const v of ["", "other", ...tuple.map((t) => t.toUpperCase()).filter((t) => !tuple.includes(t)), ...tuple.map((t) => `${t} `)]) {
    expect(schema.safeParse(v).success, `${JSON.stringify(v)} is refused`).toBe(false);
  }
}

describe("the zod enums accept exactly the domain tuples", () => {
  it("roles, unit systems, import layers", () => {
    expect(basinRoleSchema.options).toEqual([...BASIN_ROLES]);
    accepts(basinRoleSchema, BASIN_ROLES);
    expect(unitSystemSchema.options).toEqual([...UNIT_SYSTEMS]);
    accepts(unitSystemSchema, UNIT_SYSTEMS);
    expect(importLayerSchema.options).toEqual([...IMPORT_LAYERS]);
    accepts(importLayerSchema, IMPORT_LAYERS);
  });

  it("reaeration methods in the model file and in a scenario (scenario-wide and per reach)", () => {
    expect(kaMethodSchema.options).toEqual([...KA_METHODS]);
    accepts(kaMethodSchema, KA_METHODS);
    accepts(kineticsSchema.shape.kaMethod.unwrap(), KA_METHODS);
    accepts(reachOverrideSchema.shape.kaMethod.unwrap().unwrap(), KA_METHODS);
  });

  it("allocation objectives in the model file and in a scenario", () => {
    accepts(allocationSchema.shape.objective, ALLOCATION_OBJECTIVES);
    accepts(allocationSettingsSchema.shape.objective.unwrap(), ALLOCATION_OBJECTIVES);
  });

  it("deoxygenation temperature rules in the model file and in a scenario", () => {
    accepts(fileKineticsSchema.shape.deoxygenation_rule.unwrap(), THETA_RULES);
    accepts(kineticsSchema.shape.thetaRule.unwrap(), THETA_RULES);
  });

  it("run kinds", () => {
    // a scenario's Run buttons start model and allocation runs; a calibration has its own request (calibrationRunSchema)
    for (const kind of RUN_KINDS.filter((k) => k !== "calibration")) expect(runCreateSchema.parse({ kind }).kind).toBe(kind);
    expect(runCreateSchema.safeParse({ kind: "calibration" }).success).toBe(false);
    expect(runCreateSchema.safeParse({ kind: "optimise" }).success).toBe(false);
  });

  it("the scenario's defaults are domain values", () => {
    const k = kineticsSchema.parse({});
    expect(KA_METHODS).toContain(k.kaMethod);
    expect(THETA_RULES).toContain(k.thetaRule);
    expect(ALLOCATION_OBJECTIVES).toContain(allocationSettingsSchema.parse({}).objective);
  });
});

describe("every domain value has a display name, and every name a value", () => {
  const tables: Array<[string, readonly string[], Readonly<Record<string, string>>]> = [
    ["roles", BASIN_ROLES, ROLE_GROUP_NAMES],
    ["reaeration methods", KA_METHODS, REAERATION_NAMES],
    ["objectives", ALLOCATION_OBJECTIVES, OBJECTIVE_NAMES],
    ["temperature rules", THETA_RULES, THETA_RULE_NAMES],
    ["run kinds", RUN_KINDS, RUN_KIND_NAMES],
    ["run states", RUN_STATUSES, RUN_STATUS_NAMES],
    ["plan states", PLAN_STATUSES, PLAN_STATUS_NAMES],
    ["thread states", THREAD_STATUSES, THREAD_STATUS_NAMES],
    ["unit systems", UNIT_SYSTEMS, UNIT_SYSTEM_NAMES],
    ["unit systems' units", UNIT_SYSTEMS, UNIT_SYSTEM_UNITS],
    ["objective units (model)", ALLOCATION_OBJECTIVES, OBJECTIVE_UNITS],
  ];
  it.each(tables)("%s", (_, tuple, names) => {
    expect(sorted(Object.keys(names))).toEqual(sorted(tuple));
    for (const v of tuple) expect(names[v].trim(), v).not.toBe("");
  });

  it("role names cover every role and the site administrator", () => {
    expect(sorted(Object.keys(ROLE_NAMES))).toEqual(sorted([...BASIN_ROLES, "admin"]));
    for (const r of BASIN_ROLES) expect(ROLE_NAMES[r], r).not.toBe(r);
  });

  it("names read as words, not as the stored code (SI is its own name)", () => {
    for (const [tuple, names] of [
      [KA_METHODS, REAERATION_NAMES],
      [ALLOCATION_OBJECTIVES, OBJECTIVE_NAMES],
      [RUN_STATUSES, RUN_STATUS_NAMES],
    ] as const) {
      for (const v of tuple) expect((names as Record<string, string>)[v], v).not.toBe(v);
    }
    expect(UNIT_SYSTEM_NAMES.US).toBe("US customary");
  });

  it("lib/format/labels reads the same tables, not copies", () => {
    expect(labels.OBJECTIVE_NAMES).toBe(OBJECTIVE_NAMES);
    expect(labels.REAERATION_NAMES).toBe(REAERATION_NAMES);
    expect(labels.THETA_RULE_NAMES).toBe(THETA_RULE_NAMES);
    expect(labels.ROLE_NAMES).toBe(ROLE_NAMES);
    expect(labels.RUN_STATUS_NAMES).toBe(RUN_STATUS_NAMES);
    expect(labels.PLAN_STATUS_NAMES).toBe(PLAN_STATUS_NAMES);
  });
});

describe("subsets and tables derived from the tuples", () => {
  it("a formula is a method, and depth–velocity chooses among formulas", () => {
    expect(KA_METHODS.filter((m) => m !== "depth-velocity")).toEqual([...KA_FORMULAS]);
    for (const f of DEPTH_VELOCITY_FORMULAS) expect(KA_FORMULAS).toContain(f);
    // shallow (Owens–Gibbs), deep and slow (O'Connor–Dobbins), deep and fast (Churchill): each lands in the subset
    const chosen = new Set([selectByDepthVelocity(0.3, 0.4), selectByDepthVelocity(0.3, 1.2), selectByDepthVelocity(1.5, 1.5)]);
    expect(sorted([...chosen])).toEqual(sorted(DEPTH_VELOCITY_FORMULAS));
  });

  it("load objectives and one-rule objectives are disjoint objectives", () => {
    for (const o of [...LOAD_OBJECTIVES, ...ONE_RULE_OBJECTIVES]) expect(ALLOCATION_OBJECTIVES).toContain(o);
    expect(LOAD_OBJECTIVES.filter((o) => (ONE_RULE_OBJECTIVES as readonly string[]).includes(o))).toEqual([]);
  });

  it("the permission table has a row for every role, read from the same tuple", () => {
    expect(PERMISSION_ROLES).toBe(BASIN_ROLES);
    expect(sorted(Object.keys(ROLE_PERMISSIONS))).toEqual(sorted(BASIN_ROLES));
  });
});

describe("import defaults", () => {
  it("the API's option defaults are IMPORT_DEFAULTS, with or without an options object", () => {
    expect(networkOptionsSchema.parse({})).toEqual(IMPORT_DEFAULTS);
    const draft = networkDraftSchema.parse({
      reachImportId: "00000000-0000-4000-8000-000000000001",
      reachMapping: { reachId: "ID" },
    });
    expect(draft.options).toEqual(IMPORT_DEFAULTS);
  });

  it("each parse gets its own copy, so a caller changing one cannot change the defaults", () => {
    const a = networkOptionsSchema.parse({});
    a.toleranceM = 99;
    expect(IMPORT_DEFAULTS.toleranceM).toBe(5);
    expect(networkOptionsSchema.parse({}).toleranceM).toBe(5);
  });
});

describe("the pure import validation uses the same defaults when given no options", () => {
  it("reports the tolerance and snapping distance it used", async () => {
    const reaches = await readShapefileZip(fixtureBytes("demo/tamsel-reaches.zip"));
    const { network } = validateImport({ reaches, reachMapping: DEMO_REACH_MAPPING });
    expect(network.toleranceM).toBe(IMPORT_DEFAULTS.toleranceM);
    expect(network.maxSnapDistanceM).toBe(IMPORT_DEFAULTS.maxSnapDistanceM);
  });
});
