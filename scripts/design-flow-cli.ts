/**
 * Sagline design flows from a daily flow record:
 *   npm run design-flow -- RECORD [--unit m3/s|cfs] [--climatic-year-start MM-DD]
 * RECORD is CSV with a header `date,flow` (ISO dates) or tab-separated rdb text. Prints
 * `{ years_used, years_excluded, statistics: [{ name, days, return_period_years, value,
 * unit, empirical }], lp3: { "<days>": { mean_log10, sd_log10, skew } }, warnings }` for
 * 1Q10, 7Q10, 30Q5 and 7Q2 (lib/hydrology/low-flow.ts), flows in m3/s.
 * Exit 0 on success; 2 when the file or an argument cannot be used (the message names the
 * line or the flag). Never a stack trace.
 */
import { readFileSync } from "node:fs";
import { parseArgs } from "node:util";
import { z } from "zod";
import { lowFlowStatistics } from "@/lib/hydrology/low-flow";
import { flowUnitSchema, readDailyRecord, RecordError } from "@/lib/hydrology/read-record";
import { formatPath } from "@/lib/model/errors";
import { climaticYearStartSchema } from "@/lib/validation/gauges";

function fail(lines: string[]): never {
  for (const l of lines) process.stderr.write(`${l}\n`);
  process.exit(2);
}

const USAGE = "usage: npm run design-flow -- RECORD [--unit m3/s|cfs] [--climatic-year-start MM-DD]";

/** The command line, checked with zod like an API body. */
export const designFlowArgsSchema = z.object({
  record: z.string({ message: "give the record file" }).min(1, "give the record file"),
  unit: flowUnitSchema.default("m3/s"),
  // the same rule as the app's upload (lib/validation/gauges.ts)
  climaticYearStart: climaticYearStartSchema,
});

let parsed;
try {
  parsed = parseArgs({ args: process.argv.slice(2), allowPositionals: true, options: { unit: { type: "string" }, "climatic-year-start": { type: "string" } } });
} catch (e) {
  fail([(e as Error).message, USAGE]);
}
const args = designFlowArgsSchema.safeParse({ record: parsed.positionals[0], unit: parsed.values.unit, climaticYearStart: parsed.values["climatic-year-start"] });
// each issue named by the flag that gave the value
const FLAGS: Record<string, string> = { record: "record", unit: "--unit", climaticYearStart: "--climatic-year-start" };
if (!args.success) fail([...args.error.issues.map((i) => `${FLAGS[String(i.path[0])] ?? formatPath(i.path, "arguments")}: ${i.message}`), USAGE]);
const { record, unit, climaticYearStart } = args.data;

let text: string;
try {
  text = readFileSync(record, "utf8");
} catch (e) {
  fail([`${record}: cannot read the file (${(e as NodeJS.ErrnoException).code ?? "error"})`]);
}
try {
  const report = lowFlowStatistics(readDailyRecord(text, unit), { climaticYearStart });
  const out = {
    years_used: report.years_used,
    years_excluded: report.years_excluded,
    statistics: report.statistics.map((s) => ({ ...s, unit: "m3/s" })),
    lp3: Object.fromEntries(Object.entries(report.lp3).map(([d, f]) => [d, { mean_log10: f.mean_log10, sd_log10: f.sd_log10, skew: f.skew }])),
    warnings: report.warnings,
  };
  process.stdout.write(`${JSON.stringify(out, null, 2)}\n`);
} catch (e) {
  if (e instanceof RecordError || e instanceof RangeError) fail([`${record}: ${e.message}`]);
  fail([`${record}: ${(e as Error).message}`]);
}
