import { describe, expect, it } from "vitest";
import { doSaturationAtElevation, doSaturationMgL, pressureAtElevationAtm } from "@/lib/model";

describe("DO saturation (Benson & Krause 1984 as given in Standard Methods 4500-O)", () => {
  // Expected values: Standard Methods 4500-O table of DO solubility in fresh water at 1 atm
  // (values as quoted in Sagline's MODEL.md §2; printed to 3 decimals, so ±0.0006 mg/L).
  const table: Array<[number, number]> = [
    [0, 14.621],
    [10, 11.288],
    [20, 9.092],
    [25, 8.263],
    [30, 7.559],
  ];
  for (const [t, expected] of table) {
    it(`${t} °C fresh water at 1 atm → ${expected} mg/L (Standard Methods 4500-O table)`, () => {
      expect(Math.abs(doSaturationMgL({ t_c: t }) - expected)).toBeLessThan(6e-4);
    });
  }

  it("the salinity term equals the chlorinity form printed in Standard Methods (S = 1.80655·Cl)", () => {
    // Standard Methods 4500-O gives the sea-water term in chlorinity:
    //   ln C = ln C0 − Chl·(3.1929e−2 − 1.9428e1/T + 3.8673e3/T²)
    // and salinity S = 1.80655·Chl (Wooster, Lee & Dietrich 1969). Both forms must agree
    // to the rounding of their printed coefficients (≤ 0.1 %).
    for (const t of [0, 12, 20, 31]) {
      for (const chl of [5, 10, 20]) {
        const T = t + 273.15;
        const lnC0 = Math.log(doSaturationMgL({ t_c: t }));
        const chlorinityForm = Math.exp(lnC0 - chl * (3.1929e-2 - 1.9428e1 / T + 3.8673e3 / T ** 2));
        const ours = doSaturationMgL({ t_c: t, salinity_g_kg: 1.80655 * chl });
        expect(Math.abs(ours / chlorinityForm - 1)).toBeLessThan(1e-3);
      }
    }
  });

  it("pressure correction: exact at 1 atm, and close to proportional to P (common practice: C_p ≈ C·P within ~1 %)", () => {
    expect(doSaturationMgL({ t_c: 20, pressure_atm: 1 })).toBe(doSaturationMgL({ t_c: 20 }));
    for (const p of [0.7, 0.85, 0.95]) {
      const c = doSaturationMgL({ t_c: 20, pressure_atm: p });
      expect(Math.abs(c / (9.0925 * p) - 1)).toBeLessThan(0.01);
      // The vapour-pressure term makes the true value slightly below proportional.
      expect(c).toBeLessThan(doSaturationMgL({ t_c: 20 }) * p);
    }
  });

  it("standard atmosphere: 1000 m → 0.8870 atm (ICAO standard atmosphere table, 89.88 kPa / 101.325 kPa, from memory)", () => {
    expect(pressureAtElevationAtm(1000)).toBeCloseTo(89.8746 / 101.325, 4);
    expect(pressureAtElevationAtm(0)).toBe(1);
    expect(doSaturationAtElevation(20, 0)).toBe(doSaturationMgL({ t_c: 20 }));
  });

  it("throws on temperature outside 0–50 °C, negative salinity, NaN, and impossible elevation", () => {
    expect(() => doSaturationMgL({ t_c: -1 })).toThrow(/temperature_c/);
    expect(() => doSaturationMgL({ t_c: 51 })).toThrow(/temperature_c/);
    expect(() => doSaturationMgL({ t_c: NaN })).toThrow(/temperature_c/);
    expect(() => doSaturationMgL({ t_c: 20, salinity_g_kg: -1 })).toThrow(/salinity_g_kg/);
    expect(() => doSaturationMgL({ t_c: 20, pressure_atm: -0.1 })).toThrow(/pressure_atm/);
    expect(() => pressureAtElevationAtm(50_000)).toThrow(/elevation_m/);
  });
});
