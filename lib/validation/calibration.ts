import { z } from "zod";
import { FIT_PARAMETERS } from "@/lib/calibration/calibrate";

const finite = (what: string) => z.number({ message: `${what} must be a number` }).refine(Number.isFinite, `${what} must be a finite number`);

/** One observation of a synoptic survey, placed by reach and km from the reach's head. */
export const observationSchema = z.strictObject({
  station: z.string().trim().min(1).max(80).optional(),
  reach: z.string({ message: "reach must name a reach" }).min(1, "reach must name a reach"),
  km: finite("km").refine((k) => k >= 0, "km cannot be negative"),
  do_mg_l: finite("do_mg_l").refine((d) => d >= 0 && d <= 25, "do_mg_l must lie within 0–25 mg/L"),
  weight: finite("weight").refine((w) => w > 0, "weight must be above 0").optional(),
});

/** One coefficient to fit over a group of reaches, with its bounds and starting value. */
export const fitEntrySchema = z.strictObject({
  parameter: z.enum(FIT_PARAMETERS, { message: `parameter must be one of ${FIT_PARAMETERS.join(", ")}` }),
  reaches: z.array(z.string().min(1)).min(1, "reaches must name at least one reach"),
  min: finite("min"),
  max: finite("max"),
  start: finite("start"),
});

/**
 * The calibration block of a calibration file (docs/calibrate-cli.md): a model file with
 * `"calibration": { "observations": [...], "fit": [...] }` beside its own fields.
 */
export const calibrationSchema = z.strictObject({
  observations: z.array(observationSchema).min(1, "observations must hold at least one observation").max(10_000),
  fit: z.array(fitEntrySchema).min(1, "fit must name at least one coefficient").max(50),
});

/**
 * A calibration run asked from the app (POST …/scenarios/:scenarioId/calibrations): the survey
 * whose DO is fitted, the scenario condition that stands for the survey's day, and each
 * coefficient with the reaches it applies to ("all" for every reach), its bounds and start.
 * Each sample's weight is the survey's own (its weight column; 1 when none).
 */
export const calibrationRunSchema = z.strictObject({
  /** What the fitted set is called where a scenario chooses it and a plan records it (default: the survey's name and the condition). */
  name: z.string().trim().max(120, "the name must be at most 120 characters").optional().transform((v) => (v ? v : undefined)),
  surveyId: z.string({ message: "choose the survey" }).uuid("choose the survey"),
  /** A second survey to check the fitted model against, without refitting. */
  validationSurveyId: z.string().uuid("choose the second survey").optional(),
  condition: z.string({ message: "choose the condition" }).trim().min(1, "choose the condition"),
  /** Weights by station name (> 0), over the survey's own weight column; a station left out keeps the survey's (1 when none). */
  weights: z.record(z.string().min(1), finite("weight").refine((w) => w > 0 && w <= 1000, "a weight must be above 0 and at most 1000")).optional(),
  fit: z
    .array(
      z
        .strictObject({
          parameter: z.enum(FIT_PARAMETERS, { message: `parameter must be one of ${FIT_PARAMETERS.join(", ")}` }),
          reaches: z.union([z.literal("all"), z.array(z.string().min(1)).min(1, "reaches must name at least one reach")]),
          min: finite("min").refine((v) => v >= 0, "min cannot be negative"),
          max: finite("max"),
          start: finite("start"),
        })
        .superRefine((f, ctx) => {
          if (!(f.min < f.max)) ctx.addIssue({ code: "custom", path: ["max"], message: "max must be above min" });
          else if (!(f.start >= f.min && f.start <= f.max)) ctx.addIssue({ code: "custom", path: ["start"], message: "start must lie within min–max" });
          if (f.parameter === "ka_multiplier" && f.min <= 0) ctx.addIssue({ code: "custom", path: ["min"], message: "min must be above 0 for a k_a multiplier" });
        }),
    )
    .min(1, "choose at least one coefficient to fit")
    .max(12, "fit at most 12 coefficients at once"),
});
export type CalibrationRunRequest = z.infer<typeof calibrationRunSchema>;
