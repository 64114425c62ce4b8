import { lp3Quantile, type AnnualMinimum, type Lp3Fit } from "@/lib/hydrology/low-flow";

export interface FrequencyPlot {
  /** Each year's n-day minimum at its Weibull plotting position: rank m of n ascending, non-exceedance m/(n+1), T = (n+1)/m. */
  points: { year: number; flow_m3_s: number; return_period_years: number }[];
  /** The fitted log-Pearson III curve at return periods from just above 1 year to 100 years (none without a fit). */
  curve: { return_period_years: number; flow_m3_s: number }[];
  /** Years whose minimum is zero: they cannot sit on a logarithmic flow axis and are counted instead. */
  zero_years: number;
}

const RETURN_PERIODS = [1.01, 1.05, 1.1, 1.25, 1.5, 2, 2.5, 3, 4, 5, 7, 10, 15, 20, 25, 30, 40, 50, 75, 100];

/** The points and fitted curve of a low-flow frequency plot (flow against return period, both logarithmic). */
export function frequencyPlot(minima: readonly AnnualMinimum[], fit: Lp3Fit | undefined): FrequencyPlot {
  const sorted = [...minima].sort((a, b) => a.flow - b.flow);
  const n = sorted.length;
  const points = sorted
    .map((m, i) => ({ year: m.year, flow_m3_s: m.flow, return_period_years: (n + 1) / (i + 1) }))
    .filter((p) => p.flow_m3_s > 0);
  const curve = fit
    ? RETURN_PERIODS.map((t) => ({ return_period_years: t, flow_m3_s: lp3Quantile(fit, t) })).filter((p) => p.flow_m3_s > 0)
    : [];
  return { points, curve, zero_years: n - points.length };
}
