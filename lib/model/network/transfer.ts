import { LOAD_FACTOR } from "../units";
import { incrementDeficitAt } from "../segment";
import type { Location } from "./profile";
import type { Plan } from "./plan";

/** A unit increment of one source's CBODu load, followed down its path. */
export interface TransferPath {
  /** Segment → position in dL/dD. */
  index: Map<number, number>;
  /** Increments (mg/L per kg/d) of L and D at the head of each segment on the path. */
  dL: Float64Array;
  dD: Float64Array;
}

/**
 * Transfer coefficients by propagation (MODEL.md §6): 1 kg/d more CBODu from source `source`
 * raises L at its mixing head by 1/(86.4·Q); the increment [ΔL, ΔD] then decays through each
 * segment by the homogeneous closed form (ΔD(t) = ΔD0·e^(−k_a t) + k_d·ΔL0·g(k_r)) and is
 * diluted by Q_above/Q_below at every node. Flows and temperatures are load-independent, so
 * the model is affine in the load and this is exact (no finite differences, no re-runs).
 */
export function transferPath(plan: Plan, source: number): TransferPath {
  const src = plan.sources[source];
  const index = new Map<number, number>();
  const segs: number[] = [];
  const dLs: number[] = [];
  const dDs: number[] = [];
  let s = src.segment;
  let dL = 1 / (LOAD_FACTOR * plan.segments[s].flow_m3_s);
  let dD = 0;
  while (s >= 0) {
    const seg = plan.segments[s];
    index.set(s, segs.length);
    segs.push(s);
    dLs.push(dL);
    dDs.push(dD);
    const next = seg.next;
    if (next < 0) break;
    const dilution = seg.flow_m3_s / plan.segments[next].flow_m3_s;
    const endD = incrementDeficitAt(seg.rates, dL, dD, seg.t_day);
    dL = dL * Math.exp(-seg.rates.kr * seg.t_day) * dilution;
    dD = endD * dilution;
    s = next;
  }
  return { index, dL: Float64Array.from(dLs), dD: Float64Array.from(dDs) };
}

/**
 * a = −∂DO/∂W at a location (mg/L per kg/d of CBODu) for one transfer path; 0 when the
 * location is not downstream of the source.
 * Example: a single reach, Q 10 m³/s, at the outfall → 0; 1 d below → k_d·g(k_r)/(86.4·10).
 */
export function transferAt(plan: Plan, path: TransferPath, loc: Location): number {
  const k = path.index.get(loc.segment);
  if (k === undefined) return 0;
  const seg = plan.segments[loc.segment];
  return incrementDeficitAt(seg.rates, path.dL[k], path.dD[k], loc.t_day);
}
