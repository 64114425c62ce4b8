import Papa from "papaparse";
import { z } from "zod";
import type { DailyValue } from "./design-temperature";
import type { DailyFlow } from "./low-flow";

/** Units a daily flow record may come in; flows are returned in m³/s. */
export const flowUnitSchema = z.enum(["m3/s", "cfs"], { message: 'unit must be "m3/s" or "cfs"' });
export type FlowUnit = z.infer<typeof flowUnitSchema>;

/** 1 ft³/s in m³/s: (0.3048 m)³ = 0.028316846592 exactly, by the definition of the international foot (written out: 0.3048 ** 3 carries float noise). */
export const CFS_TO_M3S = 0.028316846592;

/** A line of a record that cannot be read, named by its line number (1-based, as an editor shows it). */
export class RecordError extends Error {
  constructor(
    readonly line: number | null,
    message: string,
  ) {
    super(line === null ? message : `line ${line}: ${message}`);
    this.name = "RecordError";
  }
}

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;

function flowValue(raw: string, line: number, unit: FlowUnit, words: boolean): number | null {
  const t = raw.trim();
  // blanks are missing days; in rdb text so are the qualifier words printed in place of a value (ice, equipment failure…)
  if (t === "" || (words && /^[A-Za-z_*]+$/.test(t))) return null;
  const v = Number(t);
  if (!Number.isFinite(v)) throw new RecordError(line, `flow "${t}" is not a number`);
  if (v < 0) throw new RecordError(line, `flow ${t} is negative`);
  return unit === "cfs" ? v * CFS_TO_M3S : v;
}

function push(out: DailyFlow[], seen: Set<string>, date: string, flow: number | null, line: number) {
  if (!ISO_DAY.test(date)) throw new RecordError(line, `date "${date}" is not an ISO date (YYYY-MM-DD)`);
  if (seen.has(date)) throw new RecordError(line, `date ${date} appears twice`);
  seen.add(date);
  out.push({ date, flow });
}

/**
 * A daily flow record as text: either CSV with a header `date,flow` (ISO dates), or the
 * tab-separated "rdb" text national water-data services publish (comment lines starting
 * with #, a header row, a row of column formats such as `5s 15s 20d 14n 10s`, then data;
 * the date column is `datetime` and the flow the first column after it whose name is not a
 * qualifier `…_cd`). Blank or qualifier-only values are missing days. Throws RecordError
 * naming the line at fault.
 */
export function readDailyRecord(text: string, unit: FlowUnit): DailyFlow[] {
  const lines = text.replace(/^\uFEFF/, "").split(/\r?\n/);
  const first = lines.findIndex((l) => l.trim() !== "" && !l.startsWith("#"));
  if (first < 0) throw new RecordError(null, "the record is empty");
  const out: DailyFlow[] = [];
  const seen = new Set<string>();
  if (lines[first].includes("\t")) {
    const header = lines[first].split("\t").map((h) => h.trim());
    const dateCol = header.indexOf("datetime");
    if (dateCol < 0) throw new RecordError(first + 1, 'a tab-separated record needs a "datetime" column');
    const flowCol = header.findIndex((h, i) => i > dateCol && !h.endsWith("_cd"));
    if (flowCol < 0) throw new RecordError(first + 1, "no flow column after datetime");
    let i = first + 1;
    if (i < lines.length && /^(\d+[sdn]\t?)+$/.test(lines[i].trim().replace(/\s+/g, "\t"))) i++; // the formats row
    for (; i < lines.length; i++) {
      if (lines[i].trim() === "" || lines[i].startsWith("#")) continue;
      const cells = lines[i].split("\t");
      push(out, seen, (cells[dateCol] ?? "").trim().slice(0, 10), flowValue(cells[flowCol] ?? "", i + 1, unit, true), i + 1);
    }
    return out.sort((a, b) => a.date.localeCompare(b.date));
  }
  const parsed = Papa.parse<Record<string, string>>(lines.slice(first).join("\n"), { header: true, skipEmptyLines: true, transformHeader: (h) => h.trim().toLowerCase() });
  const fields = parsed.meta.fields ?? [];
  if (!fields.includes("date") || !fields.includes("flow")) throw new RecordError(first + 1, `the header must name the columns date and flow (it has: ${fields.join(", ")})`);
  parsed.data.forEach((row, k) => {
    const line = first + 2 + k;
    push(out, seen, (row.date ?? "").trim(), flowValue(row.flow ?? "", line, unit, false), line);
  });
  return out.sort((a, b) => a.date.localeCompare(b.date));
}

/** Units a daily water-temperature record may come in; temperatures are returned in °C. */
export const temperatureUnitSchema = z.enum(["C", "F"], { message: 'unit must be "C" or "F"' });
export type TemperatureRecordUnit = z.infer<typeof temperatureUnitSchema>;

/** Plausible daily mean water temperatures (°C); a value outside is refused as a misread unit or a typing slip. */
const WATER_C = { min: -2, max: 45 };

/**
 * A daily water-temperature record as text: CSV with a header `date,temperature` (ISO dates;
 * a blank value is a missing day) or rdb text (the first value column after `datetime`),
 * in °C or °F. Returns daily means in °C, sorted by date. Throws RecordError naming the line.
 */
export function readDailyTemperature(text: string, unit: TemperatureRecordUnit): DailyValue[] {
  const lines = text.replace(/^\uFEFF/, "").split(/\r?\n/);
  const first = lines.findIndex((l) => l.trim() !== "" && !l.startsWith("#"));
  if (first < 0) throw new RecordError(null, "the record is empty");
  const value = (raw: string, line: number, words: boolean): number | null => {
    const t = raw.trim();
    if (t === "" || (words && /^[A-Za-z_*]+$/.test(t))) return null;
    const v = Number(t);
    if (!Number.isFinite(v)) throw new RecordError(line, `temperature "${t}" is not a number`);
    const c = unit === "F" ? ((v - 32) * 5) / 9 : v;
    if (c < WATER_C.min || c > WATER_C.max) throw new RecordError(line, `temperature ${t} °${unit} lies outside ${WATER_C.min}–${WATER_C.max} °C for water; check the unit`);
    return c;
  };
  const out: DailyValue[] = [];
  const seen = new Set<string>();
  const add = (date: string, v: number | null, line: number) => {
    if (!ISO_DAY.test(date)) throw new RecordError(line, `date "${date}" is not an ISO date (YYYY-MM-DD)`);
    if (seen.has(date)) throw new RecordError(line, `date ${date} appears twice`);
    seen.add(date);
    out.push({ date, value: v });
  };
  if (lines[first].includes("\t")) {
    const header = lines[first].split("\t").map((h) => h.trim());
    const dateCol = header.indexOf("datetime");
    if (dateCol < 0) throw new RecordError(first + 1, 'a tab-separated record needs a "datetime" column');
    const col = header.findIndex((h, i) => i > dateCol && !h.endsWith("_cd"));
    if (col < 0) throw new RecordError(first + 1, "no temperature column after datetime");
    let i = first + 1;
    if (i < lines.length && /^(\d+[sdn]\t?)+$/.test(lines[i].trim().replace(/\s+/g, "\t"))) i++;
    for (; i < lines.length; i++) {
      if (lines[i].trim() === "" || lines[i].startsWith("#")) continue;
      const cells = lines[i].split("\t");
      add((cells[dateCol] ?? "").trim().slice(0, 10), value(cells[col] ?? "", i + 1, true), i + 1);
    }
  } else {
    const parsed = Papa.parse<Record<string, string>>(lines.slice(first).join("\n"), { header: true, skipEmptyLines: true, transformHeader: (h) => h.trim().toLowerCase() });
    const fields = parsed.meta.fields ?? [];
    if (!fields.includes("date") || !fields.includes("temperature")) throw new RecordError(first + 1, `the header must name the columns date and temperature (it has: ${fields.join(", ")})`);
    parsed.data.forEach((row, k) => add((row.date ?? "").trim(), value(row.temperature ?? "", first + 2 + k, false), first + 2 + k));
  }
  return out.sort((a, b) => a.date.localeCompare(b.date));
}
