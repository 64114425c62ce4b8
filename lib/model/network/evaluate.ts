import { cbodAt, deficitAt } from "../segment";
import type { Plan } from "./plan";

/** Head and end state (mg/L) of every segment, indexed like Plan.segments. */
export interface States {
  headL: Float64Array;
  headN: Float64Array;
  headD: Float64Array;
  endL: Float64Array;
  endN: Float64Array;
  endD: Float64Array;
}

/** Part of the deficit to follow alone (superposition); `all` is the ordinary run. */
export type Component = "all" | "background" | "sod" | "dischargers";

export interface EvaluateOptions {
  /** CBODu concentration (mg/L) of each source, overriding the plan's (length = plan.sources.length). */
  sourceL?: ArrayLike<number>;
  /** Follow only one part of the deficit; the parts background + sod + dischargers sum to `all`. Default `all`. */
  component?: Component;
}

/**
 * Runs the load-dependent part of the model over a Plan, upstream → downstream.
 * At every head the inflows are mixed as concentrations, by flow:
 *   L = ΣQ_i·L_i/Q,  N = ΣQ_i·N_i/Q,  DO = ΣQ_i·DO_i/Q,  D = C_s − DO,
 * written as D = ΣQ_i·(C_s − DO_i)/Q so that each term can be assigned to a component.
 * Each segment then follows the closed form of segment.ts. Throws nothing for valid plans.
 */
export function evaluatePlan(plan: Plan, options: EvaluateOptions = {}): States {
  const n = plan.segments.length;
  const s: States = {
    headL: new Float64Array(n),
    headN: new Float64Array(n),
    headD: new Float64Array(n),
    endL: new Float64Array(n),
    endN: new Float64Array(n),
    endD: new Float64Array(n),
  };
  const component = options.component ?? "all";
  const srcL = options.sourceL;
  const withBackground = component === "all" || component === "background";
  const withDischargers = component === "all" || component === "dischargers";
  for (let i = 0; i < n; i++) {
    const seg = plan.segments[i];
    const cs = seg.cs_mg_l;
    let qL = 0;
    let qN = 0;
    let qD = 0;
    for (const u of seg.inflow_segments) {
      const us = plan.segments[u];
      const q = us.flow_m3_s;
      qL += q * s.endL[u];
      qN += q * s.endN[u];
      // C_s − DO_u = D_u + (C_s − C_s,u): the saturation change belongs to the background.
      qD += q * (s.endD[u] + (withBackground ? cs - us.cs_mg_l : 0));
    }
    for (const si of seg.sources) {
      const src = plan.sources[si];
      const own = src.kind === "discharger" ? withDischargers : withBackground;
      if (!own) continue;
      const q = src.flow_m3_s;
      qL += q * (srcL ? srcL[si] : src.L);
      qN += q * src.N;
      qD += q * (cs - src.DO);
    }
    const Q = seg.flow_m3_s;
    const L0 = qL / Q;
    const N0 = qN / Q;
    const D0 = qD / Q;
    s.headL[i] = L0;
    s.headN[i] = N0;
    s.headD[i] = D0;
    const rates = componentRates(seg.rates, component);
    s.endL[i] = cbodAt(rates, L0, seg.t_day);
    s.endN[i] = N0 * Math.exp(-rates.kn * seg.t_day);
    s.endD[i] = deficitAt(rates, L0, N0, D0, seg.t_day);
  }
  return s;
}

/** Rates of a segment as seen by one component (SOD only in `sod`, L_rd only in `background`). */
export function componentRates(rates: Plan["segments"][number]["rates"], component: Component): Plan["segments"][number]["rates"] {
  if (component === "all") return rates;
  if (component === "sod") return { ...rates, lrd: 0 };
  if (component === "background") return { ...rates, sod: 0 };
  return { ...rates, sod: 0, lrd: 0 };
}
