import { describe, expect, it } from "vitest";
import { headwaterReaches, pathToOutlet } from "@/lib/results/path";
import { chainFile, example } from "./fixtures";

describe("path to the outlet", () => {
  it("follows downstream links to the outlet", () => {
    const f = chainFile();
    expect(pathToOutlet(f, "R1")).toEqual(["R1", "R2", "R3"]);
    expect(pathToOutlet(f, "S1")).toEqual(["S1", "R3"]);
    expect(pathToOutlet(f, "R3")).toEqual(["R3"]);
    expect(headwaterReaches(f)).toEqual(["R1", "S1"]);
  });

  it("throws for an unknown reach, a dangling link and a loop", () => {
    expect(() => pathToOutlet(chainFile(), "X")).toThrow(/No reach "X"/);
    const dangling = chainFile();
    dangling.reaches[2].downstream = "GONE";
    expect(() => pathToOutlet(dangling, "R1")).toThrow(/"GONE"/);
    const loop = chainFile();
    loop.reaches[2].downstream = "R1";
    expect(() => pathToOutlet(loop, "R2")).toThrow(/loop/);
  });

  it("ends at the outlet from every reach of the demo basin", () => {
    const f = example("tamsel-river");
    const outlet = f.reaches.find((r) => r.downstream === null)!.id;
    for (const r of f.reaches) {
      const path = pathToOutlet(f, r.id);
      expect(path[0]).toBe(r.id);
      expect(path[path.length - 1]).toBe(outlet);
      expect(new Set(path).size).toBe(path.length);
    }
    // every headwater reach has no reach flowing into it
    for (const h of headwaterReaches(f)) expect(f.reaches.some((r) => r.downstream === h)).toBe(false);
  });
});
