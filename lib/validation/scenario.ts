import { z } from "zod";

const KA_METHODS = ["given", "oconnor-dobbins", "churchill", "owens-gibbs", "tsivoglou-neal", "depth-velocity"] as const;
export const OBJECTIVES = ["max-total", "min-removal", "equal-percent", "equal-concentration", "max-min-share"] as const;

const rate = (what: string, max = 20) =>
  z.number({ message: `${what} must be a number` }).min(0, `${what} cannot be negative`).max(max, `${what} must be at most ${max}`);
const conc = (what: string, max = 100_000) =>
  z.number({ message: `${what} must be a number` }).min(0, `${what} cannot be negative`).max(max, `${what} must be at most ${max}`);
const temperature = z.number({ message: "temperature must be a number" }).min(0, "temperature must be at least 0 °C").max(45, "temperature must be at most 45 °C");

/** One critical (design) condition: flows and temperature the river is checked at. */
export const conditionSchema = z.object({
  name: z.string().trim().min(1, "Give the condition a name").max(80),
  /** Multiplier on every reach's design flow from the network (1 = the imported low flow). */
  flowScale: z.number().positive("flow scale must be above zero").max(100).default(1),
  /** Design flow entered per reach (m³/s), overriding the network's value. */
  reachFlowsM3s: z.record(z.string(), z.number().positive("design flow must be above zero").max(100_000).nullable()).default({}),
  /** One design temperature for every reach (°C); null keeps each reach's own. */
  temperatureC: temperature.nullable().default(null),
});
export type ConditionInputs = z.infer<typeof conditionSchema>;

export const kineticsSchema = z.object({
  kd20PerDay: rate("k_d", 5).default(0.3),
  kaMethod: z.enum(KA_METHODS).default("depth-velocity"),
  kaFloor: z.boolean().default(false),
  ks20PerDay: rate("k_s", 5).default(0),
  sod20GPerM2Day: rate("SOD", 50).default(0),
  kn20PerDay: rate("k_n", 5).default(0),
  thetaRule: z.enum(["constant", "piecewise"]).default("constant"),
});

/** Per-reach kinetics for this scenario; missing or null keeps the network's value or the scenario default. */
export const reachOverrideSchema = z
  .object({
    kd20PerDay: rate("k_d", 5).nullable(),
    kaMethod: z.enum(KA_METHODS).nullable(),
    ka20PerDay: rate("k_a", 200).nullable(),
    ks20PerDay: rate("k_s", 5).nullable(),
    sod20GPerM2Day: rate("SOD", 50).nullable(),
    kn20PerDay: rate("k_n", 5).nullable(),
  })
  .partial();

export const waterQualitySchema = z.object({
  cbodUMgL: conc("CBODu", 1000).default(2),
  nbodUMgL: conc("NBODu", 1000).default(0),
  doMgL: conc("DO", 20).default(7.5),
  /** Used when neither the condition nor the reach sets a temperature. */
  temperatureC: temperature.default(20),
});

/** Per-discharger values for this scenario; missing or null keeps the network's value. */
/** Quality of the natural water entering one reach's head (headwater or tributary); null keeps the scenario default. */
export const inflowOverrideSchema = z
  .object({
    cbodUMgL: conc("CBODu", 1000).nullable(),
    nbodUMgL: conc("NBODu", 1000).nullable(),
    doMgL: conc("DO", 20).nullable(),
  })
  .partial();

export const dischargerOverrideSchema = z
  .object({
    designFlowM3s: z.number().positive("design flow must be above zero").max(1000).nullable(),
    bod5MgL: conc("BOD5").nullable(),
    cbodUMgL: conc("CBODu").nullable(),
    bottleKPerDay: z.number().positive("bottle rate must be above zero").max(5).nullable(),
    doMgL: conc("DO", 20).nullable(),
    temperatureC: temperature.nullable(),
  })
  .partial();

export const allocationSettingsSchema = z.object({
  objective: z.enum(OBJECTIVES).default("max-total"),
  /** Technology floor as effluent BOD5 at design flow (e.g. 30 mg/L secondary treatment); null = none. */
  floorBod5MgL: conc("floor BOD5", 1000).nullable().default(30),
  mosDoMgL: z.number().min(0, "MOS cannot be negative").max(5, "a DO margin above 5 mg/L leaves nothing to allocate").default(0),
  mosFraction: z.number().min(0).max(0.9, "MOS fraction must be below 0.9").default(0),
  reserveFraction: z.number().min(0).max(0.9, "reserve fraction must be below 0.9").default(0),
});

/** Everything a scenario adds to a network version to make model files. */
export const scenarioInputsSchema = z
  .object({
    /** null = the basin's criterion. */
    criterionDoMgL: z.number().gt(0, "criterion must be above 0 mg/L").lt(20, "criterion must be below 20 mg/L").nullable().default(null),
    stepKm: z.number().min(0.05, "profile spacing must be at least 0.05 km").max(10).default(0.5),
    conditions: z.array(conditionSchema).min(1, "Give at least one critical condition").max(6),
    kinetics: kineticsSchema.default(kineticsSchema.parse({})),
    reachOverrides: z.record(z.string(), reachOverrideSchema).default({}),
    headwater: waterQualitySchema.default(waterQualitySchema.parse({})),
    inflowOverrides: z.record(z.string(), inflowOverrideSchema).default({}),
    dischargers: z.record(z.string(), dischargerOverrideSchema).default({}),
    allocation: allocationSettingsSchema.default(allocationSettingsSchema.parse({})),
  })
  .refine((v) => new Set(v.conditions.map((c) => c.name)).size === v.conditions.length, {
    message: "condition names must be unique",
    path: ["conditions"],
  });
export type ScenarioInputs = z.infer<typeof scenarioInputsSchema>;

export const scenarioCreateSchema = z.object({
  name: z.string().trim().min(1, "Give the scenario a name").max(120),
  description: z.string().trim().max(2000).default(""),
  /** Network version; omitted = the newest. */
  networkId: z.uuid("networkId must be a network id").optional(),
  inputs: scenarioInputsSchema,
});
export type ScenarioCreate = z.infer<typeof scenarioCreateSchema>;

export const scenarioUpdateSchema = z.object({
  /** The version the edit started from; a stale version gets 409. */
  version: z.number().int().positive(),
  name: z.string().trim().min(1).max(120).optional(),
  description: z.string().trim().max(2000).optional(),
  inputs: scenarioInputsSchema.optional(),
});
export type ScenarioUpdate = z.infer<typeof scenarioUpdateSchema>;

export const runCreateSchema = z.object({ kind: z.enum(["model", "allocation"]) });
export type RunCreate = z.infer<typeof runCreateSchema>;

export const scenarioDuplicateSchema = z.object({ name: z.string().trim().min(1).max(120) });
