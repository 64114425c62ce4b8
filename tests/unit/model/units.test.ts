import fc from "fast-check";
import { describe, expect, it } from "vitest";
import * as u from "@/lib/model/units";
import { DEFAULT_THETA, deoxygenationTheta, rateAtTemperature } from "@/lib/model/temperature";

const value = fc.double({ min: -1e6, max: 1e6, noNaN: true });

describe("unit conversions", () => {
  it("exact definitions (international foot/pound 1959, US gallon 231 in³)", () => {
    expect(u.ftToM(1)).toBe(0.3048);
    expect(u.miToKm(1)).toBe(1.609344);
    expect(u.lbToKg(1)).toBe(0.45359237);
    expect(u.cfsToM3s(1)).toBeCloseTo(0.028316846592, 15);
    // 1 MGD = 1e6 gal × 3.785411784 L / 86 400 s = 0.0438126364 m³/s.
    expect(u.mgdToM3s(1)).toBeCloseTo(0.043812636388889, 14);
    expect(u.fToC(212)).toBeCloseTo(100, 12);
    expect(u.loadKgPerDay(1, 1)).toBeCloseTo(86.4, 12);
  });

  it("round-trips (fast-check)", () => {
    const pairs: Array<[(x: number) => number, (x: number) => number]> = [
      [u.ftToM, u.mToFt],
      [u.miToKm, u.kmToMi],
      [u.ftPerSToMPerS, u.mPerSToFtPerS],
      [u.cfsToM3s, u.m3sToCfs],
      [u.mgdToM3s, u.m3sToMgd],
      [u.lbToKg, u.kgToLb],
      [u.fToC, u.cToF],
    ];
    fc.assert(
      fc.property(value, (x) => {
        for (const [to, from] of pairs) {
          expect(Math.abs(from(to(x)) - x)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(x)));
        }
      }),
    );
  });

  it("load ↔ concentration round-trip (fast-check)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-4, max: 1e4, noNaN: true }), fc.double({ min: 0, max: 1e4, noNaN: true }), (q, c) => {
        expect(u.concentrationMgL(u.loadKgPerDay(q, c), q)).toBeCloseTo(c, 8);
      }),
    );
  });
});

describe("temperature correction", () => {
  it("k_T = k_20·θ^(T−20): identity at 20 °C, θ^5 at 25 °C", () => {
    expect(rateAtTemperature(0.35, 1.047, 20)).toBe(0.35);
    expect(rateAtTemperature(0.35, 1.047, 25)).toBeCloseTo(0.35 * 1.047 ** 5, 14);
    expect(DEFAULT_THETA).toMatchObject({ deoxygenation: 1.047, reaeration: 1.024, sod: 1.065, nitrification: 1.08 });
  });

  it("piecewise deoxygenation θ: 1.135 below 20 °C, 1.056 for 20–30 °C, 1.047 above (common practice)", () => {
    expect(deoxygenationTheta(19.9, "piecewise")).toBe(1.135);
    expect(deoxygenationTheta(20, "piecewise")).toBe(1.056);
    expect(deoxygenationTheta(30, "piecewise")).toBe(1.056);
    expect(deoxygenationTheta(30.1, "piecewise")).toBe(1.047);
    expect(deoxygenationTheta(10, "constant")).toBe(1.047);
    expect(deoxygenationTheta(10, "constant", 1.05)).toBe(1.05);
  });

  it("throws on bad θ, NaN temperature or an unknown rule", () => {
    expect(() => rateAtTemperature(0.3, 0, 20)).toThrow(/theta/);
    expect(() => rateAtTemperature(0.3, 1.047, NaN)).toThrow(/temperature_c/);
    expect(() => rateAtTemperature(NaN, 1.047, 20)).toThrow(/k20_per_day/);
    expect(() => deoxygenationTheta(20, "other" as never)).toThrow(/deoxygenation_rule/);
  });
});
