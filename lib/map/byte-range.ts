/**
 * One byte range of a file, inclusive at both ends, as HTTP's Range header asks for it.
 * `null` from parseByteRange means "send the whole file" (no header, a header in another
 * unit, several ranges, or one that does not parse: RFC 9110 §14.2 lets a server ignore
 * those); `"unsatisfiable"` means a 416 (the range starts at or past the end).
 */
export type ByteRange = { start: number; end: number };

/**
 * Reads a `Range: bytes=…` header against a file of `size` bytes (RFC 9110 §14.1.2):
 * `bytes=0-99` the first 100 bytes, `bytes=100-` from byte 100 to the end, `bytes=-500`
 * the last 500; an end past the file is cut to its last byte.
 * Example: parseByteRange("bytes=10-", 50) → { start: 10, end: 49 }.
 */
export function parseByteRange(header: string | null | undefined, size: number): ByteRange | "unsatisfiable" | null {
  if (!header) return null;
  const m = /^\s*bytes\s*=\s*(\d*)\s*-\s*(\d*)\s*$/i.exec(header);
  if (!m) return null;
  const [, a, b] = m;
  if (a === "" && b === "") return null;
  if (a === "") {
    const suffix = Number(b);
    if (suffix === 0 || size === 0) return "unsatisfiable";
    return { start: Math.max(0, size - suffix), end: size - 1 };
  }
  const start = Number(a);
  if (b !== "" && Number(b) < start) return null;
  if (start >= size) return "unsatisfiable";
  return { start, end: b === "" ? size - 1 : Math.min(Number(b), size - 1) };
}
