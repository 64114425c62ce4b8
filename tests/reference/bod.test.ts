import { describe, expect, it } from "vitest";
import {
  bod5FromDilution,
  bod5FromSeededDilution,
  bodTFromUltimate,
  cbodToBod5Ratio,
  seedCorrectionMgL,
  ultimateFromBodT,
} from "@/lib/model";

describe("BOD5 from dilution tests (APHA Standard Methods 5210 B)", () => {
  it("Spellman, Handbook of Water and Wastewater Treatment Plant Operations, Ex. 19.6 (seeded)", () => {
    // Seed BOD 204 mg/L, 1 mL seed per 300-mL bottle; 50 mL sample 8.0 → 4.6 mg/L,
    // 75 mL sample 7.7 → 3.9 mg/L. Printed answers: 16.3 and 12.5 mg/L, reported 14.4 mg/L.
    const seed = seedCorrectionMgL(204, 1, 300);
    const a = bod5FromSeededDilution({ d1_mg_l: 8.0, d2_mg_l: 4.6, p: 50 / 300, seed_correction_mg_l: seed });
    const b = bod5FromSeededDilution({ d1_mg_l: 7.7, d2_mg_l: 3.9, p: 75 / 300, seed_correction_mg_l: seed });
    expect(a).toBeCloseTo(16.3, 1);
    expect(b).toBeCloseTo(12.5, 1);
    expect((a + b) / 2).toBeCloseTo(14.4, 1);
  });

  it("the B1/B2/f form gives the same number as a seed correction (exact identity)", () => {
    const viaBottle = bod5FromSeededDilution({ d1_mg_l: 8, d2_mg_l: 4.6, p: 1 / 6, b1_mg_l: 8.5, b2_mg_l: 5.1, f: 0.2 });
    const direct = bod5FromSeededDilution({ d1_mg_l: 8, d2_mg_l: 4.6, p: 1 / 6, seed_correction_mg_l: 0.68 });
    expect(viaBottle).toBeCloseTo(direct, 12);
  });

  it("unseeded: (D1 − D2)/P", () => {
    expect(bod5FromDilution({ d1_mg_l: 8, d2_mg_l: 4, p: 0.1 })).toBeCloseTo(40, 12);
  });

  it("throws on a bad fraction, mixed seed forms, missing seed fields or NaN", () => {
    expect(() => bod5FromDilution({ d1_mg_l: 8, d2_mg_l: 4, p: 0 })).toThrow(/p/);
    expect(() => bod5FromDilution({ d1_mg_l: 8, d2_mg_l: 4, p: 1.5 })).toThrow(/p/);
    expect(() => bod5FromDilution({ d1_mg_l: NaN, d2_mg_l: 4, p: 0.5 })).toThrow(/d1_mg_l/);
    expect(() => bod5FromSeededDilution({ d1_mg_l: 8, d2_mg_l: 4, p: 0.5 })).toThrow(/seed_correction_mg_l/);
    expect(() => bod5FromSeededDilution({ d1_mg_l: 8, d2_mg_l: 4, p: 0.5, f: 1, seed_correction_mg_l: 1 })).toThrow(/seed_correction_mg_l/);
    expect(() => bod5FromSeededDilution({ d1_mg_l: 8, d2_mg_l: 4, p: 0.5, b1_mg_l: 8 })).toThrow(/f/);
    expect(() => seedCorrectionMgL(200, 0, 300)).toThrow(/seed_ml/);
    expect(() => seedCorrectionMgL(200, 1, -3)).toThrow(/bottle_ml/);
  });
});

describe("ultimate CBOD and the bottle rate (first-order BOD, Streeter & Phelps 1925)", () => {
  it("L0 = BOD5/(1 − e^(−5k)): k = 0.23 /d → f = 1/(1 − e^(−1.15)) = 1.46335 (exact arithmetic)", () => {
    expect(cbodToBod5Ratio(0.23)).toBeCloseTo(1 / (1 - Math.exp(-1.15)), 14);
    expect(cbodToBod5Ratio()).toBeCloseTo(1.46335, 5);
    expect(ultimateFromBodT(10, 0.23)).toBeCloseTo(14.6335, 4);
  });

  it("round-trips BODt ↔ CBODu for any t and k", () => {
    for (const k of [0.05, 0.23, 1]) for (const t of [1, 5, 20]) expect(bodTFromUltimate(ultimateFromBodT(7, k, t), k, t)).toBeCloseTo(7, 12);
  });

  it("throws for a non-positive bottle rate or time", () => {
    expect(() => ultimateFromBodT(10, 0)).toThrow(/bottle_k_per_day/);
    expect(() => ultimateFromBodT(10, 0.2, 0)).toThrow(/t_day/);
    expect(() => cbodToBod5Ratio(-1)).toThrow(/bottle_k_per_day/);
  });
});
