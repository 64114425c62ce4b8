import { Matrix, solve } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { fitHydraulicGeometry, fitPowerLaw, hydraulicGeometryAt, manningFlow, manningSection } from "@/lib/model/hydraulics";

const FT = 0.3048; // m per international foot (exact by definition)
const CFS = FT ** 3; // m³/s per ft³/s

describe("Manning's equation at normal depth", () => {
  it("matches the published trapezoidal worked example (Chow 1959, Open-Channel Hydraulics, Example 6.2 — from memory)", () => {
    // b = 20 ft, side slopes 2:1, n = 0.025, S = 0.0016, Q = 400 cfs → normal depth 3.36 ft (from memory).
    // The book's US form uses 1.49 for 1.486; the SI form here differs from it by 0.3 % in Q, well under the rounding of 3.36.
    const s = manningSection({ n: 0.025, slope_m_m: 0.0016, bottom_width_m: 20 * FT, side_slope: 2 }, 400 * CFS);
    expect(s.flow_depth_m / FT).toBeCloseTo(3.36, 1);
    expect(Math.abs(s.flow_depth_m / FT - 3.36)).toBeLessThan(0.02);
  });

  it("inverts the forward equation exactly (analytic: Q computed from a chosen depth gives that depth back)", () => {
    for (const [b, z, n, slope, y] of [
      [10, 0, 0.035, 0.0004, 0.8],
      [4, 1.5, 0.03, 0.002, 1.7],
      [25, 3, 0.045, 0.0001, 0.35],
    ] as const) {
      const ch = { n, slope_m_m: slope, bottom_width_m: b, side_slope: z };
      const q = manningFlow(ch, y);
      const s = manningSection(ch, q);
      expect(s.flow_depth_m).toBeCloseTo(y, 10);
      // exact section geometry of a trapezoid at depth y
      const area = (b + z * y) * y;
      expect(s.area_m2).toBeCloseTo(area, 9);
      expect(s.velocity_m_s).toBeCloseTo(q / area, 10);
      expect(s.mean_depth_m).toBeCloseTo(area / (b + 2 * z * y), 10);
      expect(s.hydraulic_radius_m).toBeCloseTo(area / (b + 2 * y * Math.sqrt(1 + z * z)), 10);
    }
  });

  it("tends to the wide-channel closed form y = (n·q/√S)^(3/5) per unit width (analytic limit R → y)", () => {
    const width = 1e5;
    const qPerWidth = 0.5;
    const s = manningSection({ n: 0.03, slope_m_m: 0.001, bottom_width_m: width }, qPerWidth * width);
    const wide = Math.pow((0.03 * qPerWidth) / Math.sqrt(0.001), 3 / 5);
    expect(s.flow_depth_m / wide - 1).toBeLessThan(1e-4);
    expect(s.flow_depth_m / wide - 1).toBeGreaterThan(0);
  });

  it("refuses a section that cannot carry flow", () => {
    expect(() => manningSection({ n: 0, slope_m_m: 0.001, bottom_width_m: 5 }, 1)).toThrow(/n must be positive/);
    expect(() => manningSection({ n: 0.03, slope_m_m: 0, bottom_width_m: 5 }, 1)).toThrow(/slope/);
    expect(() => manningSection({ n: 0.03, slope_m_m: 0.001, bottom_width_m: 5 }, 0)).toThrow(/flow/);
    expect(() => manningSection({ n: 0.03, slope_m_m: 0.001, bottom_width_m: 5, side_slope: -1 }, 1)).toThrow(/side_slope/);
  });
});

describe("hydraulic geometry", () => {
  it("evaluates U = a·Q^b and H = c·Q^f (analytic)", () => {
    const at = hydraulicGeometryAt({ a: 0.2, b: 0.4, c: 0.3, f: 0.5 }, 4);
    expect(at.velocity_m_s).toBeCloseTo(0.2 * 4 ** 0.4, 14);
    expect(at.depth_m).toBeCloseTo(0.6, 14);
  });

  it("recovers exact power laws from measurements (analytic)", () => {
    const g = { a: 0.25, b: 0.43, c: 0.31, f: 0.41 };
    const flows = [0.5, 1.2, 3, 7.5, 20];
    const fit = fitHydraulicGeometry(flows.map((q) => ({ flow_m3_s: q, ...hydraulicGeometryAt(g, q) })));
    expect(fit.geometry.a).toBeCloseTo(g.a, 12);
    expect(fit.geometry.b).toBeCloseTo(g.b, 12);
    expect(fit.geometry.c).toBeCloseTo(g.c, 12);
    expect(fit.geometry.f).toBeCloseTo(g.f, 12);
    expect(fit.velocity.r2).toBeCloseTo(1, 12);
  });

  it("gives the same log-log least-squares line as ml-matrix's QR least squares (independent library)", () => {
    const points = [
      { q: 0.8, y: 0.21 },
      { q: 1.9, y: 0.3 },
      { q: 2.2, y: 0.29 },
      { q: 6.1, y: 0.52 },
      { q: 11, y: 0.61 },
      { q: 15, y: 0.75 },
    ];
    const fit = fitPowerLaw(points);
    const X = new Matrix(points.map((p) => [1, Math.log(p.q)]));
    const y = Matrix.columnVector(points.map((p) => Math.log(p.y)));
    const beta = solve(X, y);
    expect(Math.log(fit.coefficient)).toBeCloseTo(beta.get(0, 0), 12);
    expect(fit.exponent).toBeCloseTo(beta.get(1, 0), 12);
    expect(fit.r2).toBeGreaterThan(0.9);
    expect(fit.r2).toBeLessThan(1);
  });

  it("needs two different flows", () => {
    expect(() => fitPowerLaw([{ q: 1, y: 1 }])).toThrow(/two/);
    expect(() => fitPowerLaw([{ q: 1, y: 1 }, { q: 1, y: 2 }])).toThrow(/different flows/);
  });
});
