/**
 * A design water temperature from a daily temperature record: a high percentile of the
 * daily means in the warm season (common practice: the 90th percentile of June–September
 * daily means in the northern hemisphere). Pure; °C in, °C out.
 */

export interface DailyValue {
  /** ISO date, YYYY-MM-DD. */
  date: string;
  /** null: a missing day. */
  value: number | null;
}

export interface DesignTemperatureRule {
  /** Calendar months counted (1 = January). Default June–September. */
  months: readonly number[];
  /** Percentile, 0–100. Default 90. */
  percentile: number;
}

export const DEFAULT_DESIGN_TEMPERATURE_RULE: DesignTemperatureRule = { months: [6, 7, 8, 9], percentile: 90 };

export interface DesignTemperature {
  value_c: number;
  days_used: number;
  days_missing: number;
  first_date: string;
  last_date: string;
  /** The rule in words, recorded with the value. */
  rule: string;
}

/**
 * The p-th percentile by linear interpolation between order statistics at (n − 1)·p/100
 * (the "linear" definition: Hyndman & Fan's type 7, the default of R's quantile() and
 * NumPy's percentile). Values need not be sorted.
 */
export function percentile(values: readonly number[], p: number): number {
  if (values.length === 0) throw new RangeError("no values");
  if (!(p >= 0 && p <= 100)) throw new RangeError("percentile must be between 0 and 100");
  const sorted = [...values].sort((a, b) => a - b);
  const h = ((sorted.length - 1) * p) / 100;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, sorted.length - 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

const MONTH_NAMES = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];

function monthsText(months: readonly number[]): string {
  const m = [...months].sort((a, b) => a - b);
  const run = m.every((v, i) => i === 0 || v === m[i - 1] + 1);
  return run && m.length > 2 ? `${MONTH_NAMES[m[0] - 1]}–${MONTH_NAMES[m[m.length - 1] - 1]}` : m.map((v) => MONTH_NAMES[v - 1]).join(", ");
}

/** The design temperature of a record under a rule. Throws a RangeError when no day of the chosen months has a value. */
export function designTemperature(record: readonly DailyValue[], rule: DesignTemperatureRule = DEFAULT_DESIGN_TEMPERATURE_RULE): DesignTemperature {
  if (rule.months.length === 0 || rule.months.some((m) => !Number.isInteger(m) || m < 1 || m > 12)) throw new RangeError("months must be whole numbers 1–12");
  const months = new Set(rule.months);
  const inSeason = record.filter((d) => months.has(Number(d.date.slice(5, 7))));
  const values = inSeason.filter((d) => d.value !== null && Number.isFinite(d.value)).map((d) => d.value as number);
  if (values.length === 0) throw new RangeError(`the record has no values in ${monthsText(rule.months)}`);
  const dates = inSeason.map((d) => d.date).sort();
  return {
    value_c: percentile(values, rule.percentile),
    days_used: values.length,
    days_missing: inSeason.length - values.length,
    first_date: dates[0],
    last_date: dates[dates.length - 1],
    rule: `${rule.percentile}th percentile of ${monthsText(rule.months)} daily means, ${values.length} days (${dates[0]} to ${dates[dates.length - 1]})`,
  };
}
