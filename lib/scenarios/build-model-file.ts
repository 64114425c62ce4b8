import { cbodToBod5Ratio, loadKgPerDay, type ConditionInput, type DischargerInput, type HeadwaterInput, type ModelFile, type ReachInput } from "@/lib/model";
import type { ConditionInputs, ScenarioInputs } from "@/lib/validation/scenario";
import { DEFAULT_HEADWATER_DO_TEXT, defaultHeadwaterDoMgL, networkOutletFlowM3s } from "./design-defaults";

/** A saved network as the builder needs it (SI attributes as imported). */
export interface NetworkForModel {
  reaches: { id: string; downstreamId: string | null; lengthKm: number; attributes: Record<string, unknown> }[];
  outfalls: { permitId: string; reachId: string; chainageKm: number; attributes: Record<string, unknown> }[];
}

/** A problem that stops a model file being built; `path` names the scenario or network field. */
export class ScenarioInputError extends Error {
  constructor(
    readonly path: string,
    message: string,
  ) {
    super(message);
    this.name = "ScenarioInputError";
  }
}

const num = (v: unknown): number | undefined => (typeof v === "number" && Number.isFinite(v) ? v : undefined);

/** Default effluent DO when neither the network nor the scenario gives one (mg/L; common practice for secondary effluent). */
export const DEFAULT_EFFLUENT_DO_MG_L = 2;
/** Default bottle rate k1 (1/d), MODEL.md §1. */
export const DEFAULT_BOTTLE_K_PER_DAY = 0.23;

/**
 * The factor on every reach's network design flow under a condition: the gauge statistic's
 * value over the network's design flow at the gauge's reach when the condition takes its flow
 * from a gauge; the ratio of the condition's outlet flow to the network's when the planner
 * entered one; else flowScale.
 * Example: network outlet 2.0 m³/s, outletFlowM3s 1.5 → 0.75.
 */
export function conditionFlowScale(network: NetworkForModel, condition: ConditionInputs, conditionPath: string): number {
  const gauge = condition.gaugeFlow ?? null;
  if (gauge) {
    const source = gauge.source;
    if (!source) throw new ScenarioInputError(`${conditionPath}.gaugeFlow`, `Condition "${condition.name}": save the scenario again so the gauge's ${gauge.statistic} is read`);
    const reach = network.reaches.find((r) => r.id === source.reachId);
    const own = reach ? num(reach.attributes.designFlowM3s) : undefined;
    if (own === undefined || !(own > 0)) {
      throw new ScenarioInputError(
        `${conditionPath}.gaugeFlow`,
        `Condition "${condition.name}": the gauge's reach ${source.reachId} has ${reach ? "no design flow" : "no place"} in this network version to scale from`,
      );
    }
    return source.valueM3s / own;
  }
  const outlet = condition.outletFlowM3s ?? null;
  if (outlet === null) return condition.flowScale;
  const own = networkOutletFlowM3s(network.reaches);
  if (own === undefined) {
    throw new ScenarioInputError(
      `${conditionPath}.outletFlowM3s`,
      `Condition "${condition.name}": the network gives no design flow at the outlet to scale from; enter the design flow reach by reach instead`,
    );
  }
  return outlet / own;
}

/**
 * The natural (upstream of effluents) design flow added at the head of each
 * reach under one condition: the reach's design flow minus that of the reaches
 * flowing into it; a headwater the condition's gauge statistic is carried to by
 * drainage-area ratio gets that flow instead. Returns m³/s per reach id; warnings
 * for negative increments.
 */
export function flowIncrements(network: NetworkForModel, condition: ConditionInputs, conditionPath: string, warnings: string[]): Map<string, number> {
  const natural = new Map<string, number>();
  const scale = conditionFlowScale(network, condition, conditionPath);
  for (const r of network.reaches) {
    const q = condition.reachFlowsM3s[r.id] ?? (num(r.attributes.designFlowM3s) !== undefined ? num(r.attributes.designFlowM3s)! * scale : undefined);
    if (q === undefined) {
      throw new ScenarioInputError(
        `${conditionPath}.reachFlowsM3s.${r.id}`,
        `Reach ${r.id} has no design flow: enter one in condition "${condition.name}" or in the network table`,
      );
    }
    natural.set(r.id, q);
  }
  const upstreamSum = new Map<string, number>();
  for (const r of network.reaches) {
    if (r.downstreamId) upstreamSum.set(r.downstreamId, (upstreamSum.get(r.downstreamId) ?? 0) + natural.get(r.id)!);
  }
  const out = new Map<string, number>();
  for (const r of network.reaches) {
    const inc = natural.get(r.id)! - (upstreamSum.get(r.id) ?? 0);
    if (inc < -1e-9) {
      warnings.push(
        `Condition "${condition.name}": the design flow of ${r.id} (${natural.get(r.id)!.toFixed(4)} m³/s) is below the sum of the reaches flowing into it; no inflow is added there`,
      );
    }
    out.set(r.id, Math.max(0, inc));
  }
  // a gauge's statistic carried to headwaters by drainage-area ratio (recorded when the scenario was saved)
  const transfers = condition.gaugeFlow?.headwaters === "drainage-area" ? condition.gaugeFlow.source?.transfers : undefined;
  if (condition.gaugeFlow?.headwaters === "drainage-area" && !transfers) {
    throw new ScenarioInputError(`${conditionPath}.gaugeFlow`, `Condition "${condition.name}": save the scenario again so the drainage-area transfer is worked out`);
  }
  for (const t of transfers?.headwaters ?? []) {
    if (!out.has(t.reach)) {
      throw new ScenarioInputError(`${conditionPath}.gaugeFlow`, `Condition "${condition.name}": headwater ${t.reach} is not in this network version; save the scenario again`);
    }
    if (condition.reachFlowsM3s[t.reach] === undefined) out.set(t.reach, t.flowM3s);
  }
  return out;
}

/**
 * Where a reach's velocity and depth come from: hydraulic-geometry coefficients (U = a·Q^b,
 * H = c·Q^f, all four) or a Manning channel (n, bottom width, the reach's slope; side slope
 * optional) make them follow each condition's flow (MODEL.md §5) — one or the other, not
 * both; otherwise the velocity and depth entered at design flow are used at every flow.
 */
function reachHydraulics(r: NetworkForModel["reaches"][number]): Pick<ReachInput, "velocity_m_s" | "depth_m" | "manning" | "hydraulic_geometry"> {
  const a = r.attributes;
  const hg = [num(a.hgVelocityCoef), num(a.hgVelocityExp), num(a.hgDepthCoef), num(a.hgDepthExp)];
  if (hg.some((v) => v !== undefined)) {
    const names = ["the velocity coefficient a", "the velocity exponent b", "the depth coefficient c", "the depth exponent f"];
    const missing = names.filter((_, i) => hg[i] === undefined);
    if (missing.length) {
      throw new ScenarioInputError(`network.reaches.${r.id}`, `Reach ${r.id} has part of a hydraulic geometry: add ${missing.join(", ")} in the network table, or clear it`);
    }
    if (num(a.manningN) !== undefined || num(a.bottomWidthM) !== undefined) {
      throw new ScenarioInputError(`network.reaches.${r.id}`, `Reach ${r.id} has both a hydraulic geometry and a Manning channel: keep one in the network table`);
    }
    return { hydraulic_geometry: { a: hg[0]!, b: hg[1]!, c: hg[2]!, f: hg[3]! } };
  }
  const n = num(a.manningN);
  const width = num(a.bottomWidthM);
  if (n !== undefined || width !== undefined) {
    const missing = [n === undefined && "Manning's n", width === undefined && "a bottom width", num(a.slope) === undefined && "a slope"].filter(Boolean);
    if (missing.length) {
      throw new ScenarioInputError(`network.reaches.${r.id}`, `Reach ${r.id} has part of a Manning channel: add ${missing.join(" and ")} in the network table, or clear it`);
    }
    const side = num(a.sideSlope);
    return { manning: { n: n!, bottom_width_m: width!, ...(side !== undefined ? { side_slope: side } : {}) } };
  }
  const velocity = num(a.velocityMps);
  const depth = num(a.depthM);
  if (velocity === undefined || depth === undefined) {
    throw new ScenarioInputError(
      `network.reaches.${r.id}`,
      `Reach ${r.id} needs a velocity and a depth at design flow, or a Manning channel (n, bottom width, slope); add them in the network table`,
    );
  }
  return { velocity_m_s: velocity, depth_m: depth };
}

function reachInput(r: NetworkForModel["reaches"][number], inputs: ScenarioInputs, condition: ConditionInputs): ReachInput {
  const a = r.attributes;
  const o = inputs.reachOverrides[r.id] ?? {};
  const k = inputs.kinetics;
  const hydraulics = reachHydraulics(r);
  const givenKa = o.ka20PerDay ?? (o.kaMethod == null ? num(a.reaerationRatePerDay) : undefined);
  const method = givenKa !== undefined ? "given" : (o.kaMethod ?? k.kaMethod);
  if (method === "given" && givenKa === undefined) {
    throw new ScenarioInputError(`inputs.reachOverrides.${r.id}.ka20PerDay`, `Reach ${r.id}: reaeration is "given" but no k_a value is entered`);
  }
  const temperature = condition.temperatureC ?? num(a.temperatureC);
  return withFitted(inputs, r.id, {
    id: r.id,
    downstream: r.downstreamId,
    length_km: r.lengthKm,
    ...hydraulics,
    kd20_per_day: o.kd20PerDay ?? num(a.deoxygenationRatePerDay) ?? k.kd20PerDay,
    ...(givenKa !== undefined ? { ka20_per_day: givenKa } : {}),
    ka_method: method,
    ka_floor: k.kaFloor,
    ...(num(a.slope) !== undefined ? { slope_m_m: num(a.slope) } : {}),
    ks20_per_day: o.ks20PerDay ?? num(a.settlingRatePerDay) ?? k.ks20PerDay,
    kn20_per_day: o.kn20PerDay ?? k.kn20PerDay,
    sod20_g_m2_day: o.sod20GPerM2Day ?? num(a.sodGPerM2PerDay) ?? k.sod20GPerM2Day,
    ...(temperature !== undefined ? { temperature_c: temperature } : {}),
    ...(num(a.elevationM) !== undefined ? { elevation_m: num(a.elevationM) } : {}),
  });
}

/**
 * The reach with the coefficients a calibration fitted over it (inputs.fittedKinetics, its
 * values as recorded when the scenario was saved): they replace the network's, the
 * scenario's defaults and its reach overrides for those coefficients.
 */
function withFitted(inputs: ScenarioInputs, reachId: string, reach: ReachInput): ReachInput {
  if (!inputs.fittedKinetics) return reach;
  const fitted = inputs.fittedKinetics.source?.parameters;
  if (!fitted) throw new ScenarioInputError("inputs.fittedKinetics", "The fitted coefficients have no record of their calibration: save the scenario again");
  const out = { ...reach };
  for (const p of fitted) if (p.reaches.includes(reachId)) out[p.parameter] = p.value;
  return out;
}

function dischargerInput(o: NetworkForModel["outfalls"][number], inputs: ScenarioInputs, warnings: string[]): DischargerInput {
  const a = o.attributes;
  const s = inputs.dischargers[o.permitId] ?? {};
  const flow = s.designFlowM3s ?? num(a.designFlowM3s);
  if (flow === undefined) {
    throw new ScenarioInputError(`inputs.dischargers.${o.permitId}.designFlowM3s`, `Discharger ${o.permitId} has no design flow; enter one`);
  }
  const cbodu = s.cbodUMgL ?? (s.bod5MgL == null ? num(a.effluentCbodUMgL) : undefined);
  const bod5 = cbodu === undefined ? (s.bod5MgL ?? num(a.effluentBod5MgL)) : undefined;
  if (cbodu === undefined && bod5 === undefined) {
    throw new ScenarioInputError(`inputs.dischargers.${o.permitId}.bod5MgL`, `Discharger ${o.permitId} has no effluent BOD5 or CBODu; enter today's effluent quality`);
  }
  const doMgL = s.doMgL ?? num(a.dissolvedOxygenMgL);
  if (doMgL === undefined) warnings.push(`Discharger ${o.permitId}: no effluent DO given; ${DEFAULT_EFFLUENT_DO_MG_L} mg/L assumed`);
  const temperature = s.temperatureC ?? num(a.temperatureC) ?? inputs.headwater.temperatureC;
  return {
    id: o.permitId,
    reach: o.reachId,
    km: o.chainageKm,
    flow_m3_s: flow,
    ...(cbodu !== undefined ? { cbodu_mg_l: cbodu } : { bod5_mg_l: bod5 }),
    bottle_k_per_day: s.bottleKPerDay ?? num(a.bottleRatePerDay) ?? DEFAULT_BOTTLE_K_PER_DAY,
    do_mg_l: doMgL ?? DEFAULT_EFFLUENT_DO_MG_L,
    temperature_c: temperature,
  };
}

function headwaters(network: NetworkForModel, inputs: ScenarioInputs, condition: ConditionInputs, increments: Map<string, number>): HeadwaterInput[] {
  const hw = inputs.headwater;
  return network.reaches
    .filter((r) => (increments.get(r.id) ?? 0) > 0)
    .map((r) => {
      const o = inputs.inflowOverrides[r.id] ?? {};
      const nbodu = o.nbodUMgL ?? hw.nbodUMgL;
      const temperature = condition.temperatureC ?? num(r.attributes.temperatureC) ?? hw.temperatureC;
      return {
        reach: r.id,
        flow_m3_s: increments.get(r.id)!,
        cbodu_mg_l: o.cbodUMgL ?? hw.cbodUMgL,
        ...(nbodu > 0 ? { nbodu_mg_l: nbodu } : {}),
        do_mg_l: o.doMgL ?? hw.doMgL ?? defaultHeadwaterDoMgL(temperature, num(r.attributes.elevationM) ?? 0),
        temperature_c: temperature,
      };
    });
}

/**
 * A discharger already cleaner than the technology floor cannot be given the
 * floor as its minimum (today's load is the ceiling): its minimum becomes
 * today's load, i.e. it keeps what it achieves now.
 */
function floorBounds(dischargers: DischargerInput[], floorBod5MgL: number | null, warnings: string[]) {
  const bounds: Record<string, { min_kg_day: number; max_kg_day: number }> = {};
  if (floorBod5MgL === null) return bounds;
  for (const d of dischargers) {
    const f = cbodToBod5Ratio(d.bottle_k_per_day ?? DEFAULT_BOTTLE_K_PER_DAY);
    const cbodu = d.cbodu_mg_l ?? (d.bod5_mg_l ?? 0) * f;
    const today = loadKgPerDay(d.flow_m3_s, cbodu);
    if (loadKgPerDay(d.flow_m3_s, floorBod5MgL * f) > today) {
      bounds[d.id] = { min_kg_day: today, max_kg_day: today };
      warnings.push(`Discharger ${d.id} already discharges below the ${floorBod5MgL} mg/L BOD5 floor; its minimum is today's load`);
    }
  }
  return bounds;
}

export interface BuiltModelFile {
  file: ModelFile;
  warnings: string[];
}

/**
 * The model file (MODEL.md §8) for a scenario on a network: the first
 * condition is the file's own; the others travel as allocation conditions
 * (temperatures and headwater flows), so one LP covers them all. Natural
 * design flow enters each reach's head as the increment over its upstream
 * reaches, with the scenario's headwater quality. Throws ScenarioInputError
 * naming the field at fault.
 */
export function buildModelFile(network: NetworkForModel, inputs: ScenarioInputs, basinCriterionMgL: number, withAllocation: boolean): BuiltModelFile {
  if (network.reaches.length === 0) throw new ScenarioInputError("network", "The network has no reaches");
  const warnings: string[] = [];
  const [main, ...others] = inputs.conditions;
  const mainIncrements = flowIncrements(network, main, "inputs.conditions.0", warnings);
  const mainHeadwaters = headwaters(network, inputs, main, mainIncrements);
  const saturated = mainHeadwaters.filter((h) => (inputs.inflowOverrides[h.reach]?.doMgL ?? inputs.headwater.doMgL) == null);
  if (saturated.length > 0) {
    const dos = saturated.map((h) => h.do_mg_l);
    const [lo, hi] = [Math.min(...dos).toFixed(2), Math.max(...dos).toFixed(2)];
    warnings.push(
      `No DO given for headwater and tributary water: ${DEFAULT_HEADWATER_DO_TEXT} is used at ${saturated.length} inflow(s), ${lo === hi ? `${lo} mg/L` : `${lo}–${hi} mg/L`} under "${main.name}"`,
    );
  }
  const file: ModelFile = {
    reaches: network.reaches.map((r) => reachInput(r, inputs, main)),
    headwaters: mainHeadwaters,
    dischargers: network.outfalls.map((o) => dischargerInput(o, inputs, warnings)),
    criterion_do_mg_l: inputs.criterionDoMgL ?? basinCriterionMgL,
    step_km: inputs.stepKm,
    kinetics: { deoxygenation_rule: inputs.kinetics.thetaRule },
  };
  if (withAllocation) {
    const conditions: ConditionInput[] = others.map((c, i) => {
      // One model file carries every condition: a condition sets all reach temperatures, or
      // leaves the file's own. Under a first condition that sets one, a condition that sets
      // none would silently take the first one's, not the reaches' own (as its model run does).
      if (main.temperatureC !== null && c.temperatureC === null) {
        throw new ScenarioInputError(
          `inputs.conditions.${i + 1}.temperatureC`,
          `Condition "${c.name}" gives no water temperature while "${main.name}" sets ${main.temperatureC} °C; in an allocation every condition is checked in one model file, so give "${c.name}" a temperature too (or put the condition without one first)`,
        );
      }
      const inc = flowIncrements(network, c, `inputs.conditions.${i + 1}`, warnings);
      const hws = headwaters(network, inputs, c, inc);
      const sameReaches =
        hws.length === file.headwaters.length && hws.every((h) => file.headwaters.some((m) => m.reach === h.reach));
      if (!sameReaches) {
        throw new ScenarioInputError(
          `inputs.conditions.${i + 1}`,
          `Condition "${c.name}" brings inflow in at other reaches than "${main.name}" does; give every condition flow entering at the same reaches`,
        );
      }
      return {
        name: c.name,
        ...(c.temperatureC !== null ? { temperature_c: c.temperatureC } : {}),
        headwaters: file.headwaters.map((m) => {
          const h = hws.find((x) => x.reach === m.reach)!;
          // a DO taken from saturation follows the condition's temperature; a DO the scenario gives stays the file's own
          const fromSaturation = (inputs.inflowOverrides[m.reach]?.doMgL ?? inputs.headwater.doMgL) == null;
          return { reach: m.reach, flow_m3_s: h.flow_m3_s, temperature_c: h.temperature_c, ...(fromSaturation ? { do_mg_l: h.do_mg_l } : {}) };
        }),
      };
    });
    const al = inputs.allocation;
    const bounds = floorBounds(file.dischargers, al.floorBod5MgL, warnings);
    file.allocation = {
      objective: al.objective,
      ...(al.floorBod5MgL !== null ? { floor_bod5_mg_l: al.floorBod5MgL } : {}),
      mos_do_mg_l: al.mosDoMgL,
      mos_fraction: al.mosFraction,
      reserve_fraction: al.reserveFraction,
      ...(conditions.length ? { conditions } : {}),
      ...(Object.keys(bounds).length ? { bounds } : {}),
    };
  }
  return { file, warnings };
}

/** Single-condition model files, one per condition (for model runs on today's loads). */
export function buildConditionFiles(network: NetworkForModel, inputs: ScenarioInputs, basinCriterionMgL: number): { name: string; file: ModelFile; warnings: string[] }[] {
  return inputs.conditions.map((c) => {
    const built = buildModelFile(network, { ...inputs, conditions: [c] }, basinCriterionMgL, false);
    return { name: c.name, ...built };
  });
}
