import { z } from "zod";
import { FIT_PARAMETERS } from "@/lib/domain/calibration";
import { ALLOCATION_OBJECTIVES, DEFAULT_KA_METHOD, DESIGN_FLOW_NAMES, DEFAULT_OBJECTIVE, DEFAULT_THETA_RULE, KA_METHODS, THETA_RULES } from "@/lib/domain";
import { SCENARIO_FIELD_LABELS as L } from "@/lib/format/labels";

// Messages name the field by the label the editor shows (SCENARIO_FIELD_LABELS), with its unit.
const rate = (what: string, max = 20, unit = "1/d") =>
  z.number({ message: `${what} must be a number` }).min(0, `${what} cannot be negative`).max(max, `${what} must be at most ${max} ${unit}`);
const conc = (what: string, max = 100_000) =>
  z.number({ message: `${what} must be a number` }).min(0, `${what} cannot be negative`).max(max, `${what} must be at most ${max} mg/L`);
const temperature = (what: string) =>
  z.number({ message: `${what} must be a number` }).min(0, `${what} must be at least 0 °C (32 °F)`).max(45, `${what} must be at most 45 °C (113 °F)`);
const share = (what: string) =>
  z.number({ message: `${what} must be a number` }).min(0, `${what} cannot be negative`).max(0.9, `${what} must be at most 0.9 (90 % of the capacity)`);

/**
 * What a condition's design flow was taken from, filled in by Sagline when the scenario is
 * saved (lib/services/scenarios.ts) from the gauge record as it is then; anything a client
 * sends here is replaced. It travels with the scenario's inputs into runs and plans.
 */
export const gaugeFlowSourceSchema = z.object({
  valueM3s: z.number().positive(),
  gaugeName: z.string(),
  stationCode: z.string().nullable(),
  reachId: z.string(),
  sha256: z.string(),
  firstDay: z.string(),
  lastDay: z.string(),
  yearsUsed: z.number().int(),
  /**
   * With `headwaters: "drainage-area"`: each headwater's inflow, the statistic carried by the
   * drainage-area ratio (lib/hydrology/transfer.ts), and the headwaters that had no area and
   * were scaled instead.
   */
  transfers: z
    .object({
      gaugeAreaKm2: z.number().positive(),
      exponent: z.number().positive(),
      headwaters: z.array(z.object({ reach: z.string(), areaKm2: z.number().positive(), ratio: z.number().positive(), flowM3s: z.number().nonnegative(), rule: z.string() })),
      scaled: z.array(z.string()),
    })
    .optional(),
});
export type GaugeFlowSource = z.infer<typeof gaugeFlowSourceSchema>;

/** A condition's design flow from a gauge's statistic: every reach's network design flow scaled so the gauge's reach carries it. */
export const gaugeFlowSchema = z.object({
  gaugeId: z.uuid("Choose a gauge record"),
  statistic: z.enum(DESIGN_FLOW_NAMES, { message: `The statistic must be one of ${DESIGN_FLOW_NAMES.join(", ")}` }),
  /**
   * How the statistic reaches the headwaters: every reach's network design flow scaled so the
   * gauge's reach carries it ("scaled"), or each headwater with a drainage area given the
   * statistic × (its area / the gauge reach's area)^exponent ("drainage-area"; the other
   * inflows scaled as before).
   */
  headwaters: z.enum(["scaled", "drainage-area"], { message: 'headwaters must be "scaled" or "drainage-area"' }).default("scaled"),
  areaExponent: z.number({ message: "The drainage-area exponent must be a number" }).gt(0, "The drainage-area exponent must be above 0").max(2, "The drainage-area exponent must be at most 2").default(1),
  source: gaugeFlowSourceSchema.optional(),
});

/**
 * Where a scenario's fitted coefficients came from: a finished calibration run, filled in by
 * Sagline when the scenario is saved (lib/services/scenarios.ts); anything a client sends here
 * is replaced. It travels with the scenario's inputs into runs and plans.
 */
export const fittedKineticsSourceSchema = z.object({
  /** The planner's name for the fitted set, when the calibration was given one. */
  name: z.string().nullable().default(null),
  surveyName: z.string(),
  surveySha256: z.string(),
  surveyFirstTime: z.string().nullable(),
  condition: z.string(),
  finishedAt: z.string(),
  rmseMgL: z.number(),
  biasMgL: z.number(),
  nse: z.number().nullable(),
  samples: z.number().int(),
  parameters: z.array(z.object({ parameter: z.enum(FIT_PARAMETERS), reaches: z.array(z.string()), value: z.number(), stdError: z.number().nullable() })),
  /** The fitted model against a second survey, when the calibration was checked against one. */
  validation: z.object({ surveyName: z.string(), rmseMgL: z.number(), biasMgL: z.number(), nse: z.number().nullable(), samples: z.number().int() }).nullable(),
});
export type FittedKineticsSource = z.infer<typeof fittedKineticsSourceSchema>;

/** Coefficients fitted in a calibration run, used by the scenario on the reaches they were fitted over. */
export const fittedKineticsSchema = z.object({
  runId: z.uuid("Choose a finished calibration"),
  source: fittedKineticsSourceSchema.optional(),
});

/** What a condition's design temperature was worked out from, filled in by Sagline at save (anything a client sends here is replaced). */
export const temperatureFromSourceSchema = z.object({
  valueC: z.number(),
  recordName: z.string(),
  stationCode: z.string().nullable(),
  sha256: z.string(),
  /** The rule in words, with the days used (lib/hydrology/design-temperature.ts). */
  rule: z.string(),
  daysUsed: z.number().int(),
  daysMissing: z.number().int(),
});
export type TemperatureFromSource = z.infer<typeof temperatureFromSourceSchema>;

/** A condition's design temperature from a daily water-temperature record. */
export const temperatureFromSchema = z.object({
  recordId: z.uuid("Choose a temperature record"),
  percentile: z.number({ message: "The percentile must be a number" }).min(50, "The percentile must be at least 50").max(100, "The percentile must be at most 100").default(90),
  months: z
    .array(z.number().int().min(1).max(12), { message: "Months are numbers 1–12" })
    .min(1, "Choose at least one month")
    .max(12)
    .refine((m) => new Set(m).size === m.length, "Each month once")
    .default([6, 7, 8, 9]),
  source: temperatureFromSourceSchema.optional(),
});

/** One critical (design) condition: flows and temperature the river is checked at. */
export const conditionSchema = z.object({
  name: z.string().trim().min(1, "Give the condition a name").max(80, `${L.conditionName} must be at most 80 characters`),
  /** Multiplier on every reach's design flow from the network (1 = the imported low flow). */
  flowScale: z.number({ message: `${L.flowScale} must be a number` }).positive(`${L.flowScale} must be above zero`).max(100, `${L.flowScale} must be at most 100 times the design flow`).default(1),
  /**
   * Design flow at the outlet (m³/s; the sum over outlet reaches where there are several).
   * When given it sets the scale instead of flowScale: every reach's network design flow
   * times outletFlowM3s / the network's own outlet flow. null = use flowScale.
   */
  outletFlowM3s: z
    .number({ message: `${L.outletFlow} must be a number` })
    .positive(`${L.outletFlow} must be above zero`)
    .max(100_000, `${L.outletFlow} must be at most 100 000 m³/s`)
    .nullable()
    .default(null),
  /**
   * Design flow from a gauge record's statistic (e.g. its 7Q10). When given it sets the scale
   * instead of flowScale: every reach's network design flow times the statistic / the network's
   * design flow at the gauge's reach. null = use flowScale (or outletFlowM3s).
   */
  gaugeFlow: gaugeFlowSchema.nullable().default(null),
  /** Design flow entered per reach (m³/s), overriding the network's value. */
  reachFlowsM3s: z
    .record(z.string(), z.number({ message: `${L.designFlow} must be a number` }).positive(`${L.designFlow} must be above zero`).max(100_000, `${L.designFlow} must be at most 100 000 m³/s`).nullable())
    .default({}),
  /** One design temperature for every reach (°C); null keeps each reach's own. */
  temperatureC: temperature(L.designTemperature).nullable().default(null),
  /**
   * The design temperature from a water-temperature record by a stated rule (a percentile of
   * the daily means in chosen months). When given, temperatureC is set from it when the
   * scenario is saved. null = temperatureC as entered.
   */
  temperatureFrom: temperatureFromSchema.nullable().default(null),
});
export type ConditionInputs = z.infer<typeof conditionSchema>;

export const kineticsSchema = z.object({
  kd20PerDay: rate(L.kd, 5).default(0.3),
  kaMethod: z.enum(KA_METHODS).default(DEFAULT_KA_METHOD),
  kaFloor: z.boolean().default(false),
  ks20PerDay: rate(L.ks, 5).default(0),
  sod20GPerM2Day: rate(L.sod, 50, "g O₂/m²/d").default(0),
  kn20PerDay: rate(L.kn, 5).default(0),
  thetaRule: z.enum(THETA_RULES).default(DEFAULT_THETA_RULE),
});

/** Per-reach kinetics for this scenario; missing or null keeps the network's value or the scenario default. */
export const reachOverrideSchema = z
  .object({
    kd20PerDay: rate(L.kd, 5).nullable(),
    kaMethod: z.enum(KA_METHODS).nullable(),
    ka20PerDay: rate(L.ka, 200).nullable(),
    ks20PerDay: rate(L.ks, 5).nullable(),
    sod20GPerM2Day: rate(L.sod, 50, "g O₂/m²/d").nullable(),
    kn20PerDay: rate(L.kn, 5).nullable(),
  })
  .partial();

export const waterQualitySchema = z.object({
  cbodUMgL: conc(L.headwaterCbodu, 1000).default(2),
  nbodUMgL: conc(L.headwaterNbodu, 1000).default(0),
  /**
   * null = a share of saturation at each inflow's own temperature and elevation
   * (DEFAULT_HEADWATER_DO_SHARE in lib/scenarios/design-defaults). Scenarios saved before
   * this was the default hold the 7.5 mg/L they were given, and keep it.
   */
  doMgL: conc(L.headwaterDo, 20).nullable().default(null),
  /** Used when neither the condition nor the reach sets a temperature. */
  temperatureC: temperature("Temperature if none set").default(20),
});

/** Per-discharger values for this scenario; missing or null keeps the network's value. */
/** Quality of the natural water entering one reach's head (headwater or tributary); null keeps the scenario default. */
export const inflowOverrideSchema = z
  .object({
    cbodUMgL: conc(L.headwaterCbodu, 1000).nullable(),
    nbodUMgL: conc(L.headwaterNbodu, 1000).nullable(),
    doMgL: conc(L.headwaterDo, 20).nullable(),
  })
  .partial();

export const dischargerOverrideSchema = z
  .object({
    designFlowM3s: z.number({ message: `${L.designFlow} must be a number` }).positive(`${L.designFlow} must be above zero`).max(1000, `${L.designFlow} must be at most 1000 m³/s`).nullable(),
    bod5MgL: conc(L.effluentBod5).nullable(),
    cbodUMgL: conc(L.effluentCbodu).nullable(),
    bottleKPerDay: z.number({ message: `${L.bottleRate} must be a number` }).positive(`${L.bottleRate} must be above zero`).max(5, `${L.bottleRate} must be at most 5 1/d`).nullable(),
    doMgL: conc(L.effluentDo, 20).nullable(),
    temperatureC: temperature(L.effluentTemperature).nullable(),
  })
  .partial();

export const allocationSettingsSchema = z.object({
  objective: z.enum(ALLOCATION_OBJECTIVES).default(DEFAULT_OBJECTIVE),
  /** Technology floor as effluent BOD5 at design flow (e.g. 30 mg/L secondary treatment); null = none. */
  floorBod5MgL: conc(L.floorBod5, 1000).nullable().default(30),
  mosDoMgL: z
    .number({ message: `${L.mosDo} must be a number` })
    .min(0, `${L.mosDo} cannot be negative`)
    .max(5, `${L.mosDo} must be at most 5 mg/L: a larger margin leaves nothing to allocate`)
    .default(0),
  mosFraction: share(L.mosFraction).default(0),
  reserveFraction: share(L.reserveFraction).default(0),
});

/** Everything a scenario adds to a network version to make model files. */
export const scenarioInputsSchema = z
  .object({
    /** null = the basin's criterion. */
    criterionDoMgL: z
      .number({ message: `${L.criterion} must be a number` })
      .gt(0, `${L.criterion} must be above 0 mg/L`)
      .lt(20, `${L.criterion} must be below 20 mg/L`)
      .nullable()
      .default(null),
    stepKm: z
      .number({ message: `${L.stepKm} must be a number` })
      .min(0.05, `${L.stepKm} must be at least 0.05 km (50 m)`)
      .max(10, `${L.stepKm} must be at most 10 km`)
      .default(0.5),
    conditions: z.array(conditionSchema).min(1, "Give at least one critical condition").max(6, "A scenario holds at most 6 critical conditions"),
    kinetics: kineticsSchema.default(kineticsSchema.parse({})),
    /** Coefficients fitted to a survey (a calibration run); they replace the reach values above on the reaches they were fitted over. */
    fittedKinetics: fittedKineticsSchema.nullable().default(null),
    reachOverrides: z.record(z.string(), reachOverrideSchema).default({}),
    headwater: waterQualitySchema.default(waterQualitySchema.parse({})),
    inflowOverrides: z.record(z.string(), inflowOverrideSchema).default({}),
    dischargers: z.record(z.string(), dischargerOverrideSchema).default({}),
    allocation: allocationSettingsSchema.default(allocationSettingsSchema.parse({})),
  })
  .refine((v) => new Set(v.conditions.map((c) => c.name)).size === v.conditions.length, {
    message: "Each critical condition needs its own name",
    path: ["conditions"],
  })
  .superRefine((v, ctx) => {
    v.conditions.forEach((c, i) => {
      if (c.gaugeFlow && c.outletFlowM3s !== null) {
        ctx.addIssue({ code: "custom", path: ["conditions", i, "gaugeFlow"], message: "Take the design flow from a gauge or give it at the outlet, not both" });
      }
    });
  });
export type ScenarioInputs = z.infer<typeof scenarioInputsSchema>;

export const scenarioCreateSchema = z.object({
  name: z.string().trim().min(1, "Give the scenario a name").max(120, `${L.scenarioName} must be at most 120 characters`),
  description: z.string().trim().max(2000).default(""),
  /** Network version; omitted = the newest. */
  networkId: z.uuid(`${L.network} must be one of the basin's network versions`).optional(),
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

/** A run a scenario's Run buttons start (a calibration has its own request: lib/validation/calibration.ts). */
export const runCreateSchema = z.object({ kind: z.enum(["model", "allocation"]) });

export const scenarioDuplicateSchema = z.object({ name: z.string().trim().min(1).max(120) });
