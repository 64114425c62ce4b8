/**
 * Sagline calibration (docs/calibrate-cli.md):
 *   npm run calibrate -- FILE.json
 * FILE.json is a model file (the same contract as `npm run model`) with a `calibration`
 * block: observations of DO by reach and km, and the coefficients to fit with their reaches,
 * bounds and starting values (lib/validation/calibration.ts). Prints
 * `{ parameters: [{ parameter, reaches, value, std_error, at_bound }], rmse_mg_l, bias_mg_l,
 * nse, iterations, correlation, residuals, warnings }` (lib/calibration/calibrate.ts).
 * Bad input: exit 1 and one line per problem, `field.path: message`; usage errors exit 2.
 * Never a stack trace.
 */
import { readFileSync } from "node:fs";
import { calibrate } from "@/lib/calibration/calibrate";
import { formatPath, ModelInputError } from "@/lib/model/errors";
import { calibrationSchema } from "@/lib/validation/calibration";
import { parseModelFile } from "@/lib/validation/model-file";

function fail(code: number, lines: string[]): never {
  for (const l of lines) process.stderr.write(`${l}\n`);
  process.exit(code);
}

const [file, ...rest] = process.argv.slice(2);
if (!file || rest.length > 0) fail(2, ["usage: npm run calibrate -- FILE.json"]);
let data: unknown;
try {
  data = JSON.parse(readFileSync(file, "utf8"));
} catch (e) {
  const code = (e as NodeJS.ErrnoException).code;
  fail(1, [code ? `${file}: cannot read the file (${code})` : `${file}: not valid JSON (${(e as Error).message})`]);
}
if (typeof data !== "object" || data === null || Array.isArray(data)) fail(1, [`${file}: a calibration file is a JSON object (a model file with a calibration block)`]);
const { calibration, ...model } = data as Record<string, unknown>;
const cal = calibrationSchema.safeParse(calibration);
const parsed = parseModelFile(model);
const issues = [
  ...(parsed.ok ? [] : parsed.issues.map((i) => `  ${i.path}: ${i.message}`)),
  ...(cal.success ? [] : cal.error.issues.map((i) => `  ${formatPath(["calibration", ...i.path])}: ${i.message}`)),
];
if (calibration === undefined) issues.push("  calibration: is required (observations and the coefficients to fit)");
if (issues.length > 0 || !parsed.ok || !cal.success) fail(1, [`${file}: invalid calibration file`, ...issues]);
try {
  const r = calibrate(parsed.file, cal.data.observations, cal.data.fit);
  process.stdout.write(
    `${JSON.stringify(
      { parameters: r.parameters, rmse_mg_l: r.rmse_mg_l, bias_mg_l: r.bias_mg_l, nse: r.nse, iterations: r.iterations, correlation: r.correlation, residuals: r.residuals, warnings: r.warnings },
      null,
      2,
    )}\n`,
  );
} catch (e) {
  if (e instanceof ModelInputError || e instanceof RangeError) fail(1, [`${file}: ${e.message}`]);
  fail(1, [`${file}: the calibration could not be computed: ${e instanceof Error ? e.message : String(e)}`]);
}
