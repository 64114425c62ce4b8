import gammaQuantile from "@stdlib/stats-base-dists-gamma-quantile";
import normalQuantile from "@stdlib/stats-base-dists-normal-quantile";

/**
 * Low-flow statistics from a daily flow record: n-day minimum flows by climatic year,
 * fitted with the log-Pearson Type III distribution by the method of moments on the
 * base-10 logarithms, as design flows such as 7Q10 (the lowest 7-day mean flow expected
 * once in 10 years on average). Pure; flows in any one unit, returned in the same unit.
 */

/** One day of a record: an ISO date (YYYY-MM-DD) and its mean flow (null: missing). */
export interface DailyFlow {
  date: string;
  flow: number | null;
}

/** A design flow: the n-day minimum with a T-year return period (non-exceedance 1/T). */
export interface DesignFlowSpec {
  name: string;
  days: number;
  returnPeriodYears: number;
}

/** The usual design flows of water-quality planning. */
export const DESIGN_FLOWS: readonly DesignFlowSpec[] = [
  { name: "1Q10", days: 1, returnPeriodYears: 10 },
  { name: "7Q10", days: 7, returnPeriodYears: 10 },
  { name: "30Q5", days: 30, returnPeriodYears: 5 },
  { name: "7Q2", days: 7, returnPeriodYears: 2 },
];

/** The first day of the climatic year used for low flows: 1 April (common practice), so one dry season is not split across years. */
export const DEFAULT_CLIMATIC_YEAR_START = "04-01";

/** Fewer complete years than this and the statistics are warned as uncertain (common practice: at least 10). */
export const MIN_YEARS = 10;

export interface AnnualMinimum {
  /** The calendar year in which the climatic year starts (climatic year 2020 runs 1 Apr 2020 – 31 Mar 2021). */
  year: number;
  /** Lowest mean flow over `days` consecutive days within the year. */
  flow: number;
}

export interface Lp3Fit {
  /** Mean, standard deviation (n − 1) and skew coefficient (bias-corrected) of log10 of the non-zero annual minima. */
  mean_log10: number;
  sd_log10: number;
  skew: number;
  /** Years fitted (non-zero minima) and years with a zero minimum. */
  years: number;
  zero_years: number;
}

export interface DesignFlowResult {
  name: string;
  days: number;
  return_period_years: number;
  /** From the fitted log-Pearson III distribution (null when it cannot be fitted: fewer than 3 non-zero years). */
  value: number | null;
  /** From the ranked annual minima (Weibull plotting position m/(n+1), interpolated in log flow), null outside the record's range. */
  empirical: number | null;
}

export interface LowFlowReport {
  years_used: number;
  years_excluded: number;
  /** Years left out because a day was missing, by climatic year. */
  excluded: number[];
  statistics: DesignFlowResult[];
  lp3: Record<string, Lp3Fit>;
  /** Annual minima by duration (days), for the frequency plot. */
  annual_minima: Record<string, AnnualMinimum[]>;
  warnings: string[];
}

const DAY_MS = 86_400_000;
const ISO = /^(\d{4})-(\d{2})-(\d{2})$/;

function dayNumber(date: string): number {
  const m = ISO.exec(date);
  if (!m) throw new RangeError(`"${date}" is not an ISO date (YYYY-MM-DD)`);
  const t = Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]));
  if (new Date(t).toISOString().slice(0, 10) !== date) throw new RangeError(`"${date}" is not a date of the calendar`);
  return t / DAY_MS;
}

const isoOf = (day: number) => new Date(day * DAY_MS).toISOString().slice(0, 10);

/** Days of a record by day number, read once per record (the durations of one report share it). */
const indexes = new WeakMap<readonly DailyFlow[], { byDay: Map<number, number | null>; first: number; last: number }>();
function indexed(record: readonly DailyFlow[]) {
  let index = indexes.get(record);
  if (!index) {
    const byDay = new Map<number, number | null>();
    let first = Infinity;
    let last = -Infinity;
    for (const d of record) {
      const day = dayNumber(d.date);
      byDay.set(day, d.flow);
      if (day < first) first = day;
      if (day > last) last = day;
    }
    index = { byDay, first, last };
    indexes.set(record, index);
  }
  return index;
}

/** A year as the four digits of an ISO date (years before 1000 padded: 0812). */
const yyyy = (year: number) => String(year).padStart(4, "0");

/** The climatic year a day belongs to (the calendar year in which that climatic year starts). */
export function climaticYear(date: string, start = DEFAULT_CLIMATIC_YEAR_START): number {
  const y = Number(date.slice(0, 4));
  return date.slice(5) >= start ? y : y - 1;
}

/**
 * The `days`-day minimum of every complete climatic year of the record: the lowest mean of
 * `days` consecutive daily flows whose window lies inside the year. A year with a missing
 * day (absent from the record or null) is excluded, as is a partial first or last year.
 */
export function annualMinima(record: readonly DailyFlow[], days: number, start = DEFAULT_CLIMATIC_YEAR_START): { minima: AnnualMinimum[]; excluded: number[] } {
  if (!Number.isInteger(days) || days < 1) throw new RangeError("days must be a whole number of at least 1");
  const { byDay, first, last } = indexed(record);
  if (byDay.size === 0) return { minima: [], excluded: [] };
  const years: number[] = [];
  for (let y = climaticYear(isoOf(first), start); y <= climaticYear(isoOf(last), start); y++) years.push(y);
  const minima: AnnualMinimum[] = [];
  const excluded: number[] = [];
  for (const year of years) {
    const from = dayNumber(`${yyyy(year)}-${start}`);
    const to = dayNumber(`${yyyy(year + 1)}-${start}`) - 1;
    const flows: number[] = [];
    let complete = true;
    for (let day = from; day <= to; day++) {
      const f = byDay.get(day);
      if (f === undefined || f === null || !Number.isFinite(f)) {
        complete = false;
        break;
      }
      flows.push(f);
    }
    if (!complete || flows.length < days) {
      excluded.push(year);
      continue;
    }
    let sum = 0;
    for (let i = 0; i < days; i++) sum += flows[i];
    let low = sum;
    for (let i = days; i < flows.length; i++) {
      sum += flows[i] - flows[i - days];
      if (sum < low) low = sum;
    }
    minima.push({ year, flow: low / days });
  }
  return { minima, excluded };
}

/** Method-of-moments log-Pearson III parameters of positive values (skew with the usual n/((n−1)(n−2)) correction). */
export function fitLp3(values: readonly number[]): Lp3Fit {
  const positive = values.filter((v) => v > 0);
  const logs = positive.map((v) => Math.log10(v));
  const n = logs.length;
  const mean = logs.reduce((s, x) => s + x, 0) / n;
  const m2 = logs.reduce((s, x) => s + (x - mean) ** 2, 0);
  const m3 = logs.reduce((s, x) => s + (x - mean) ** 3, 0);
  const sd = Math.sqrt(m2 / (n - 1));
  const skew = n > 2 && sd > 0 ? (n * m3) / ((n - 1) * (n - 2) * sd ** 3) : 0;
  return { mean_log10: mean, sd_log10: sd, skew, years: n, zero_years: values.length - n };
}

/**
 * The Pearson Type III frequency factor K for skew `g` at non-exceedance probability `p`
 * (the standardised quantile): through the gamma distribution that Pearson III is, shifted
 * and scaled — for g > 0, K = (G_p − α)/√α with G ~ Gamma(α = 4/g², 1); for g < 0 the
 * mirror image; for |g| below 1e-6, the normal quantile.
 */
export function frequencyFactor(g: number, p: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError("p must lie strictly between 0 and 1");
  if (Math.abs(g) < 1e-6) return normalQuantile(p, 0, 1);
  const alpha = 4 / (g * g);
  const k = (gammaQuantile(g > 0 ? p : 1 - p, alpha, 1) - alpha) / Math.sqrt(alpha);
  return g > 0 ? k : -k;
}

/**
 * The flow with non-exceedance probability p = 1/T from a log-Pearson III fit, with the
 * usual treatment of zero flows: the distribution is fitted to the non-zero years only and
 * p is adjusted to the conditional probability (p − p0)/(1 − p0), p0 the share of zero
 * years; when p ≤ p0 the design flow is zero.
 */
export function lp3Quantile(fit: Lp3Fit, returnPeriodYears: number): number {
  const p = 1 / returnPeriodYears;
  const p0 = fit.zero_years / (fit.years + fit.zero_years);
  if (p <= p0) return 0;
  const pc = (p - p0) / (1 - p0);
  return 10 ** (fit.mean_log10 + frequencyFactor(fit.skew, pc) * fit.sd_log10);
}

/** The empirical T-year low flow from ranked minima: Weibull plotting positions m/(n+1), interpolated in log flow; null outside the record's range. */
export function empiricalQuantile(minima: readonly number[], returnPeriodYears: number): number | null {
  const sorted = [...minima].sort((a, b) => a - b);
  const n = sorted.length;
  const p = 1 / returnPeriodYears;
  const pos = p * (n + 1) - 1; // zero-based rank
  if (n === 0 || pos < 0 || pos > n - 1) return null;
  const lo = Math.floor(pos);
  const hi = Math.min(lo + 1, n - 1);
  const f = pos - lo;
  const [a, b] = [sorted[lo], sorted[hi]];
  if (a <= 0 || b <= 0) return a + f * (b - a);
  return 10 ** (Math.log10(a) + f * (Math.log10(b) - Math.log10(a)));
}

/** Design flows (DESIGN_FLOWS by default) from a daily record, with the LP3 fits, the annual minima and what limits them. */
export function lowFlowStatistics(
  record: readonly DailyFlow[],
  options: { climaticYearStart?: string; designFlows?: readonly DesignFlowSpec[] } = {},
): LowFlowReport {
  const start = options.climaticYearStart ?? DEFAULT_CLIMATIC_YEAR_START;
  if (!/^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/.test(start) || start === "02-29") throw new RangeError(`climatic year start "${start}" must be MM-DD (not 29 February)`);
  const specs = options.designFlows ?? DESIGN_FLOWS;
  const durations = [...new Set(specs.map((s) => s.days))];
  const byDays = new Map(durations.map((d) => [d, annualMinima(record, d, start)]));
  const lp3: Record<string, Lp3Fit> = {};
  const annual: Record<string, AnnualMinimum[]> = {};
  const warnings: string[] = [];
  for (const [d, { minima }] of byDays) {
    annual[String(d)] = minima;
    const fit = fitLp3(minima.map((m) => m.flow));
    if (fit.years >= 3) lp3[String(d)] = fit;
  }
  const statistics = specs.map((s) => {
    const { minima } = byDays.get(s.days)!;
    const fit = lp3[String(s.days)];
    return {
      name: s.name,
      days: s.days,
      return_period_years: s.returnPeriodYears,
      value: fit ? lp3Quantile(fit, s.returnPeriodYears) : null,
      empirical: empiricalQuantile(
        minima.map((m) => m.flow),
        s.returnPeriodYears,
      ),
    };
  });
  const shortest = byDays.get(Math.min(...durations))!;
  const used = shortest.minima.length;
  if (used < MIN_YEARS) warnings.push(`Only ${used} complete climatic year${used === 1 ? "" : "s"} in the record; low-flow statistics from fewer than ${MIN_YEARS} are uncertain`);
  if (shortest.excluded.length > 0) warnings.push(`${shortest.excluded.length} climatic year${shortest.excluded.length === 1 ? " was" : "s were"} left out for missing days (or as partial first and last years): ${shortest.excluded.join(", ")}`);
  for (const [d, fit] of Object.entries(lp3)) if (fit.zero_years > 0) warnings.push(`${fit.zero_years} of the ${d}-day annual minima are zero: the distribution is fitted to the other years and the probability adjusted`);
  return { years_used: used, years_excluded: shortest.excluded.length, excluded: shortest.excluded, statistics, lp3, annual_minima: annual, warnings };
}
