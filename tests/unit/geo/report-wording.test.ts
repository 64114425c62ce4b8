import { distance } from "@turf/turf";
import { describe, expect, it } from "vitest";
import { validateImport } from "@/geo";
import { lines } from "./helpers";

/** What the import report tells a planner about breaks in the network: one piece of advice, named places, distances. */
const run = (items: Parameters<typeof lines>[0]) => validateImport({ reaches: lines(items), reachMapping: { reachId: "id" } }, {});

describe("the report's words about breaks", () => {
  it("an end about 40 m from another line's end gets one piece of advice, not also 'split it'", () => {
    // A ends 22 m east and 33 m north of R05's start: 40 m from that end, its foot on R05 lies mid-reach
    const end = [0.001 + 0.0002, 0.0003];
    const r = run([
      { id: "A", coordinates: [[0.0012, 0.01], end] },
      { id: "R05", coordinates: [[0.001, 0], [0.02, 0]] },
    ]);
    const advice = [...r.warnings, ...r.errors].filter((p) => p.code === "gap" || p.code === "ends_mid_reach");
    expect(advice.map((p) => p.code)).toEqual(["gap"]);
    const metres = distance(end, [0.001, 0], { units: "meters" }); // turf's haversine, the distance the tolerance is tested on
    expect(advice[0].message).toContain(`${metres.toFixed(1)} m apart`);
    expect(advice[0].message).toContain(`raise the tolerance to ${Math.ceil(metres)} m`);
  });

  it("separate parts are named by their outlet reaches and their closest ends, with the distance between them", () => {
    // a line cut 230 m short of the rest: M1 ends at 0.01°E, M2 starts 0.00207° further east
    const r = run([
      { id: "M1", coordinates: [[0, 0], [0.01, 0]] },
      { id: "M2", coordinates: [[0.01207, 0], [0.03, 0]] },
      { id: "M3", coordinates: [[0.03, 0], [0.04, 0]] },
    ]);
    const parts = r.errors.find((p) => p.code === "disconnected_parts")!;
    expect(parts.message).toContain("2 separate parts");
    expect(parts.message).toContain("outlet at the downstream end of M3");
    expect(parts.message).toContain("outlet at the downstream end of M1");
    const metres = distance([0.01, 0], [0.01207, 0], { units: "meters" });
    expect(parts.message).toContain(`the end of M1 at (0.01000, 0.00000) and the start of M2 at (0.01207, 0.00000) are ${metres.toFixed(1)} m apart`);
    expect(parts.message).not.toMatch(/\bN\d+\b/); // no node ids: the map does not show them
  });
});
