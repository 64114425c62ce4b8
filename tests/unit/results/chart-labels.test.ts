import { describe, expect, it } from "vitest";
import { clearestBox, labelSpan, staggerLabels, textWidthPx } from "@/lib/results/chart-labels";

// Expected values worked out by hand from the rule each function states.
describe("staggerLabels", () => {
  const l = (id: string, x: number, width = 40) => ({ id, x, width });
  it("puts a label that would touch its neighbour in the next row, and back in the first when there is room", () => {
    // spans: a 80–120, b 100–140 (overlaps a → row 1), c 280–320 (clear of a by 160 → row 0)
    expect(staggerLabels([l("a", 100), l("b", 120), l("c", 300)]).map((p) => p.row)).toEqual([0, 1, 0]);
  });
  it("thins the labels no row has room for", () => {
    expect(staggerLabels([l("a", 100), l("b", 120), l("c", 300)], { rows: 1 }).map((p) => p.row)).toEqual([0, null, 0]);
    expect(staggerLabels([l("a", 100), l("b", 110), l("c", 120)], { rows: 2 }).map((p) => p.row)).toEqual([0, 1, null]);
  });
  it("keeps the gap: 4 px apart is enough, 3 px is not", () => {
    // a ends at 120; b starting at 124 (x 144) fits, at 123 (x 143) does not
    expect(staggerLabels([l("a", 100), l("b", 144)], { rows: 1, gap: 4 }).map((p) => p.row)).toEqual([0, 0]);
    expect(staggerLabels([l("a", 100), l("b", 143)], { rows: 1, gap: 4 }).map((p) => p.row)).toEqual([0, null]);
  });
  it("answers in the order given, whatever the order of x", () => {
    expect(staggerLabels([l("c", 300), l("a", 100), l("b", 120)]).map((p) => [p.id, p.row])).toEqual([["c", 0], ["a", 0], ["b", 1]]);
  });
  it("slides a label at the edge inside the plot before checking room", () => {
    expect(labelSpan(l("a", 5), 0, 400)).toEqual([0, 40]);
    expect(labelSpan(l("a", 395), 0, 400)).toEqual([360, 400]);
    // slid to 360–400, a label at 350 (330–370) no longer fits beside it in one row
    expect(staggerLabels([l("a", 350), l("b", 395)], { rows: 1, maxX: 400 }).map((p) => p.row)).toEqual([0, null]);
  });
});

describe("clearestBox", () => {
  const box = (left: number, top = 0) => ({ left, top, width: 20, height: 20 });
  it("takes the first box with no mark in it (marks within the padding count)", () => {
    expect(clearestBox([box(0), box(100)], [{ x: 10, y: 10 }])).toEqual(box(100));
    expect(clearestBox([box(0), box(100)], [{ x: 22, y: 10 }], 3)).toEqual(box(100)); // 2 px outside, inside the 3 px pad
    expect(clearestBox([box(0), box(100)], [{ x: 24, y: 10 }], 3)).toEqual(box(0)); // 4 px outside
  });
  it("falls back to the box holding fewest marks", () => {
    const marks = [{ x: 5, y: 5 }, { x: 15, y: 15 }, { x: 105, y: 5 }];
    expect(clearestBox([box(0), box(100)], marks)).toEqual(box(100));
  });
  it("throws with no candidates", () => {
    expect(() => clearestBox([], [])).toThrow(RangeError);
  });
});

describe("textWidthPx", () => {
  it("is characters × size × em", () => {
    expect(textWidthPx("DP-1004", 11)).toBeCloseTo(7 * 11 * 0.58, 12);
  });
});
