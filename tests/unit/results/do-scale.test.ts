import { describe, expect, it } from "vitest";
import { CRITERION_TOLERANCE_MG_L, DO_BAND_COLOURS, doBand, doColour, doLegend, formatDo, isBelowCriterion } from "@/lib/results/do-scale";

describe("DO colour scale", () => {
  it("puts values in bands relative to the criterion (edges belong to the band above)", () => {
    // criterion 5, defaults near = 1, ample = 2 → edges 0, 5, 6, 7 mg/L
    expect(doBand(-0.01, 5)).toBe("anoxic");
    expect(doBand(0, 5)).toBe("below");
    expect(doBand(4.99, 5)).toBe("below");
    expect(doBand(5, 5)).toBe("near");
    expect(doBand(5.99, 5)).toBe("near");
    expect(doBand(6, 5)).toBe("meets");
    expect(doBand(7, 5)).toBe("ample");
    expect(doBand(6.5, 6, { near_mg_l: 0.25, ample_mg_l: 0.5 })).toBe("ample");
    expect(doBand(6.3, 6, { near_mg_l: 0.25, ample_mg_l: 0.5 })).toBe("meets");
  });

  it("counts DO within the solver's tolerance under the criterion as meeting it (an allocation's binding checkpoints)", () => {
    expect(isBelowCriterion(5 - 1e-6, 5)).toBe(false);
    expect(doBand(5 - 1e-6, 5)).toBe("near");
    expect(isBelowCriterion(5 - 2 * CRITERION_TOLERANCE_MG_L, 5)).toBe(true);
    expect(isBelowCriterion(4.99, 5)).toBe(true);
    // the allocation's own default tolerance (1e-6 mg/L) is well inside it
    expect(CRITERION_TOLERANCE_MG_L).toBeGreaterThan(1e-6);
  });

  it("rejects a scale whose bands would overlap", () => {
    expect(() => doBand(5, 5, { near_mg_l: 2, ample_mg_l: 1 })).toThrow(RangeError);
    expect(() => doBand(5, 5, { near_mg_l: 0 })).toThrow(RangeError);
  });

  it("gives every band its own colour, anoxic distinct from below", () => {
    expect(new Set(Object.values(DO_BAND_COLOURS)).size).toBe(5);
    expect(doColour(-1, 5)).toBe(DO_BAND_COLOURS.anoxic);
    expect(doColour(3, 5)).not.toBe(doColour(-1, 5));
  });

  it("has legend stops that tile the DO axis and agree with doBand", () => {
    const stops = doLegend(5);
    expect(stops.map((s) => s.band)).toEqual(["ample", "meets", "near", "below", "anoxic"]);
    for (let i = 0; i + 1 < stops.length; i++) expect(stops[i].from_mg_l).toBe(stops[i + 1].to_mg_l);
    for (const s of stops) {
      const inside = s.from_mg_l === null ? (s.to_mg_l as number) - 0.5 : s.from_mg_l;
      expect(doBand(inside, 5)).toBe(s.band);
      expect(s.colour).toBe(DO_BAND_COLOURS[s.band]);
    }
  });

  it("formats negative DO as anoxic, never as a negative number", () => {
    expect(formatDo(-0.3)).toBe("anoxic");
    expect(formatDo(5.126)).toBe("5.13");
    expect(formatDo(0)).toBe("0.00");
    expect(formatDo(null)).toBe("—");
    expect(formatDo(Number.NaN)).toBe("—");
  });
});
