import Papa from "papaparse";
import type { CsvTable } from "@/lib/results/csv-rows";

/**
 * A text cell a spreadsheet would run as a formula: it starts with =, +, -, @,
 * a tab or a carriage return (the usual CSV-injection rule) and is not simply a
 * number (a negative load or a signed DO change must stay a number).
 */
export const FORMULA_LEADING = /^(?![-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$)[=+\-@\t\r]/;

/**
 * The one CSV writer, for the server's downloads and the browser's alike: each
 * preface line as `# line`, then the header and rows (papaparse quoting; a
 * formula-leading text cell gets a leading ' so it is shown, never run), CRLF
 * line ends including the last.
 */
export function csvText<T>(table: CsvTable<T>): string {
  const body = Papa.unparse(
    { fields: table.columns.map((c) => c.header), data: table.rows.map((r) => table.columns.map((c) => c.value(r) ?? "")) },
    { escapeFormulae: FORMULA_LEADING, newline: "\r\n" },
  );
  return [...table.preface.map((line) => `# ${line.replace(/[\r\n]+/g, " ")}`), body].join("\r\n") + "\r\n";
}
