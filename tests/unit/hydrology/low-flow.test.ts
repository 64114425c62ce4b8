import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import {
  annualMinima,
  climaticYear,
  empiricalQuantile,
  fitLp3,
  frequencyFactor,
  lowFlowStatistics,
  lp3Quantile,
  type DailyFlow,
} from "@/lib/hydrology/low-flow";

// jStat: an independent library's gamma and normal quantiles (a CommonJS bundle without types)
const { jStat } = createRequire(import.meta.url)("jstat") as {
  jStat: { gamma: { inv(p: number, shape: number, scale: number): number }; normal: { inv(p: number, mean: number, sd: number): number } };
};

/**
 * Frequency factors K of the Pearson Type III distribution by skew and exceedance probability,
 * the standard table printed in hydrology texts (e.g. the table of K_T for the Pearson Type III
 * distribution in a standard applied-hydrology text; the same values as the federal flood-frequency
 * guidelines' appendix) — from memory, to the table's three decimals.
 */
const TABLE: Record<string, Record<string, number>> = {
  // exceedance:  0.99     0.50     0.20    0.10    0.04    0.02    0.01
  "2.0": { "0.99": -0.99, "0.5": -0.307, "0.2": 0.609, "0.1": 1.302, "0.04": 2.219, "0.02": 2.912, "0.01": 3.605 },
  "1.0": { "0.99": -1.588, "0.5": -0.164, "0.2": 0.758, "0.1": 1.34, "0.04": 2.043, "0.02": 2.542, "0.01": 3.022 },
  "0.5": { "0.99": -1.955, "0.5": -0.083, "0.2": 0.808, "0.1": 1.323, "0.04": 1.91, "0.02": 2.311, "0.01": 2.686 },
  "0.0": { "0.99": -2.326, "0.5": 0, "0.2": 0.842, "0.1": 1.282, "0.04": 1.751, "0.02": 2.054, "0.01": 2.326 },
  "-0.5": { "0.99": -2.686, "0.5": 0.083, "0.2": 0.856, "0.1": 1.216, "0.04": 1.567, "0.02": 1.777, "0.01": 1.955 },
  "-1.0": { "0.99": -3.022, "0.5": 0.164, "0.2": 0.852, "0.1": 1.128, "0.04": 1.366, "0.02": 1.492, "0.01": 1.588 },
  "-2.0": { "0.99": -3.605, "0.5": 0.307, "0.2": 0.777, "0.1": 0.895, "0.04": 0.959, "0.02": 0.98, "0.01": 0.99 },
};

/** K from jStat's gamma quantile (shape 4/g², scale 1), the same definition written independently. */
function kByJstat(g: number, p: number): number {
  if (g === 0) return jStat.normal.inv(p, 0, 1);
  const a = 4 / (g * g);
  return g > 0 ? (jStat.gamma.inv(p, a, 1) - a) / Math.sqrt(a) : -(jStat.gamma.inv(1 - p, a, 1) - a) / Math.sqrt(a);
}

describe("Pearson Type III frequency factors", () => {
  it("match the published table to its three decimals (non-exceedance 1 − q)", () => {
    for (const [g, row] of Object.entries(TABLE)) for (const [q, k] of Object.entries(row)) expect(frequencyFactor(Number(g), 1 - Number(q)), `g ${g}, q ${q}`).toBeCloseTo(k, 2.6);
  });

  it("match an independent library's gamma and normal quantiles", () => {
    for (const g of [-2.5, -1, -0.3, 0, 0.2, 1, 3]) for (const p of [0.01, 0.1, 0.2, 0.5, 0.9]) expect(frequencyFactor(g, p)).toBeCloseTo(kByJstat(g, p), 6);
  });

  it("mirror between skews (exact: K(g, p) = −K(−g, 1 − p)) and tend to the normal at zero skew", () => {
    for (const g of [0.4, 1.7]) for (const p of [0.05, 0.1, 0.5]) expect(frequencyFactor(g, p)).toBeCloseTo(-frequencyFactor(-g, 1 - p), 9);
    // the normal 10 % quantile, −1.2815515655446004 (standard normal table, to 16 digits from memory)
    expect(frequencyFactor(0, 0.1)).toBeCloseTo(-1.2815515655446004, 12);
    expect(frequencyFactor(1e-4, 0.1)).toBeCloseTo(-1.2815515655446004, 3);
  });
});

/** A daily record from `from` for `n` days, flow given by the day's index. */
function record(from: string, n: number, flow: (i: number, date: string) => number | null): DailyFlow[] {
  const t0 = Date.parse(`${from}T00:00:00Z`);
  return Array.from({ length: n }, (_, i) => {
    const date = new Date(t0 + i * 86_400_000).toISOString().slice(0, 10);
    return { date, flow: flow(i, date) };
  });
}

describe("n-day minima by climatic year (hand-checked records)", () => {
  it("groups days into climatic years starting 1 April", () => {
    expect(climaticYear("2021-03-31")).toBe(2020);
    expect(climaticYear("2021-04-01")).toBe(2021);
    expect(climaticYear("2021-09-30", "10-01")).toBe(2020);
  });

  it("finds the lowest n-day mean inside each complete year and leaves partial years out", () => {
    // 15 Mar 2020 – 31 Mar 2022: a partial year 2019, then two complete climatic years
    const days = record("2020-03-15", 747, (_, date) => {
      if (date >= "2020-08-01" && date <= "2020-08-07") return Number(date.slice(8)) ; // 1..7: 7-day mean 4, 1-day 1
      if (date >= "2021-09-10" && date <= "2021-09-12") return 2; // three days at 2 in a year of 10s
      return 10;
    });
    const one = annualMinima(days, 1);
    expect(one.minima).toEqual([
      { year: 2020, flow: 1 },
      { year: 2021, flow: 2 },
    ]);
    expect(one.excluded).toEqual([2019]);
    // 7-day: (1+…+7)/7 = 4; (2·3 + 10·4)/7 = 46/7
    expect(annualMinima(days, 7).minima.map((m) => m.flow)).toEqual([4, 46 / 7]);
  });

  it("reads years before 1000 (four-digit ISO years such as 0812) like any other", () => {
    const days = record("0812-04-01", 365, () => 3);
    expect(annualMinima(days, 7)).toEqual({ minima: [{ year: 812, flow: 3 }], excluded: [] });
  });

  it("leaves out a year with a missing day or a null flow", () => {
    const full = record("2020-04-01", 730, () => 5);
    const gap = full.filter((d) => d.date !== "2020-12-25");
    expect(annualMinima(gap, 7)).toEqual({ minima: [{ year: 2021, flow: 5 }], excluded: [2020] });
    const nulled = full.map((d) => (d.date === "2021-06-01" ? { ...d, flow: null } : d));
    expect(annualMinima(nulled, 7)).toEqual({ minima: [{ year: 2020, flow: 5 }], excluded: [2021] });
  });
});

describe("log-Pearson III design flows", () => {
  it("fits the moments of log10 flows (exact case: minima 1, 10, 100 → mean 1, sd 1, skew 0)", () => {
    const fit = fitLp3([1, 10, 100]);
    expect(fit.mean_log10).toBeCloseTo(1, 12);
    expect(fit.sd_log10).toBeCloseTo(1, 12);
    expect(fit.skew).toBeCloseTo(0, 12);
    // 10^(1 − 1.2815515655446004): the 10-year low flow of that distribution
    expect(lp3Quantile(fit, 10)).toBeCloseTo(10 ** (1 - 1.2815515655446004), 10);
  });

  it("computes the skew with the bias correction n/((n−1)(n−2)) (exact case: logs 0, 0, 3)", () => {
    // mean 1, m2 = 1+1+4 = 6, sd = √3, m3 = −1 −1 + 8 = 6: g = 3·6/(2·1·3√3) = √3
    expect(fitLp3([1, 1, 1000]).skew).toBeCloseTo(Math.sqrt(3), 12);
  });

  it("treats zero minima by the conditional probability adjustment", () => {
    const fit = fitLp3([0, 1, 10, 100]);
    expect(fit).toMatchObject({ years: 3, zero_years: 1 });
    // p = 0.1 ≤ p0 = 0.25: the 10-year low flow is zero
    expect(lp3Quantile(fit, 10)).toBe(0);
    // p = 0.5 → (0.5 − 0.25)/0.75 = 1/3; z(1/3) = −0.4307272992954576 (normal table, from memory)
    expect(lp3Quantile(fit, 2)).toBeCloseTo(10 ** (1 - 0.4307272992954576), 9);
  });

  it("gives the empirical quantile by Weibull plotting positions, null beyond the record", () => {
    // 9 years: m/(n+1) = 0.1 is the lowest value itself; 0.5 the median
    const minima = [9, 1, 8, 2, 7, 3, 6, 4, 5];
    expect(empiricalQuantile(minima, 10)).toBeCloseTo(1, 12);
    expect(empiricalQuantile(minima, 2)).toBeCloseTo(5, 12);
    expect(empiricalQuantile([1, 2, 3], 10)).toBeNull();
  });

  it("reports 1Q10, 7Q10, 30Q5, 7Q2 with their fits and warns on a short, gappy record", () => {
    const days = record("2010-04-01", 365 * 6 + 2, (i) => 3 + 2 * Math.sin(i / 20) + (i % 365) / 365);
    const report = lowFlowStatistics(days.filter((d) => d.date !== "2012-07-04"));
    expect(report.statistics.map((s) => s.name)).toEqual(["1Q10", "7Q10", "30Q5", "7Q2"]);
    expect(report.excluded).toContain(2012);
    expect(report.warnings.join(" ")).toMatch(/Only \d complete climatic years/);
    const s7q10 = report.statistics.find((s) => s.name === "7Q10")!;
    const s7q2 = report.statistics.find((s) => s.name === "7Q2")!;
    expect(s7q10.value!).toBeLessThan(s7q2.value!);
    expect(report.lp3["7"].years).toBe(report.years_used);
  });

  it("refuses a malformed date and a bad climatic-year start", () => {
    expect(() => annualMinima([{ date: "2021-02-30", flow: 1 }], 1)).toThrow(/not a date/);
    expect(() => lowFlowStatistics([], { climaticYearStart: "13-01" })).toThrow(/MM-DD/);
  });
});
