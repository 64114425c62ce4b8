import { inflateRawSync } from "node:zlib";
import type { ZipEntry } from "@/scripts/lib/zip-writer";

/** Entries of a zip written by scripts/lib/zip-writer (deflated, sizes in the local headers). */
export function readZipEntries(zip: Uint8Array): ZipEntry[] {
  const b = Buffer.from(zip);
  const out: ZipEntry[] = [];
  let at = 0;
  while (b.readUInt32LE(at) === 0x04034b50) {
    const size = b.readUInt32LE(at + 18);
    const nameLength = b.readUInt16LE(at + 26);
    const name = b.toString("utf8", at + 30, at + 30 + nameLength);
    const start = at + 30 + nameLength + b.readUInt16LE(at + 28);
    out.push({ name, data: new Uint8Array(inflateRawSync(b.subarray(start, start + size))) });
    at = start + size;
  }
  return out;
}
