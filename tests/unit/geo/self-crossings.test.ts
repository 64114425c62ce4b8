import { kinks, lineString } from "@turf/turf";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { selfCrossings } from "@/geo/self-crossings";
import type { LngLat } from "@/geo/types";

/** turf's kinks() — the pairwise O(n²) reference from an independent library — as sorted points. */
const reference = (cs: LngLat[]) => sorted(kinks(lineString(cs)).features.map((f) => f.geometry.coordinates as LngLat));
const sorted = (ps: LngLat[]) => [...ps].sort((a, b) => a[0] - b[0] || a[1] - b[1]);

describe("selfCrossings", () => {
  it("finds what turf kinks() finds on crafted lines", () => {
    const cases: Record<string, LngLat[]> = {
      figureEight: [[0, 0], [1, 1], [1, 0], [0, 1]],
      closedSquare: [[0, 0], [1, 0], [1, 1], [0, 1], [0, 0]],
      closedBowtie: [[0, 0], [1, 1], [1, 0], [0, 1], [0, 0]],
      touchAtVertex: [[0, 0], [2, 0], [2, 1], [1, 0], [1, -1]],
      collinearOverlap: [[0, 0], [2, 0], [2, 1], [1, 1], [1, 0], [3, 0]],
      straight: [[0, 0], [1, 0], [2, 0], [3, 0]],
      spiralIn: [[0, 0], [4, 0], [4, 4], [1, 4], [1, 1], [3, 1], [3, 3], [2, 3], [2, -1]],
    };
    for (const [name, cs] of Object.entries(cases)) {
      expect(sorted(selfCrossings(cs).points), name).toEqual(reference(cs));
    }
    expect(selfCrossings(cases.figureEight).points).toHaveLength(1);
    expect(selfCrossings(cases.straight).points).toHaveLength(0);
  });

  it("agrees with turf kinks() on random lines, tangled and river-like", () => {
    const coord = fc.tuple(fc.integer({ min: 0, max: 20 }), fc.integer({ min: 0, max: 20 })).map(([x, y]) => [x / 2, y / 2] as LngLat);
    const line = fc.array(coord, { minLength: 2, maxLength: 40 }).map((cs) => cs.filter((c, i) => i === 0 || c[0] !== cs[i - 1][0] || c[1] !== cs[i - 1][1]));
    fc.assert(
      fc.property(line, (cs) => {
        if (cs.length < 2) return;
        expect(sorted(selfCrossings(cs, Infinity).points)).toEqual(reference(cs));
      }),
      { numRuns: 500 },
    );
    // A meandering river-like walk of 3 000 vertices with some loops back over itself.
    let seed = 7;
    const rand = () => ((seed = (seed * 16807) % 2147483647) / 2147483647);
    const walk: LngLat[] = [[0, 0]];
    let heading = 0;
    for (let i = 1; i < 3000; i++) {
      heading += (rand() - 0.5) * 1.2;
      const [x, y] = walk[i - 1];
      walk.push([x + Math.cos(heading) * 1e-3, y + Math.sin(heading) * 1e-3]);
    }
    const found = sorted(selfCrossings(walk, Infinity).points);
    expect(found).toEqual(reference(walk));
    expect(found.length).toBeGreaterThan(0);
  });

  it("stops at maxPoints on a scribble and says so", () => {
    const scribble: LngLat[] = Array.from({ length: 200 }, (_, i) => [i % 2, i / 200] as LngLat).map(([x, y], i) => [x, i % 4 < 2 ? y : 1 - y]);
    const all = kinks(lineString(scribble)).features.length;
    expect(all).toBeGreaterThan(50);
    const r = selfCrossings(scribble, 50);
    expect(r).toMatchObject({ truncated: true });
    expect(r.points).toHaveLength(50);
  });
});
