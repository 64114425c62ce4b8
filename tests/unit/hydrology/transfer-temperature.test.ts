import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import { designTemperature, percentile, type DailyValue } from "@/lib/hydrology/design-temperature";
import { transferByDrainageArea } from "@/lib/hydrology/transfer";

// jStat: an independent library's quantiles (a CommonJS bundle without types)
const { jStat } = createRequire(import.meta.url)("jstat") as { jStat: { quantiles(values: number[], p: number[], alphap: number, betap: number): number[] } };

describe("drainage-area transfer", () => {
  it("scales by the area ratio to the exponent (analytic)", () => {
    const t = transferByDrainageArea(2.4, 300, 75);
    expect(t.flow).toBeCloseTo(0.6, 14);
    expect(t.rule).toBe("the gauge's value × (75 km² / 300 km²)");
    const e = transferByDrainageArea(2.4, 300, 75, 0.8, "Gauge 7");
    expect(e.flow).toBeCloseTo(2.4 * 0.25 ** 0.8, 14);
    expect(e.rule).toContain("^0.8");
  });
  it("names the bad value", () => {
    expect(() => transferByDrainageArea(1, 0, 5)).toThrow(/gauge drainage area/);
    expect(() => transferByDrainageArea(1, 5, -1)).toThrow(/^drainage area/);
    expect(() => transferByDrainageArea(-1, 5, 5)).toThrow(/gauge flow/);
    expect(() => transferByDrainageArea(1, 5, 5, 0)).toThrow(/exponent/);
  });
});

describe("percentile (type 7, linear)", () => {
  it("matches a hand-worked case: 90th of 1..10 is at index 8.1 → 9.1 (analytic)", () => {
    expect(percentile([10, 1, 9, 2, 8, 3, 7, 4, 6, 5], 90)).toBeCloseTo(9.1, 14);
    expect(percentile([4], 90)).toBe(4);
    expect(percentile([1, 2], 0)).toBe(1);
    expect(percentile([1, 2], 100)).toBe(2);
  });
  it("agrees with jStat.quantiles with alphap = betap = 1, the same definition (independent library)", () => {
    const values = Array.from({ length: 123 }, (_, i) => 18 + 6 * Math.sin(i * 1.7) + (i % 7) * 0.31);
    for (const p of [5, 50, 90, 95, 99]) {
      expect(percentile(values, p)).toBeCloseTo(jStat.quantiles(values, [p / 100], 1, 1)[0], 12);
    }
  });
});

describe("design temperature from a daily record", () => {
  const record: DailyValue[] = [];
  for (let d = new Date(Date.UTC(2021, 0, 1)); d.getUTCFullYear() < 2023; d.setUTCDate(d.getUTCDate() + 1)) {
    const iso = d.toISOString().slice(0, 10);
    const month = d.getUTCMonth() + 1;
    // summer days 20..29 °C by day of month mod 10; every 13th day missing; winter days 4 °C
    const value = month >= 6 && month <= 9 ? 20 + (d.getUTCDate() % 10) : 4;
    record.push({ date: iso, value: d.getUTCDate() === 13 ? null : value });
  }
  it("takes the percentile of the chosen months' days only and counts the missing ones", () => {
    const t = designTemperature(record);
    const summer = record.filter((r) => [6, 7, 8, 9].includes(Number(r.date.slice(5, 7))));
    const values = summer.filter((r) => r.value !== null).map((r) => r.value as number);
    expect(t.days_used).toBe(values.length);
    expect(t.days_missing).toBe(8); // the 13th of four months in two years
    expect(t.value_c).toBeCloseTo(jStat.quantiles(values, [0.9], 1, 1)[0], 12);
    expect(t.rule).toMatch(/^90th percentile of June–September daily means, \d+ days \(2021-06-01 to 2022-09-30\)$/);
  });
  it("refuses a record without the season's values and bad months", () => {
    expect(() => designTemperature(record.filter((r) => r.value === 4))).toThrow(/no values in June–September/);
    expect(() => designTemperature(record, { months: [13], percentile: 90 })).toThrow(/months/);
  });
});
