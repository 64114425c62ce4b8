import { z } from "zod";
import { ALLOCATION_OBJECTIVES, KA_METHODS, THETA_RULES } from "@/lib/domain";
import { compilePlan } from "@/lib/model/network/compile";
import { formatPath, ModelInputError } from "@/lib/model/errors";
import type { ModelFile } from "@/lib/model/types";

/**
 * THE schema of Sagline's model file (MODEL.md §8), shared by the CLI and the API.
 * Objects are strict: a misspelt optional field (say `kd20_per_dy`) is an error rather than
 * a silently ignored setting. After the shape checks, the network itself is checked
 * (references, cycles, outfalls beyond a reach's end, reaches without inflow) by building
 * the model's plan; its errors come back as zod issues with the offending field's path.
 */

const finite = (what: string) => z.number({ message: `${what} must be a number` }).refine(Number.isFinite, `${what} must be finite`);
const positive = (what: string) => finite(what).refine((v) => v > 0, `${what} must be greater than zero`);
const nonNegative = (what: string) => finite(what).refine((v) => v >= 0, `${what} must not be negative`);
const id = z.string().trim().min(1, "id must not be empty").max(100);

export const kaMethodSchema = z.enum(KA_METHODS);

const hydraulicGeometrySchema = z.strictObject({
  a: positive("a"),
  b: finite("b"),
  c: positive("c"),
  f: finite("f"),
});

const manningSchema = z.strictObject({
  n: positive("n"),
  bottom_width_m: positive("bottom_width_m"),
  side_slope: nonNegative("side_slope").optional(),
});

export const reachSchema = z
  .strictObject({
    id,
    downstream: id.nullable(),
    length_km: positive("length_km"),
    velocity_m_s: positive("velocity_m_s").optional(),
    depth_m: positive("depth_m").optional(),
    hydraulic_geometry: hydraulicGeometrySchema.optional(),
    manning: manningSchema.optional(),
    kd20_per_day: nonNegative("kd20_per_day"),
    ka20_per_day: positive("ka20_per_day").optional(),
    ka_method: kaMethodSchema.optional(),
    ka_floor: z.boolean().optional(),
    ka_multiplier: positive("ka_multiplier").optional(),
    slope_m_m: positive("slope_m_m").optional(),
    ks20_per_day: nonNegative("ks20_per_day").optional(),
    kn20_per_day: nonNegative("kn20_per_day").optional(),
    sod20_g_m2_day: nonNegative("sod20_g_m2_day").optional(),
    distributed_cbodu_mg_l_day: nonNegative("distributed_cbodu_mg_l_day").optional(),
    temperature_c: finite("temperature_c").refine((t) => t >= 0 && t <= 40, "temperature_c must be within 0–40 °C").optional(),
    elevation_m: finite("elevation_m").refine((e) => e >= -500 && e <= 6000, "elevation_m must be within −500–6000 m").optional(),
    salinity_g_kg: nonNegative("salinity_g_kg").optional(),
    name: z.string().max(200).optional(),
  })
  .superRefine((r, ctx) => {
    const geometry = r.hydraulic_geometry !== undefined;
    const manning = r.manning !== undefined;
    if (geometry && manning) {
      ctx.addIssue({ code: "custom", path: ["manning"], message: "give hydraulic_geometry or manning, not both" });
    }
    if ((geometry || manning) && (r.velocity_m_s !== undefined || r.depth_m !== undefined)) {
      const rule = geometry ? "hydraulic_geometry" : "manning";
      ctx.addIssue({ code: "custom", path: [rule], message: `give velocity_m_s and depth_m, or ${rule}, not both` });
    }
    if (manning && r.slope_m_m === undefined) {
      ctx.addIssue({ code: "custom", path: ["slope_m_m"], message: "slope_m_m (the bed slope) is required with manning" });
    }
    if (!geometry && !manning) {
      if (r.velocity_m_s === undefined) ctx.addIssue({ code: "custom", path: ["velocity_m_s"], message: "velocity_m_s is required (or hydraulic_geometry, or manning)" });
      if (r.depth_m === undefined) ctx.addIssue({ code: "custom", path: ["depth_m"], message: "depth_m is required (or hydraulic_geometry, or manning)" });
    }
    const method = r.ka_method ?? (r.ka20_per_day !== undefined ? "given" : "depth-velocity");
    if (method === "given" && r.ka20_per_day === undefined) {
      ctx.addIssue({ code: "custom", path: ["ka20_per_day"], message: 'ka20_per_day is required when ka_method is "given"' });
    }
    if (method === "tsivoglou-neal" && r.slope_m_m === undefined) {
      ctx.addIssue({ code: "custom", path: ["slope_m_m"], message: 'slope_m_m is required when ka_method is "tsivoglou-neal"' });
    }
  });

const waterShape = {
  flow_m3_s: positive("flow_m3_s"),
  cbodu_mg_l: nonNegative("cbodu_mg_l").optional(),
  bod5_mg_l: nonNegative("bod5_mg_l").optional(),
  bottle_k_per_day: positive("bottle_k_per_day").optional(),
  nbodu_mg_l: nonNegative("nbodu_mg_l").optional(),
  do_mg_l: nonNegative("do_mg_l").refine((v) => v <= 25, "do_mg_l must not exceed 25 mg/L"),
  temperature_c: finite("temperature_c").refine((t) => t >= 0 && t <= 40, "temperature_c must be within 0–40 °C"),
  name: z.string().max(200).optional(),
};

function checkBod(w: { cbodu_mg_l?: number; bod5_mg_l?: number }, ctx: z.RefinementCtx): void {
  if (w.cbodu_mg_l === undefined && w.bod5_mg_l === undefined) {
    ctx.addIssue({ code: "custom", path: ["cbodu_mg_l"], message: "cbodu_mg_l is required (or bod5_mg_l with bottle_k_per_day)" });
  }
  if (w.cbodu_mg_l !== undefined && w.bod5_mg_l !== undefined) {
    ctx.addIssue({ code: "custom", path: ["bod5_mg_l"], message: "give cbodu_mg_l or bod5_mg_l, not both" });
  }
}

export const headwaterSchema = z.strictObject({ reach: id, ...waterShape }).superRefine(checkBod);
export const inflowSchema = z.strictObject({ id: id.optional(), reach: id, km: nonNegative("km"), ...waterShape }).superRefine(checkBod);
export const dischargerSchema = z
  .strictObject({
    id,
    reach: id,
    km: nonNegative("km"),
    future: z.boolean().optional(),
    removal_cost: nonNegative("removal_cost").optional(),
    ...waterShape,
  })
  .superRefine(checkBod);

const fraction = (what: string) => finite(what).refine((v) => v >= 0 && v < 1, `${what} must be at least 0 and below 1`);

export const conditionSchema = z.strictObject({
  name: z.string().trim().min(1, "name must not be empty").max(200),
  temperature_c: finite("temperature_c").refine((t) => t >= 0 && t <= 40, "temperature_c must be within 0–40 °C").optional(),
  headwaters: z
    .array(
      z.strictObject({
        reach: id,
        flow_m3_s: positive("flow_m3_s").optional(),
        temperature_c: finite("temperature_c").optional(),
        do_mg_l: nonNegative("do_mg_l").optional(),
      }),
    )
    .optional(),
  inflows: z
    .array(
      z.strictObject({
        id,
        flow_m3_s: positive("flow_m3_s").optional(),
        temperature_c: finite("temperature_c").optional(),
        do_mg_l: nonNegative("do_mg_l").optional(),
      }),
    )
    .optional(),
  dischargers: z.array(z.strictObject({ id, flow_m3_s: positive("flow_m3_s") })).optional(),
});

export const allocationSchema = z
  .strictObject({
    objective: z.enum(ALLOCATION_OBJECTIVES),
    bounds: z
      .record(id, z.strictObject({ min_kg_day: nonNegative("min_kg_day").optional(), max_kg_day: nonNegative("max_kg_day").optional() }))
      .optional(),
    floor_bod5_mg_l: nonNegative("floor_bod5_mg_l").optional(),
    mos_do_mg_l: nonNegative("mos_do_mg_l").optional(),
    mos_fraction: fraction("mos_fraction").optional(),
    reserve_fraction: fraction("reserve_fraction").optional(),
    conditions: z.array(conditionSchema).optional(),
  })
  .superRefine((a, ctx) => {
    if ((a.mos_fraction ?? 0) + (a.reserve_fraction ?? 0) >= 1) {
      ctx.addIssue({ code: "custom", path: ["reserve_fraction"], message: "mos_fraction + reserve_fraction must be below 1" });
    }
    for (const [key, b] of Object.entries(a.bounds ?? {})) {
      if (b.min_kg_day !== undefined && b.max_kg_day !== undefined && b.min_kg_day > b.max_kg_day) {
        ctx.addIssue({ code: "custom", path: ["bounds", key, "min_kg_day"], message: "min_kg_day must not exceed max_kg_day" });
      }
    }
  });

export const kineticsSchema = z.strictObject({
  theta_kd: positive("theta_kd").optional(),
  theta_ka: positive("theta_ka").optional(),
  theta_sod: positive("theta_sod").optional(),
  theta_kn: positive("theta_kn").optional(),
  theta_ks: positive("theta_ks").optional(),
  deoxygenation_rule: z.enum(THETA_RULES).optional(),
});

export const modelFileSchema = z
  .strictObject({
    reaches: z.array(reachSchema).min(1, "reaches must list at least one reach"),
    headwaters: z.array(headwaterSchema),
    dischargers: z.array(dischargerSchema),
    inflows: z.array(inflowSchema).optional(),
    criterion_do_mg_l: positive("criterion_do_mg_l"),
    step_km: positive("step_km").optional(),
    kinetics: kineticsSchema.optional(),
    allocation: allocationSchema.optional(),
    name: z.string().max(200).optional(),
    description: z.string().max(5000).optional(),
  })
  .superRefine((file, ctx) => {
    // The network-level checks live in the model core; run them once and report by path.
    try {
      compilePlan(file);
    } catch (e) {
      if (e instanceof ModelInputError) {
        ctx.addIssue({ code: "custom", path: [...e.path], message: e.message.slice(e.message.indexOf(": ") + 2) });
      } else if (e instanceof RangeError) {
        ctx.addIssue({ code: "custom", path: [], message: e.message });
      } else throw e;
    }
    for (const key of Object.keys(file.allocation?.bounds ?? {})) {
      const d = file.dischargers.find((x) => x.id === key);
      if (!d) ctx.addIssue({ code: "custom", path: ["allocation", "bounds", key], message: `no discharger has id "${key}"` });
      else if (d.future) {
        ctx.addIssue({ code: "custom", path: ["allocation", "bounds", key], message: `"${key}" is a future discharger (reserve capacity): its load is fixed, not allocated` });
      }
    }
  });

export type ModelFileInput = z.infer<typeof modelFileSchema>;

// Compile-time check that what the schema accepts is what the model core takes.
const acceptsModelFile = (f: ModelFileInput): ModelFile => f;
void acceptsModelFile;

/** One problem in a model file: the field's path (`dischargers[2].km`) and a plain message. */
export interface ModelFileIssue {
  path: string;
  message: string;
}

/** Parses unknown JSON into a model file, or returns every issue with its field path. */
export function parseModelFile(data: unknown): { ok: true; file: ModelFileInput } | { ok: false; issues: ModelFileIssue[] } {
  const r = modelFileSchema.safeParse(data);
  if (r.success) return { ok: true, file: r.data };
  return { ok: false, issues: r.error.issues.map((i) => ({ path: formatPath(i.path), message: i.message })) };
}
