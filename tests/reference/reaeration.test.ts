import { describe, expect, it } from "vitest";
import { churchill, cfsToM3s, mToFt, mPerSToFtPerS, oconnorDobbins, owensGibbs, reaeration, selectByDepthVelocity, tsivoglouNeal } from "@/lib/model";

// Published US-customary forms (k_a in 1/d at 20 °C, U in ft/s, H in ft), from memory as
// tabulated in Chapra, "Surface Water-Quality Modeling" (1997), Table 20.1 and
// Thomann & Mueller (1987): O'Connor–Dobbins 12.9·U^0.5/H^1.5; Churchill et al. 11.6·U^0.969/H^1.673;
// Owens et al. 21.6·U^0.67/H^1.85; Tsivoglou–Neal 0.11 (1–15 cfs) or 0.054 (15–3000 cfs)
// per ft × ΔH/Δt (ft/d). The SI coefficients are rounded conversions: agreement to 0.2 %.
const cases: Array<[number, number]> = [
  [0.1, 0.3],
  [0.3, 1.2],
  [0.8, 1.5],
  [1.2, 4],
];

describe("reaeration formulas against their published US-customary forms", () => {
  for (const [u, h] of cases) {
    const U = mPerSToFtPerS(u);
    const H = mToFt(h);
    it(`U ${u} m/s, H ${h} m`, () => {
      expect(oconnorDobbins(u, h) / ((12.9 * U ** 0.5) / H ** 1.5)).toBeCloseTo(1, 2);
      expect(Math.abs(oconnorDobbins(u, h) / ((12.9 * U ** 0.5) / H ** 1.5) - 1)).toBeLessThan(2e-3);
      expect(Math.abs(churchill(u, h) / ((11.6 * U ** 0.969) / H ** 1.673) - 1)).toBeLessThan(2e-3);
      expect(Math.abs(owensGibbs(u, h) / ((21.6 * U ** 0.67) / H ** 1.85) - 1)).toBeLessThan(2e-3);
    });
  }

  it("Tsivoglou–Neal: c·ΔH/t with c = 0.11/ft for 1–15 cfs and 0.054/ft for 15–3000 cfs", () => {
    const u = 0.3;
    const slope = 0.0004;
    const dropFtPerDay = mToFt(u * slope * 86_400);
    expect(Math.abs(tsivoglouNeal(u, slope, cfsToM3s(5)) / (0.11 * dropFtPerDay) - 1)).toBeLessThan(2e-3);
    expect(Math.abs(tsivoglouNeal(u, slope, cfsToM3s(100)) / (0.054 * dropFtPerDay) - 1)).toBeLessThan(2e-3);
    // The regime boundary is 15 cfs = 0.4247 m³/s.
    expect(tsivoglouNeal(u, slope, 0.4246)).toBeCloseTo(31183 * u * slope, 10);
    expect(tsivoglouNeal(u, slope, 0.4248)).toBeCloseTo(15308 * u * slope, 10);
    expect(() => tsivoglouNeal(u, slope, 0.02)).toThrow(/0\.0283/);
  });
});

describe("depth/velocity selection (after Covar 1976) and the 0.6/H floor (Chin 2006)", () => {
  it("H < 0.61 m → Owens–Gibbs; H > 3.45·U^2.5 → O'Connor–Dobbins; else Churchill", () => {
    expect(selectByDepthVelocity(0.5, 0.6)).toBe("owens-gibbs");
    expect(selectByDepthVelocity(0.5, 0.62)).toBe("oconnor-dobbins"); // 3.45·0.5^2.5 = 0.61
    expect(selectByDepthVelocity(1.5, 1.0)).toBe("churchill"); // 3.45·1.5^2.5 = 9.5 > 1
    expect(selectByDepthVelocity(1.5, 10)).toBe("oconnor-dobbins");
  });

  it("records the formula, applies the floor only when it raises k_a", () => {
    const r = reaeration({ method: "depth-velocity", velocity_m_s: 1.5, depth_m: 1 });
    expect(r).toEqual({ ka20_per_day: churchill(1.5, 1), formula: "churchill", floored: false });
    const deep = reaeration({ method: "oconnor-dobbins", velocity_m_s: 0.05, depth_m: 8, floor: true });
    expect(oconnorDobbins(0.05, 8)).toBeLessThan(0.6 / 8);
    expect(deep).toEqual({ ka20_per_day: 0.075, formula: "oconnor-dobbins", floored: true });
    expect(reaeration({ method: "given", ka20_per_day: 2, velocity_m_s: 1, depth_m: 1, floor: true }).floored).toBe(false);
  });

  it("throws naming the missing or bad field", () => {
    expect(() => reaeration({ method: "given", velocity_m_s: 1, depth_m: 1 })).toThrow(/ka20_per_day/);
    expect(() => reaeration({ method: "tsivoglou-neal", velocity_m_s: 1, depth_m: 1, flow_m3_s: 1 })).toThrow(/slope_m_m/);
    expect(() => reaeration({ method: "churchill", velocity_m_s: 0, depth_m: 1 })).toThrow(/velocity_m_s/);
    expect(() => reaeration({ method: "owens-gibbs", velocity_m_s: 1, depth_m: -1 })).toThrow(/depth_m/);
    expect(() => reaeration({ method: "nonsense" as never, velocity_m_s: 1, depth_m: 1 })).toThrow(/ka_method/);
    expect(() => oconnorDobbins(NaN, 1)).toThrow(/velocity_m_s/);
  });
});
