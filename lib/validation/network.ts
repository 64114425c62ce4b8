import { z } from "zod";
import { IMPORT_DEFAULTS, IMPORT_LAYERS, importDefaults } from "@/lib/domain";
import { dischargerMappingSchema, reachMappingSchema } from "@/geo/field-mapping";

export const importLayerSchema = z.enum(IMPORT_LAYERS, { message: `layer must be ${IMPORT_LAYERS.join(" or ")}` });

/** Form fields that come with an uploaded file (multipart/form-data). */
export const uploadFieldsSchema = z
  .object({
    layer: importLayerSchema,
    epsg: z.coerce.number().int("epsg must be a whole number").positive("epsg must be a positive EPSG code").optional(),
    csvLatitude: z.string().trim().min(1).optional(),
    csvLongitude: z.string().trim().min(1).optional(),
    csvX: z.string().trim().min(1).optional(),
    csvY: z.string().trim().min(1).optional(),
  })
  .refine((v) => !(v.csvX || v.csvY) || (v.csvX && v.csvY && v.epsg), {
    message: "x/y columns need both csvX and csvY and an epsg code",
    path: ["csvX"],
  });
export type UploadFields = z.infer<typeof uploadFieldsSchema>;

const outletSchema = z.union([
  z.object({ nodeId: z.string().min(1) }),
  z.object({ reachId: z.string().min(1) }),
]);

export const networkOptionsSchema = z.object({
  toleranceM: z.number().min(0, "tolerance cannot be negative").max(1000, "tolerance above 1000 m joins unrelated lines").default(IMPORT_DEFAULTS.toleranceM),
  maxSnapDistanceM: z.number().positive("snapping distance must be positive").max(100_000).default(IMPORT_DEFAULTS.maxSnapDistanceM),
  maxReachLengthKm: z.number().positive().max(1000).default(IMPORT_DEFAULTS.maxReachLengthKm),
  allowMultipleOutlets: z.boolean().default(IMPORT_DEFAULTS.allowMultipleOutlets),
  outlets: z.array(outletSchema).max(100).optional(),
  reassign: z.record(z.string(), z.string().min(1)).optional(),
});

/** A network draft: which uploads, how their fields map, and the topology options. */
export const networkDraftSchema = z
  .object({
    reachImportId: z.uuid("reachImportId must be an upload id"),
    reachMapping: reachMappingSchema,
    dischargerImportId: z.uuid("dischargerImportId must be an upload id").optional(),
    dischargerMapping: dischargerMappingSchema.optional(),
    options: networkOptionsSchema.default(importDefaults),
  })
  .refine((v) => !v.dischargerImportId || v.dischargerMapping, {
    message: "a discharger upload needs a discharger field mapping",
    path: ["dischargerMapping"],
  });
export type NetworkDraft = z.infer<typeof networkDraftSchema>;

export const networkCommitSchema = z.object({
  draft: networkDraftSchema,
  note: z.string().trim().max(500).default(""),
  /** The planner has read the validation report (warnings included). */
  acceptReport: z.literal(true, { message: "accept the validation report before saving the network" }),
});
export type NetworkCommit = z.infer<typeof networkCommitSchema>;

export const fieldMappingSaveSchema = z.discriminatedUnion("layer", [
  z.object({ layer: z.literal("reaches"), name: z.string().trim().min(1).max(80), mapping: reachMappingSchema }),
  z.object({ layer: z.literal("dischargers"), name: z.string().trim().min(1).max(80), mapping: dischargerMappingSchema }),
]);
export type FieldMappingSave = z.infer<typeof fieldMappingSaveSchema>;

const positive = (what: string, max: number) =>
  z.number({ message: `${what} must be a number` }).positive(`${what} must be above zero`).max(max, `${what} must be at most ${max}`);
const nonNegative = (what: string, max: number) =>
  z.number({ message: `${what} must be a number` }).min(0, `${what} cannot be negative`).max(max, `${what} must be at most ${max}`);

/** Inline edit of a saved reach (SI values; the table converts from the basin's units). null clears a value. */
export const reachEditSchema = z
  .object({
    name: z.string().trim().max(200).nullable(),
    lengthKm: positive("Length (km)", 1000),
    designFlowM3s: positive("Design flow (m³/s)", 100_000).nullable(),
    drainageAreaKm2: positive("Drainage area (km²)", 10_000_000).nullable(),
    velocityMps: positive("Velocity (m/s)", 10).nullable(),
    depthM: positive("Depth (m)", 100).nullable(),
    slope: nonNegative("Slope (m/m)", 1).nullable(),
    manningN: positive("Manning's n", 1).nullable(),
    bottomWidthM: positive("Bottom width (m)", 10_000).nullable(),
    sideSlope: nonNegative("Side slope (horizontal per vertical)", 20).nullable(),
    hgVelocityCoef: positive("Velocity coefficient a", 100).nullable(),
    hgVelocityExp: nonNegative("Velocity exponent b", 2).nullable(),
    hgDepthCoef: positive("Depth coefficient c", 100).nullable(),
    hgDepthExp: nonNegative("Depth exponent f", 2).nullable(),
    temperatureC: z.number().min(0, "Temperature must be at least 0 °C").max(45, "Temperature must be at most 45 °C").nullable(),
    elevationM: z.number().min(-500).max(6000).nullable(),
    deoxygenationRatePerDay: nonNegative("k_d (1/d)", 20).nullable(),
    reaerationRatePerDay: nonNegative("k_a (1/d)", 200).nullable(),
    settlingRatePerDay: nonNegative("k_s (1/d)", 20).nullable(),
    sodGPerM2PerDay: nonNegative("SOD (g/m²/d)", 50).nullable(),
  })
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "Give at least one value to change" });
export type ReachEdit = z.infer<typeof reachEditSchema>;

/** Inline edit of a saved discharger's effluent (SI values). */
export const outfallEditSchema = z
  .object({
    designFlowM3s: positive("Design flow (m³/s)", 1000).nullable(),
    effluentBod5MgL: nonNegative("Effluent BOD5 (mg/L)", 100_000).nullable(),
    effluentCbodUMgL: nonNegative("Effluent CBODu (mg/L)", 100_000).nullable(),
    bottleRatePerDay: positive("Bottle rate (1/d)", 5).nullable(),
    dissolvedOxygenMgL: nonNegative("Effluent DO (mg/L)", 20).nullable(),
    temperatureC: z.number().min(0, "Temperature must be at least 0 °C").max(60, "Temperature must be at most 60 °C").nullable(),
  })
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "Give at least one value to change" });
export type OutfallEdit = z.infer<typeof outfallEditSchema>;

/**
 * The validate request's query string: `progress` is an id the client picks (a UUID) to
 * follow the validation's stages at GET …/networks/validate/<progress> while it waits.
 */
export const validateQuerySchema = z.object({ progress: z.uuid("progress must be a UUID").optional() });

export const validationProgressParams = z.object({
  basinId: z.uuid("basinId is not a valid id"),
  progressId: z.uuid("progressId is not a valid id"),
});

/** A reach's hydraulic geometry fitted to surveys' measurements (POST …/reaches/:reachId/hydraulic-geometry). */
export const hydraulicFitSchema = z.strictObject({
  surveyIds: z.array(z.uuid("a survey id")).min(1, "name at least one survey").max(20, "at most 20 surveys"),
});
