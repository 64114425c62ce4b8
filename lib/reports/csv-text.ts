import Papa from "papaparse";

/** A column of a CSV file: its header and how a row fills its cell (empty when null or undefined). */
export interface CsvColumn<T> {
  header: string;
  value: (row: T) => string | number | null | undefined;
}

/** Rows, columns and notes of one CSV file (the notes — caution first — fill its last column). */
export interface CsvTable<T> {
  notes: string[];
  columns: CsvColumn<T>[];
  rows: T[];
}

/**
 * A text cell a spreadsheet would run as a formula: it starts with =, +, -, @,
 * a tab or a carriage return (the usual CSV-injection rule) and is not simply a
 * number (a negative load or a signed DO change must stay a number).
 */
export const FORMULA_LEADING = /^(?![-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$)[=+\-@\t\r]/;

/** The header of the last column, which carries the planning caution and what the file holds (docs/exports.md). */
export const NOTES_HEADER = "Notes";

/**
 * Spreadsheets set to a locale whose list separator is ";" split an unquoted
 * cell there, so a text cell holding one is quoted as a comma would make it.
 */
const quoteSemicolons = (value: unknown) => typeof value === "string" && value.includes(";");

/**
 * The notes column: one note per row from the first data row down, so the caution sits
 * beside the first rows a reader sees. When the notes outnumber the rows, the last row
 * holds the rest, joined; a table without rows gets one row of empty cells for them.
 */
function notesColumn(notes: readonly string[], rowCount: number): string[] {
  const clean = notes.map((n) => n.replace(/[\r\n]+/g, " ").trim()).filter((n) => n !== "");
  if (clean.length === 0) return [];
  const rows = Math.max(rowCount, 1);
  if (clean.length <= rows) return [...clean, ...Array<string>(rows - clean.length).fill("")];
  return [...clean.slice(0, rows - 1), clean.slice(rows - 1).join(" ")];
}

/**
 * The one CSV writer, for the server's downloads and the browser's alike (RFC 4180: fields
 * separated by commas, quoted when they hold a comma, quote or line break, CRLF between
 * records; the RFC allows the last record a line break or none, and every file here ends
 * with one, as docs/exports.md states and tests/unit/reports/csv-text.test.ts pins, so a
 * file downloaded before and after reads byte for byte the same). One header row
 * (the table's columns, then "Notes"), then the rows; the planning caution and what the
 * file holds travel in the Notes column (notesColumn), so a spreadsheet and papaparse
 * (`header: true`) read the first line as the header and every other line as data.
 * papaparse quoting; a formula-leading text cell gets a leading ' so it is shown, never
 * run.
 */
export function csvText<T>(table: CsvTable<T>): string {
  const notes = notesColumn(table.notes, table.rows.length);
  const cells = (r: T | undefined) => table.columns.map((c) => (r === undefined ? "" : (c.value(r) ?? "")));
  const data = notes.map((note, i) => [...cells(table.rows[i]), note]);
  for (let i = notes.length; i < table.rows.length; i++) data.push([...cells(table.rows[i]), ""]);
  const fields = [...table.columns.map((c) => c.header), ...(notes.length > 0 ? [NOTES_HEADER] : [])];
  const body = Papa.unparse({ fields, data: notes.length > 0 ? data : table.rows.map((r) => cells(r)) }, { escapeFormulae: FORMULA_LEADING, quotes: quoteSemicolons, newline: "\r\n" });
  return body + "\r\n";
}
