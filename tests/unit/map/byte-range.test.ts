import { describe, expect, it } from "vitest";
import { parseByteRange } from "@/lib/map/byte-range";

// Expected values: the examples of RFC 9110 §14.1.2 for a 10000-byte representation.
describe("parseByteRange", () => {
  const size = 10000;
  it("reads the RFC's examples", () => {
    expect(parseByteRange("bytes=0-499", size)).toEqual({ start: 0, end: 499 }); // the first 500 bytes
    expect(parseByteRange("bytes=500-999", size)).toEqual({ start: 500, end: 999 }); // the second 500 bytes
    expect(parseByteRange("bytes=-500", size)).toEqual({ start: 9500, end: 9999 }); // the final 500 bytes
    expect(parseByteRange("bytes=9500-", size)).toEqual({ start: 9500, end: 9999 }); // the final 500 bytes
    expect(parseByteRange("bytes=0-0", size)).toEqual({ start: 0, end: 0 }); // the first byte
    expect(parseByteRange("bytes=-1", size)).toEqual({ start: 9999, end: 9999 }); // the last byte
  });
  it("cuts an end past the file, and a suffix longer than it, to the file (§14.1.2)", () => {
    expect(parseByteRange("bytes=9000-20000", size)).toEqual({ start: 9000, end: 9999 });
    expect(parseByteRange("bytes=-20000", size)).toEqual({ start: 0, end: 9999 });
  });
  it("is unsatisfiable from the end of the file on, and for a zero-length suffix (§15.5.17)", () => {
    expect(parseByteRange("bytes=10000-", size)).toBe("unsatisfiable");
    expect(parseByteRange("bytes=-0", size)).toBe("unsatisfiable");
    expect(parseByteRange("bytes=0-", 0)).toBe("unsatisfiable");
  });
  it("ignores what it does not serve: no header, other units, several ranges, end before start, junk", () => {
    for (const h of [null, undefined, "", "items=0-1", "bytes=0-1,5-9", "bytes=9-1", "bytes=-", "bytes=a-b"]) expect(parseByteRange(h, size)).toBeNull();
  });
});
