import { z } from "zod";
import { dischargerMappingSchema, reachMappingSchema } from "@/geo/field-mapping";

export const importLayerSchema = z.enum(["reaches", "dischargers"], { message: "layer must be reaches or dischargers" });

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
  toleranceM: z.number().min(0, "tolerance cannot be negative").max(1000, "tolerance above 1000 m joins unrelated lines").default(5),
  maxSnapDistanceM: z.number().positive("snapping distance must be positive").max(100_000).default(500),
  maxReachLengthKm: z.number().positive().max(1000).default(10),
  allowMultipleOutlets: z.boolean().default(false),
  outlets: z.array(outletSchema).max(100).optional(),
  reassign: z.record(z.string(), z.string().min(1)).optional(),
});
export type NetworkOptions = z.infer<typeof networkOptionsSchema>;

/** A network draft: which uploads, how their fields map, and the topology options. */
export const networkDraftSchema = z
  .object({
    reachImportId: z.uuid("reachImportId must be an upload id"),
    reachMapping: reachMappingSchema,
    dischargerImportId: z.uuid("dischargerImportId must be an upload id").optional(),
    dischargerMapping: dischargerMappingSchema.optional(),
    options: networkOptionsSchema.default({
      toleranceM: 5,
      maxSnapDistanceM: 500,
      maxReachLengthKm: 10,
      allowMultipleOutlets: false,
    }),
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
