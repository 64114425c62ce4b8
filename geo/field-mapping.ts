import { z } from "zod";
import { highlight } from "./coordinates";
import { formatPath } from "@/lib/model/errors";
import { GeoError } from "./errors";
import { valueNumber, valueText } from "./fields";
import { error, warning, type Problem } from "./problems";
import type { SourceFeature, SourceLayer } from "./types";
import {
  AREA_UNITS,
  areaToKm2,
  type AreaUnit,
  DEPTH_UNITS,
  DISTANCE_UNITS,
  FLOW_UNITS,
  TEMPERATURE_UNITS,
  VELOCITY_UNITS,
  depthToM,
  distanceToKm,
  flowToM3s,
  temperatureToC,
  velocityToMps,
  type DepthUnit,
  type DistanceUnit,
  type FlowUnit,
  type TemperatureUnit,
  type VelocityUnit,
} from "./units";

const source = z.string().trim().min(1);
const plain = z.object({ source });
const withUnit = <U extends readonly [string, ...string[]]>(units: U) => z.object({ source, unit: z.enum(units) });

/**
 * Which source field feeds each reach field, and in which unit. Rates are per day (base e,
 * at 20 °C), SOD in g O₂/m²/d, slope in m/m; those have one unit and need no choice.
 */
export const reachMappingSchema = z.object({
  reachId: source,
  name: source.optional(),
  downstreamId: source.optional(),
  length: withUnit(DISTANCE_UNITS).optional(),
  velocity: withUnit(VELOCITY_UNITS).optional(),
  depth: withUnit(DEPTH_UNITS).optional(),
  slope: plain.optional(),
  manningN: plain.optional(),
  bottomWidth: withUnit(DEPTH_UNITS).optional(),
  sideSlope: plain.optional(),
  hgVelocityCoef: plain.optional(),
  hgVelocityExp: plain.optional(),
  hgDepthCoef: plain.optional(),
  hgDepthExp: plain.optional(),
  designFlow: withUnit(FLOW_UNITS).optional(),
  drainageArea: withUnit(AREA_UNITS).optional(),
  temperature: withUnit(TEMPERATURE_UNITS).optional(),
  elevation: withUnit(DEPTH_UNITS).optional(),
  deoxygenationRate: plain.optional(),
  reaerationRate: plain.optional(),
  settlingRate: plain.optional(),
  sod: plain.optional(),
});

/** Which source field feeds each discharger field. Concentrations in mg/L, bottle rate per day. */
export const dischargerMappingSchema = z.object({
  name: source,
  permitId: source,
  designFlow: withUnit(FLOW_UNITS).optional(),
  effluentBod: z.object({ source, kind: z.enum(["BOD5", "CBODu"]) }).optional(),
  bottleRate: plain.optional(),
  dissolvedOxygen: plain.optional(),
  temperature: withUnit(TEMPERATURE_UNITS).optional(),
  contactEmail: source.optional(),
});

export type ReachMapping = z.infer<typeof reachMappingSchema>;
export type DischargerMapping = z.infer<typeof dischargerMappingSchema>;

/** Reach attributes in SI. */
export interface ReachAttributes {
  id: string;
  name?: string;
  downstreamId?: string;
  lengthKm?: number;
  velocityMps?: number;
  depthM?: number;
  slope?: number;
  /** Manning's roughness n (s/m^(1/3)); with bottomWidthM and slope, velocity and depth follow the flow. */
  manningN?: number;
  bottomWidthM?: number;
  /** Bank slope, horizontal per vertical (0 = rectangular). */
  sideSlope?: number;
  /** Hydraulic geometry in SI: U = hgVelocityCoef·Q^hgVelocityExp (m/s), H = hgDepthCoef·Q^hgDepthExp (m), Q in m³/s. */
  hgVelocityCoef?: number;
  hgVelocityExp?: number;
  hgDepthCoef?: number;
  hgDepthExp?: number;
  designFlowM3s?: number;
  /** Area draining to the reach (km²); a headwater's carries a gauge's flow by drainage-area ratio. */
  drainageAreaKm2?: number;
  temperatureC?: number;
  elevationM?: number;
  deoxygenationRatePerDay?: number;
  reaerationRatePerDay?: number;
  settlingRatePerDay?: number;
  sodGPerM2PerDay?: number;
}

/** Discharger attributes in SI (flow m³/s, concentrations mg/L, temperature °C). */
export interface DischargerAttributes {
  name: string;
  permitId: string;
  designFlowM3s?: number;
  effluentBod5MgL?: number;
  effluentCbodUMgL?: number;
  bottleRatePerDay?: number;
  dissolvedOxygenMgL?: number;
  temperatureC?: number;
  contactEmail?: string;
}

export interface Mapped<A> {
  feature: SourceFeature;
  attributes: A;
}

/** How one numeric field is read: target key, mapping key, conversion, and whether < 0 is wrong. */
interface NumericRule<M, A> {
  target: keyof A;
  key: keyof M;
  label: string;
  convert: (value: number, binding: Record<string, string>) => number;
  signed?: boolean;
}

const same = (v: number) => v;

const REACH_NUMBERS: NumericRule<ReachMapping, ReachAttributes>[] = [
  { target: "lengthKm", key: "length", label: "length", convert: (v, b) => distanceToKm(v, b.unit as DistanceUnit) },
  { target: "velocityMps", key: "velocity", label: "velocity", convert: (v, b) => velocityToMps(v, b.unit as VelocityUnit) },
  { target: "depthM", key: "depth", label: "depth", convert: (v, b) => depthToM(v, b.unit as DepthUnit) },
  { target: "slope", key: "slope", label: "slope", convert: same },
  { target: "manningN", key: "manningN", label: "Manning's n", convert: same },
  { target: "bottomWidthM", key: "bottomWidth", label: "bottom width", convert: (v, b) => depthToM(v, b.unit as DepthUnit) },
  { target: "sideSlope", key: "sideSlope", label: "side slope", convert: same },
  { target: "hgVelocityCoef", key: "hgVelocityCoef", label: "velocity coefficient a", convert: same },
  { target: "hgVelocityExp", key: "hgVelocityExp", label: "velocity exponent b", convert: same },
  { target: "hgDepthCoef", key: "hgDepthCoef", label: "depth coefficient c", convert: same },
  { target: "hgDepthExp", key: "hgDepthExp", label: "depth exponent f", convert: same },
  { target: "designFlowM3s", key: "designFlow", label: "design flow", convert: (v, b) => flowToM3s(v, b.unit as FlowUnit) },
  { target: "drainageAreaKm2", key: "drainageArea", label: "drainage area", convert: (v, b) => areaToKm2(v, b.unit as AreaUnit) },
  { target: "temperatureC", key: "temperature", label: "temperature", convert: (v, b) => temperatureToC(v, b.unit as TemperatureUnit), signed: true },
  { target: "elevationM", key: "elevation", label: "elevation", convert: (v, b) => depthToM(v, b.unit as DepthUnit), signed: true },
  { target: "deoxygenationRatePerDay", key: "deoxygenationRate", label: "deoxygenation rate", convert: same },
  { target: "reaerationRatePerDay", key: "reaerationRate", label: "reaeration rate", convert: same },
  { target: "settlingRatePerDay", key: "settlingRate", label: "settling rate", convert: same },
  { target: "sodGPerM2PerDay", key: "sod", label: "sediment oxygen demand", convert: same },
];

const DISCHARGER_NUMBERS: NumericRule<DischargerMapping, DischargerAttributes>[] = [
  { target: "designFlowM3s", key: "designFlow", label: "design flow", convert: (v, b) => flowToM3s(v, b.unit as FlowUnit) },
  { target: "bottleRatePerDay", key: "bottleRate", label: "bottle rate", convert: same },
  { target: "dissolvedOxygenMgL", key: "dissolvedOxygen", label: "dissolved oxygen", convert: same },
  { target: "temperatureC", key: "temperature", label: "temperature", convert: (v, b) => temperatureToC(v, b.unit as TemperatureUnit), signed: true },
];

function parseMapping<T>(schema: z.ZodType<T>, mapping: unknown, what: string): T {
  const r = schema.safeParse(mapping);
  if (!r.success) {
    const issue = r.error.issues[0];
    throw new GeoError("mapping_invalid", `The ${what} field mapping is invalid at "${formatPath(issue.path, "(mapping)")}": ${issue.message}`);
  }
  return r.data;
}

/** Every source field a mapping names must exist in the layer. */
function checkSourcesExist(layer: SourceLayer, mapping: Record<string, unknown>) {
  const fields = new Set(layer.fields.map((f) => f.name));
  if (layer.features.length === 0) return;
  for (const [target, binding] of Object.entries(mapping)) {
    const name = typeof binding === "string" ? binding : (binding as { source: string }).source;
    if (!fields.has(name)) {
      throw new GeoError(
        "mapping_invalid",
        `The field "${name}" mapped to ${target} is not in the file; its fields are ${[...fields].join(", ") || "none"}`,
        { field: name, target },
      );
    }
  }
}

const bindingOf = (mapping: object, key: PropertyKey) =>
  (mapping as Record<PropertyKey, Record<string, string> | undefined>)[key];

function readNumbers<M extends object, A>(
  f: SourceFeature,
  who: string,
  mapping: M,
  rules: NumericRule<M, A>[],
  out: Partial<A>,
  problems: Problem[],
) {
  for (const rule of rules) {
    const binding = bindingOf(mapping, rule.key);
    if (!binding) continue;
    const raw = f.properties[binding.source];
    const v = valueNumber(raw);
    if (v === undefined) continue;
    if (Number.isNaN(v)) {
      problems.push(error("invalid_number", `${who}: ${rule.label} "${valueText(raw)}" in field ${binding.source} is not a number`, [who], { field: binding.source, ...highlight(f.geometry) }));
      continue;
    }
    if (v < 0 && !rule.signed) {
      problems.push(error("negative_value", `${who}: ${rule.label} ${v} in field ${binding.source} is negative`, [who], { field: binding.source, ...highlight(f.geometry) }));
      continue;
    }
    (out as Record<keyof A, number>)[rule.target] = rule.convert(v, binding);
  }
}

const text = (f: SourceFeature, field: string | undefined) => (field ? valueText(f.properties[field]) || undefined : undefined);

/**
 * Applies a reach mapping: SI attributes per feature, plus problems (missing reach id,
 * values that are not numbers or are negative). Throws `mapping_invalid` when the mapping
 * is malformed or names a field the layer does not have.
 */
export function mapReaches(layer: SourceLayer, mapping: ReachMapping): { reaches: Mapped<ReachAttributes>[]; problems: Problem[] } {
  const m = parseMapping(reachMappingSchema, mapping, "reach");
  checkSourcesExist(layer, m);
  const problems: Problem[] = [];
  const reaches = layer.features.map((feature) => {
    const id = text(feature, m.reachId) ?? "";
    const who = id ? `reach ${id}` : feature.label;
    if (!id) problems.push(error("missing_value", `${feature.label} has no reach id (field ${m.reachId})`, [feature.label], { field: m.reachId, ...highlight(feature.geometry) }));
    const attributes: ReachAttributes = { id, name: text(feature, m.name), downstreamId: text(feature, m.downstreamId) };
    readNumbers(feature, who, m, REACH_NUMBERS, attributes, problems);
    if (attributes.lengthKm === 0) {
      problems.push(error("zero_length", `${who}: length field ${m.length?.source} is zero`, [id || feature.label], { field: m.length?.source, ...highlight(feature.geometry) }));
      delete attributes.lengthKm;
    }
    return { feature, attributes };
  });
  return { reaches, problems };
}

const EMAIL = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;

/**
 * Applies a discharger mapping: SI attributes per feature, plus problems (missing name or
 * permit id, bad numbers, malformed e-mail). Throws `mapping_invalid` like `mapReaches`.
 */
export function mapDischargers(
  layer: SourceLayer,
  mapping: DischargerMapping,
): { dischargers: Mapped<DischargerAttributes>[]; problems: Problem[] } {
  const m = parseMapping(dischargerMappingSchema, mapping, "discharger");
  checkSourcesExist(layer, m);
  const problems: Problem[] = [];
  const dischargers = layer.features.map((feature) => {
    const permitId = text(feature, m.permitId) ?? "";
    const name = text(feature, m.name) ?? "";
    const who = permitId ? `discharger ${permitId}` : feature.label;
    const key = permitId || feature.label;
    const at = highlight(feature.geometry);
    if (!permitId) problems.push(error("missing_value", `${feature.label} has no permit id (field ${m.permitId})`, [key], { field: m.permitId, ...at }));
    if (!name) problems.push(error("missing_value", `${who} has no name (field ${m.name})`, [key], { field: m.name, ...at }));
    const attributes: DischargerAttributes = { name, permitId, contactEmail: text(feature, m.contactEmail) };
    readNumbers(feature, who, m, DISCHARGER_NUMBERS, attributes, problems);
    if (m.effluentBod) {
      const bod: Partial<DischargerAttributes> = {};
      const target = m.effluentBod.kind === "BOD5" ? "effluentBod5MgL" : "effluentCbodUMgL";
      readNumbers(feature, who, { bod: m.effluentBod }, [{ target, key: "bod", label: `effluent ${m.effluentBod.kind}`, convert: same }], bod, problems);
      Object.assign(attributes, bod);
    }
    if (attributes.contactEmail && !EMAIL.test(attributes.contactEmail)) {
      problems.push(warning("invalid_email", `${who}: contact e-mail "${attributes.contactEmail}" does not look like an address`, [key], { field: m.contactEmail, ...at }));
    }
    if (attributes.designFlowM3s === undefined || (attributes.effluentBod5MgL ?? attributes.effluentCbodUMgL) === undefined) {
      problems.push(warning("missing_value", `${who} has no design flow or effluent BOD yet; enter them before a model run`, [key], at));
    }
    return { feature, attributes };
  });
  return { dischargers, problems };
}
