import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { GeoError, readShapefileZip, validateImport } from "@/geo";
import { writeZip } from "@/scripts/lib/zip-writer";
import { fixtureBytes } from "./helpers";
import { readZipEntries } from "./zip-entries";

const DEMO = new Uint8Array(fixtureBytes("demo/tamsel-reaches.zip"));
const ENTRIES = readZipEntries(DEMO);
const MAPPING = { reachId: "REACH_ID", downstreamId: "DOWN_ID", designFlow: { source: "FLOW_CFS", unit: "cfs" as const } };

/** Reading and validating must end in a report or a GeoError, never anything else. */
async function readAndValidate(bytes: Uint8Array): Promise<"report" | "typed error"> {
  try {
    const layer = await readShapefileZip(bytes);
    const report = validateImport({ reaches: layer, reachMapping: MAPPING });
    expect(Array.isArray(report.errors) && Array.isArray(report.warnings)).toBe(true);
    return "report";
  } catch (e) {
    if (!(e instanceof GeoError)) throw new Error(`untyped exception: ${String(e)}`);
    expect(e.message.length).toBeGreaterThan(10);
    return "typed error";
  }
}

const flips = (size: number) => fc.array(fc.record({ at: fc.nat({ max: size - 1 }), xor: fc.integer({ min: 1, max: 255 }) }), { minLength: 1, maxLength: 12 });

function applyFlips(bytes: Uint8Array, changes: Array<{ at: number; xor: number }>): Uint8Array {
  const out = bytes.slice();
  for (const c of changes) out[c.at] ^= c.xor;
  return out;
}

describe("randomly corrupted shapefile uploads", () => {
  it("the untouched demo zip gives a report", async () => {
    expect(await readAndValidate(DEMO)).toBe("report");
  });

  it("flipped, truncated or padded zip bytes give a report or a typed error", async () => {
    const zipCorruption = fc.oneof(
      flips(DEMO.length).map((c) => applyFlips(DEMO, c)),
      fc.nat({ max: DEMO.length - 1 }).map((n) => DEMO.slice(0, n)),
      fc.tuple(fc.nat({ max: DEMO.length }), fc.uint8Array({ minLength: 1, maxLength: 64 })).map(([at, junk]) => {
        const out = new Uint8Array(DEMO.length + junk.length);
        out.set(DEMO.subarray(0, at));
        out.set(junk, at);
        out.set(DEMO.subarray(at), at + junk.length);
        return out;
      }),
    );
    await fc.assert(fc.asyncProperty(zipCorruption, async (bytes) => void (await readAndValidate(bytes))), { numRuns: 300 });
  }, 60_000);

  it("damaged .shp, .dbf or .prj contents inside a sound zip give a report or a typed error", async () => {
    const fileCorruption = fc
      .constantFrom(...ENTRIES.map((_, i) => i))
      .chain((i) => fc.tuple(fc.constant(i), fc.oneof(flips(ENTRIES[i].data.length).map((c) => ({ flips: c })), fc.nat({ max: ENTRIES[i].data.length }).map((n) => ({ cut: n })))));
    await fc.assert(
      fc.asyncProperty(fileCorruption, async ([i, change]) => {
        const entries = ENTRIES.map((e, k) => {
          if (k !== i) return e;
          return { ...e, data: "cut" in change ? e.data.slice(0, change.cut) : applyFlips(e.data, change.flips) };
        });
        await readAndValidate(writeZip(entries));
      }),
      { numRuns: 300 },
    );
  }, 60_000);
});
