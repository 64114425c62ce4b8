/**
 * One segment of river with constant parameters: plug flow, steady state, travel time t.
 *   dL/dt = −k_r·L + L_rd,  dN/dt = −k_n·N,  dD/dt = k_d·L + k_n·N − k_a·D + S
 * with k_r = k_d + k_s and S = S_B/H (mg/L/d). Closed forms after Streeter & Phelps (1925),
 * Thomas (1948), Dobbins (1964) and O'Connor (1967); see MODEL.md §4.
 */
import { bracketedRoot } from "./root";

/** Rates (1/d, already at the segment's temperature) and zero-order sources (mg/L/d). */
export interface SegmentRates {
  kd: number;
  kr: number;
  ka: number;
  kn: number;
  /** S_B/H: sediment oxygen demand as mg/L/d. */
  sod: number;
  /** Distributed CBOD load L_rd, mg/L/d. */
  lrd: number;
}

/** L, N, D (mg/L) at one instant. */
export interface SegmentState {
  L: number;
  N: number;
  D: number;
}

/**
 * g(k) = (e^(−k t) − e^(−k_a t))/(k_a − k), evaluated without dividing by a tiny difference:
 * with δ = k_a − k, g = −e^(−k t)·expm1(−δ t)/δ (δ > 0) or e^(−k_a t)·expm1(δ t)/δ (δ < 0),
 * and the series t·e^(−k t)·(1 − δt/2 + (δt)²/6) for |δ t| < 1e-5 (limit t·e^(−k_a t) at δ = 0).
 * Relative accuracy ~1e-15 for all δ, subnormal δ included.
 * Example: `sagKernel(0.2, 0.8, 1)` → 0.6157… ; `sagKernel(0.5, 0.5, 2)` → 0.7358…
 */
export function sagKernel(k: number, ka: number, t: number): number {
  const delta = ka - k;
  const x = delta * t;
  // Series for |δt| < 1e-5: truncation error below 1e-20 relative, and safe for subnormal δ.
  if (Math.abs(x) < 1e-5) return t * Math.exp(-k * t) * (1 - x / 2 + (x * x) / 6);
  if (delta > 0) return (-Math.exp(-k * t) * Math.expm1(-x)) / delta;
  return (Math.exp(-ka * t) * Math.expm1(x)) / delta;
}

/** h(k) = (1 − e^(−k t))/k with the limit t at k = 0. Example: `growthKernel(0.5, 2)` → 1.2642… */
export function growthKernel(k: number, t: number): number {
  const x = k * t;
  if (Math.abs(x) < 1e-5) return t * (1 - x / 2 + (x * x) / 6);
  return -Math.expm1(-x) / k;
}

/**
 * State after travel time `t_day` from head state `head` (closed form, MODEL.md §4):
 *   L(t) = L0·e^(−k_r t) + L_rd·h(k_r)
 *   D(t) = D0·e^(−k_a t) + k_d·L0·g(k_r) + k_n·N0·g(k_n) + k_d·L_rd/k_r·[h(k_a) − g(k_r)] + S·h(k_a)
 * Valid for any non-negative rates with k_a > 0 (k_r > 0 whenever L_rd > 0).
 * Example: rates {kd .2, kr .26, ka .8, kn 0, sod 1, lrd 0}, head {50, 0, 0}, t = 1 → L 38.553, D 6.646…
 */
export function segmentState(r: SegmentRates, head: SegmentState, t_day: number): SegmentState {
  return {
    L: cbodAt(r, head.L, t_day),
    N: head.N * Math.exp(-r.kn * t_day),
    D: deficitAt(r, head.L, head.N, head.D, t_day),
  };
}

/** L(t) (mg/L) of segmentState without allocating: L0·e^(−k_r t) + L_rd·h(k_r). */
export function cbodAt(r: SegmentRates, L0: number, t_day: number): number {
  const L = L0 * Math.exp(-r.kr * t_day);
  return r.lrd === 0 ? L : L + r.lrd * growthKernel(r.kr, t_day);
}

/** D(t) (mg/L) of segmentState without allocating (the hot path of runs and allocation). */
export function deficitAt(r: SegmentRates, L0: number, N0: number, D0: number, t_day: number): number {
  if (t_day === 0) return D0;
  const hKa = growthKernel(r.ka, t_day);
  const gKr = sagKernel(r.kr, r.ka, t_day);
  let D = D0 * Math.exp(-r.ka * t_day) + r.kd * L0 * gKr + r.sod * hKa;
  if (r.kn !== 0 && N0 !== 0) D += r.kn * N0 * sagKernel(r.kn, r.ka, t_day);
  if (r.lrd !== 0 && r.kd !== 0) D += ((r.kd * r.lrd) / r.kr) * (hKa - gKr);
  return D;
}

/**
 * The part of D(t) driven by the head state alone, D0·e^(−k_a t) + k_d·L0·g(k_r): how a load
 * increment [ΔL0, ΔD0] travels (no SOD, NBOD or distributed load, which do not depend on it).
 */
export function incrementDeficitAt(r: SegmentRates, L0: number, D0: number, t_day: number): number {
  return D0 * Math.exp(-r.ka * t_day) + r.kd * L0 * sagKernel(r.kr, r.ka, t_day);
}

/** dD/dt at `t_day` (mg/L/d), from the ODE itself applied to the closed-form state. */
export function deficitRate(r: SegmentRates, head: SegmentState, t_day: number): number {
  return (
    r.kd * cbodAt(r, head.L, t_day) + r.kn * head.N * Math.exp(-r.kn * t_day) - r.ka * deficitAt(r, head.L, head.N, head.D, t_day) + r.sod
  );
}

/** Where the deficit is greatest on [0, T] and how large it is. */
export interface CriticalPoint {
  t_day: number;
  D: number;
  /** `closed-form` (CBOD-only formula), `root` (bracketed root of dD/dt), or `end` (a segment end). */
  how: "closed-form" | "root" | "end";
}

/** Sub-intervals scanned for sign changes of dD/dt when k_a nearly equals k_r or k_n. */
export const CRITICAL_SEARCH_INTERVALS = 16;

/**
 * The exact maximum deficit (= minimum DO at constant C_s) on the segment [0, T].
 * CBOD only (no NBOD, SOD or distributed load): the closed form
 *   t_c = ln{(k_a/k_r)[1 − D0(k_a − k_r)/(k_d·L0)]}/(k_a − k_r),  D_c = (k_d/k_a)·L0·e^(−k_r t_c)
 * (Streeter & Phelps 1925, with settling after Dobbins 1964), evaluated with log1p so that
 * k_a → k_r is stable, and its limit t_c = 1/k − D0/(k_d L0) at k_a = k_r. Otherwise dD/dt is
 * a sum of at most three exponentials, split into pieces with at most one root each (see
 * monotonePieces), and every + → − change is refined by a bracketed root (tolerance 1e-14·T):
 * every interior maximum is found. Only when k_a is within 1e-3/T of k_r or k_n is dD/dt
 * scanned on CRITICAL_SEARCH_INTERVALS sub-intervals instead. End values are always candidates.
 * Example: rates {kd .2, kr .2, ka .8, kn 0, sod 0, lrd 0}, head {L 50, N 0, D 0}, T 10
 * → t 2.3105 d, D 7.875 mg/L (D_c/L0 = (k_d/k_a)^(k_a/(k_a−k_d))).
 */
export function criticalPoint(r: SegmentRates, head: SegmentState, T_day: number): CriticalPoint {
  const endD = deficitAt(r, head.L, head.N, head.D, T_day);
  let best: CriticalPoint = head.D >= endD ? { t_day: 0, D: head.D, how: "end" } : { t_day: T_day, D: endD, how: "end" };
  if (T_day <= 0) return best;
  const cbodOnly = (r.kn === 0 || head.N === 0) && r.sod === 0 && r.lrd === 0;
  if (cbodOnly) {
    const kdL0 = r.kd * head.L;
    if (kdL0 <= 0) return best;
    const delta = r.ka - r.kr;
    let tc: number;
    if (delta === 0) tc = 1 / r.ka - head.D / kdL0;
    else {
      const second = -(head.D * delta) / kdL0;
      if (second <= -1) return best; // log argument ≤ 0: no interior maximum
      tc = (Math.log1p(delta / r.kr) + Math.log1p(second)) / delta;
    }
    if (tc > 0 && tc < T_day) {
      const D = (r.kd / r.ka) * head.L * Math.exp(-r.kr * tc);
      if (D > best.D) best = { t_day: tc, D, how: "closed-form" };
    }
    return best;
  }
  const terms = rateTerms(r, head, T_day);
  const rate = terms ? (t: number) => sumOfExponentials(terms, t) : (t: number) => deficitRate(r, head, t);
  const cuts = terms ? monotonePieces(terms, T_day) : Array.from({ length: CRITICAL_SEARCH_INTERVALS + 1 }, (_, i) => (T_day * i) / CRITICAL_SEARCH_INTERVALS);
  let t0 = cuts[0];
  let f0 = rate(t0);
  for (let i = 1; i < cuts.length; i++) {
    const t1 = cuts[i];
    const f1 = rate(t1);
    if (f0 > 0 && f1 <= 0) {
      const tc = f1 === 0 ? t1 : bracketedRoot(rate, t0, t1, 1e-14 * T_day);
      const D = deficitAt(r, head.L, head.N, head.D, tc);
      if (D > best.D) best = { t_day: tc, D, how: "root" };
    }
    t0 = t1;
    f0 = f1;
  }
  return best;
}

/** dD/dt written as Σ c_i·e^(−λ_i t), rates ascending and distinct. */
type ExpTerms = Array<{ c: number; lambda: number }>;

function sumOfExponentials(terms: ExpTerms, t: number): number {
  let f = 0;
  for (const x of terms) f += x.c * Math.exp(-x.lambda * t);
  return f;
}

/**
 * dD/dt = −k_a·A·e^(−k_a t) − k_r·B·e^(−k_r t) − k_n·C·e^(−k_n t) with
 * B = k_d(L0 − L_rd/k_r)/(k_a − k_r), C = k_n·N0/(k_a − k_n), E = (k_d·L_rd/k_r + S)/k_a,
 * A = D0 − B − C − E (the constant terms cancel). Undefined — returns null, and the caller
 * scans instead — when k_a is within 1e-3/T of k_r or k_n, where B or C would lose digits.
 */
function rateTerms(r: SegmentRates, head: SegmentState, T_day: number): ExpTerms | null {
  const near = (k: number) => Math.abs(r.ka - k) * T_day < 1e-3;
  const hasN = r.kn !== 0 && head.N !== 0;
  if (near(r.kr) || (hasN && near(r.kn)) || (r.lrd !== 0 && r.kr === 0)) return null;
  const L1 = r.lrd === 0 ? head.L : head.L - r.lrd / r.kr;
  const B = (r.kd * L1) / (r.ka - r.kr);
  const C = hasN ? (r.kn * head.N) / (r.ka - r.kn) : 0;
  const E = ((r.lrd === 0 || r.kd === 0 ? 0 : (r.kd * r.lrd) / r.kr) + r.sod) / r.ka;
  const A = head.D - B - C - E;
  const raw = [
    { c: -r.ka * A, lambda: r.ka },
    { c: -r.kr * B, lambda: r.kr },
    { c: -r.kn * C, lambda: r.kn },
  ].sort((a, b) => a.lambda - b.lambda);
  const terms: ExpTerms = [];
  for (const x of raw) {
    if (x.c === 0) continue;
    const last = terms[terms.length - 1];
    if (last && last.lambda === x.lambda) last.c += x.c;
    else terms.push({ ...x });
  }
  return terms;
}

/**
 * Points splitting [0, T] into pieces on each of which Σ c_i·e^(−λ_i t) (at most three terms)
 * has at most one root. With g = f·e^(λ1 t) = c1 + c2·e^(−μ2 t) + c3·e^(−μ3 t), g′ has two
 * terms and so at most one root t*, in closed form; g is monotone on either side of it, and
 * f shares g's sign (Rolle's theorem; the rule of signs for exponential sums).
 */
function monotonePieces(terms: ExpTerms, T_day: number): number[] {
  if (terms.length < 3) return [0, T_day];
  const [a, b, c] = terms;
  const mu2 = b.lambda - a.lambda;
  const mu3 = c.lambda - a.lambda;
  const ratio = -(c.c * mu3) / (b.c * mu2);
  if (!(ratio > 0)) return [0, T_day];
  const tStar = Math.log(ratio) / (mu3 - mu2);
  return tStar > 0 && tStar < T_day ? [0, tStar, T_day] : [0, T_day];
}
