/**
 * The GeoJSON export layouts of docs/exports.md as zod schemas: the unit tests and the
 * plan download tests parse every exported file through them, so a file that drifts from
 * the documented layout fails. Property names ending in a unit carry the basin's unit
 * system (km or mi, kg_d or lb_d, m3_s or cfs); `.strict()` refuses undocumented members.
 */
import { z } from "zod";

const num = z.number().nullable();
const band = z.enum(["ample", "meets", "near", "below", "anoxic"]);
const lineString = z.object({ type: z.literal("LineString"), coordinates: z.array(z.array(z.number()).length(2)).min(2) });
const point = z.object({ type: z.literal("Point"), coordinates: z.array(z.number()).length(2) });
const condition = { condition: z.string().optional() };

const file = <P extends z.ZodType, G extends z.ZodType>(layer: string, geometry: G, properties: P) =>
  z.object({
    type: z.literal("FeatureCollection"),
    layer: z.literal(layer),
    caution: z.array(z.string()),
    units: z.record(z.string(), z.string()),
    condition: z.string().optional(),
    plan: z.unknown().optional(),
    features: z.array(z.object({ type: z.literal("Feature"), id: z.string(), geometry, properties })),
  });

export const reachesFile = file(
  "reaches",
  lineString,
  z
    .object({
      kind: z.literal("reach"),
      id: z.string(),
      name: z.string().nullable(),
      min_do_mg_l: num,
      min_do_lon: num,
      min_do_lat: num,
      head_do_mg_l: num,
      end_do_mg_l: num,
      band,
      below_criterion: z.boolean(),
      anoxic: z.boolean(),
      criterion_do_mg_l: num,
      ...condition,
    })
    .catchall(num)
    .refine((p) => Object.keys(p).some((k) => /^length_(km|mi)$/.test(k)) && Object.keys(p).some((k) => /^min_do_at_(km|mi)$/.test(k)), "length and position in km or mi"),
);

export const piecesFile = file(
  "pieces",
  lineString,
  z
    .object({ kind: z.literal("piece"), reach: z.string(), do_start_mg_l: num, do_end_mg_l: num, do_mg_l: num, band, anoxic: z.boolean(), ...condition })
    .catchall(num)
    .refine((p) => ["from", "to"].every((e) => Object.keys(p).some((k) => new RegExp(`^${e}_(km|mi)$`).test(k))), "from/to in km or mi"),
);

export const dischargersFile = file(
  "dischargers",
  point,
  z
    .object({
      kind: z.literal("discharger"),
      permit_id: z.string(),
      facility_name: z.string().nullable(),
      reach: z.string(),
      effluent_bod5_mg_l: num,
      reduction_pct: num,
    })
    .catchall(num)
    .refine(
      (p) => ["at_(km|mi)", "design_flow_(m3_s|cfs)", "allocated_cbodu_(kg_d|lb_d)", "allocated_bod5_(kg_d|lb_d)", "today_cbodu_(kg_d|lb_d)"].every((k) => Object.keys(p).some((x) => new RegExp(`^${k}$`).test(x))),
      "positions, flows and loads in the basin's units",
    ),
);
