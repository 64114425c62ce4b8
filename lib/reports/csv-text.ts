import Papa from "papaparse";
import type { CsvTable } from "@/lib/results/csv-rows";

/**
 * A CSV table as text, the same layout the browser download writes: each preface
 * line as `# line`, then the header and rows (papaparse quoting), CRLF line ends.
 */
export function csvText<T>(table: CsvTable<T>): string {
  const body = Papa.unparse({ fields: table.columns.map((c) => c.header), data: table.rows.map((r) => table.columns.map((c) => c.value(r) ?? "")) });
  return [...table.preface.map((line) => `# ${line}`), body].join("\r\n") + "\r\n";
}
