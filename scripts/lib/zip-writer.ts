import { crc32, deflateRawSync } from "node:zlib";

export interface ZipEntry {
  name: string;
  data: Uint8Array;
}

/** 1 January 2026, 00:00, in MS-DOS date/time form: fixed so the output is byte-for-byte repeatable. */
const DOS_TIME = 0;
const DOS_DATE = ((2026 - 1980) << 9) | (1 << 5) | 1;

/**
 * Writes a zip archive (PKWARE APPNOTE 6.3: local headers, central directory, end record),
 * deflating each entry with node:zlib. Deterministic: fixed timestamps, entries in the given order.
 */
export function writeZip(entries: readonly ZipEntry[]): Uint8Array {
  const chunks: Buffer[] = [];
  const central: Buffer[] = [];
  let offset = 0;
  for (const e of entries) {
    const name = Buffer.from(e.name, "utf8");
    const packed = deflateRawSync(e.data, { level: 9 });
    // The local header and the central directory entry share this run of fields.
    const common = Buffer.alloc(26);
    common.writeUInt16LE(20, 0); // version needed to extract
    common.writeUInt16LE(0x0800, 2); // flags: UTF-8 names
    common.writeUInt16LE(8, 4); // deflate
    common.writeUInt16LE(DOS_TIME, 6);
    common.writeUInt16LE(DOS_DATE, 8);
    common.writeUInt32LE(crc32(e.data) >>> 0, 10);
    common.writeUInt32LE(packed.length, 14);
    common.writeUInt32LE(e.data.length, 18);
    common.writeUInt16LE(name.length, 22);
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    common.copy(local, 4);
    const dir = Buffer.alloc(46);
    dir.writeUInt32LE(0x02014b50, 0);
    dir.writeUInt16LE(20, 4); // version made by
    common.copy(dir, 6);
    dir.writeUInt32LE(offset, 42);
    chunks.push(local, name, packed);
    central.push(dir, name);
    offset += local.length + name.length + packed.length;
  }
  const dirBytes = Buffer.concat(central);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(entries.length, 8);
  end.writeUInt16LE(entries.length, 10);
  end.writeUInt32LE(dirBytes.length, 12);
  end.writeUInt32LE(offset, 16);
  return new Uint8Array(Buffer.concat([...chunks, dirBytes, end]));
}
