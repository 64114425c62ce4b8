import Papa from "papaparse";
import type { CsvTable } from "@/lib/results/csv-rows";

/**
 * A text cell a spreadsheet would run as a formula: it starts with =, +, -, @,
 * a tab or a carriage return (the usual CSV-injection rule) and is not simply a
 * number (a negative load or a signed DO change must stay a number).
 */
export const FORMULA_LEADING = /^(?![-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$)[=+\-@\t\r]/;

/**
 * Spreadsheets set to a locale whose list separator is ";" split an unquoted
 * cell there, so a text cell holding one is quoted as a comma would make it.
 */
const quoteSemicolons = (value: unknown) => typeof value === "string" && value.includes(";");

/**
 * A preface line is one unquoted cell read as comments; any piece after a "," or
 * ";" that a spreadsheet would run gets the same leading quote as a cell.
 */
const prefaceLine = (line: string) => `# ${line.replace(/[\r\n]+/g, " ").replace(/([,;]\s*)(?=[=+\-@\t])/g, "$1'")}`;

/**
 * The one CSV writer, for the server's downloads and the browser's alike: each
 * preface line as `# line`, then the header and rows (papaparse quoting; a
 * formula-leading text cell gets a leading ' so it is shown, never run), CRLF
 * line ends including the last.
 */
export function csvText<T>(table: CsvTable<T>): string {
  const body = Papa.unparse(
    { fields: table.columns.map((c) => c.header), data: table.rows.map((r) => table.columns.map((c) => c.value(r) ?? "")) },
    { escapeFormulae: FORMULA_LEADING, quotes: quoteSemicolons, newline: "\r\n" },
  );
  return [...table.preface.map(prefaceLine), body].join("\r\n") + "\r\n";
}
