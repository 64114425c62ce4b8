import iconv from "iconv-lite";
import { parseDbf } from "shpjs";
import type { ReadWarning } from "./types";

/** Where the text encoding of a .dbf was taken from. */
export type DbfEncodingSource = "cpg" | "ldid" | "default";

export interface DbfEncoding {
  /** An encoding name iconv-lite knows, e.g. "utf-8", "windows-1252", "cp850". */
  encoding: string;
  source: DbfEncodingSource;
}

/**
 * dBASE language-driver ids (byte 29 of the .dbf header) and their code pages. From memory of
 * the dBASE / ESRI table that GDAL's shapefile driver also follows; 0x57 is what GDAL writes by
 * default ("ANSI", which GDAL reads as ISO-8859-1; windows-1252 is its superset).
 */
const LDID: Record<number, string> = {
  0x01: "cp437", 0x02: "cp850", 0x03: "windows-1252", 0x04: "macintosh", 0x08: "cp865", 0x09: "cp437",
  0x0a: "cp850", 0x0b: "cp437", 0x0d: "cp437", 0x0e: "cp850", 0x0f: "cp437", 0x10: "cp850", 0x11: "cp437",
  0x12: "cp850", 0x13: "cp932", 0x14: "cp850", 0x15: "cp437", 0x16: "cp850", 0x17: "cp865", 0x18: "cp437",
  0x19: "cp437", 0x1a: "cp850", 0x1b: "cp437", 0x1c: "cp863", 0x1d: "cp850", 0x1f: "cp852", 0x22: "cp852",
  0x23: "cp852", 0x24: "cp860", 0x25: "cp850", 0x26: "cp866", 0x37: "cp850", 0x40: "cp852", 0x4d: "cp936",
  0x4e: "cp949", 0x4f: "cp950", 0x50: "cp874", 0x57: "windows-1252", 0x58: "windows-1252", 0x59: "windows-1252",
  0x64: "cp852", 0x65: "cp866", 0x66: "cp865", 0x67: "cp861", 0x6a: "cp737", 0x6b: "cp857", 0x78: "cp950",
  0x79: "cp949", 0x7a: "cp936", 0x7b: "cp932", 0x7c: "cp874", 0x7d: "windows-1255", 0x7e: "windows-1256",
  0x86: "cp737", 0x87: "cp852", 0x88: "cp857", 0x96: "maccyrillic", 0x97: "maccenteuro", 0x98: "macgreek",
  0xc8: "windows-1250", 0xc9: "windows-1251", 0xca: "windows-1254", 0xcb: "windows-1253", 0xcc: "windows-1257",
};

/** Windows code page numbers that are not "windows-NNNN" in iconv-lite. */
const CODE_PAGE: Record<string, string> = { "65001": "utf-8", "28591": "iso-8859-1", "20127": "ascii" };

/**
 * The encoding a .cpg names ("UTF-8", "1252", "ANSI 1252", "8859_1", "88591", "CP850", "65001"…)
 * as a name iconv-lite knows, or undefined when it names none.
 */
export function cpgEncoding(text: string): string | undefined {
  const t = text.replace(/^\uFEFF/, "").trim();
  const candidates: string[] = [];
  const number = /^(?:ANSI\s*|CP\s*|OEM\s*)?(\d{3,5})$/i.exec(t)?.[1];
  if (number) {
    if (CODE_PAGE[number]) candidates.push(CODE_PAGE[number]);
    const iso = /^8859(\d{1,2})$/.exec(number)?.[1];
    if (iso) candidates.push(`iso-8859-${iso}`);
    candidates.push(`windows-${number}`, `cp${number}`);
  }
  const iso = /^(?:ISO[-_ ]?)?8859[-_ ](\d{1,2})$/i.exec(t)?.[1];
  if (iso) candidates.push(`iso-8859-${iso}`);
  candidates.push(t);
  return candidates.find((c) => c !== "" && iconv.encodingExists(c))?.toLowerCase();
}

/** The encoding of a .dbf: its .cpg, else its language-driver byte, else UTF-8. */
export function dbfEncoding(dbf: Uint8Array, cpg: Uint8Array | undefined, warnings: ReadWarning[], base: string): DbfEncoding {
  if (cpg) {
    const text = new TextDecoder().decode(cpg);
    const encoding = cpgEncoding(text);
    if (encoding) return { encoding, source: "cpg" };
    warnings.push({
      code: "text_encoding_invalid",
      message: `${base}.cpg names the text encoding "${text.trim().slice(0, 40)}", which Sagline does not know; the .dbf header or UTF-8 was used instead`,
    });
  }
  const ldid = dbf.length > 29 ? LDID[dbf[29]] : undefined;
  if (ldid) return { encoding: ldid, source: "ldid" };
  return { encoding: "utf-8", source: "default" };
}

/**
 * Character → byte of windows-1252 as TextDecoder gives it, where every byte has its own
 * character (0x81 → U+0081). Node 20 decodes 0x80–0x9F as ISO-8859-1 (U+0080–U+009F) when not
 * streaming and as windows-1252 (0x82 → U+201A) when streaming, as shpjs does; both are mapped.
 */
const CP1252_BYTES = new Map<string, number>();
for (let b = 0; b < 256; b++) {
  const streaming = new TextDecoder("windows-1252");
  CP1252_BYTES.set(streaming.decode(Uint8Array.of(b), { stream: true }) + streaming.decode(), b);
  CP1252_BYTES.set(new TextDecoder("windows-1252").decode(Uint8Array.of(b)), b);
}
const bytesOf1252 = (s: string) => Uint8Array.from(s, (c) => CP1252_BYTES.get(c) ?? 0x3f);

/** Text that did not decode: U+FFFD, or control characters that no attribute holds. */
const INVALID = /[\uFFFD\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/;

const describe = (e: DbfEncoding, base: string) =>
  e.source === "cpg" ? `${e.encoding} (from ${base}.cpg)` : e.source === "ldid" ? `${e.encoding} (from the language byte of ${base}.dbf)` : `UTF-8 (${base} has no .cpg and its .dbf names no code page)`;

/**
 * The records of a .dbf (parsed by shpjs) with their text decoded in `encoding`. shpjs decodes
 * with TextDecoder only, which lacks the DOS code pages, and falls back to UTF-8 silently; so it
 * decodes as windows-1252 (a character for every byte), the bytes are recovered and iconv-lite
 * decodes them. A warning names the fields holding text not valid in the encoding used.
 */
export function decodeDbf(view: DataView, e: DbfEncoding, base: string, warnings: ReadWarning[]): Array<Record<string, unknown>> {
  const utf8 = e.encoding === "utf-8" || e.encoding === "utf8";
  const raw = parseDbf(view, utf8 ? "utf-8" : "windows-1252");
  const text = (s: string) => (utf8 ? s : iconv.decode(Buffer.from(bytesOf1252(s)), e.encoding));
  const bad = new Map<string, number>();
  const records = raw.map((r, i) => {
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(r)) {
      const key = text(k);
      const value = typeof v === "string" ? text(v) : v;
      if (typeof value === "string" && INVALID.test(value) && !bad.has(key)) bad.set(key, i + 1);
      out[key] = value;
    }
    return out;
  });
  if (bad.size > 0) {
    const where = [...bad].map(([field, row]) => `${field} (first at record ${row})`).join(", ");
    warnings.push({
      code: "text_encoding_invalid",
      message: `Some text in ${base}.dbf is not valid ${describe(e, base)}: ${where}; names may show wrong letters. Add a .cpg file naming the encoding (e.g. UTF-8 or 1252)`,
    });
  }
  return records;
}
