/**
 * Sagline network check (docs/network-cli.md):
 *   npm run network -- check REACHES [--dischargers FILE] [--mapping FILE.json] [--epsg CODE]
 *     [--dischargers-epsg CODE] [--tolerance-m M] [--outlet REACH_ID]
 * Reads the files with the same readers and validation as the import wizard and prints the
 * same report JSON as the validate API (`{ "report": … }`), saving nothing.
 * Exit 0: no errors in the report; 1: the report has errors; 2: a file or an argument cannot
 * be used (the message names it). Never a stack trace.
 */
import { readFileSync } from "node:fs";
import { basename } from "node:path";
import { parseArgs } from "node:util";
import { z } from "zod";
import { validateImport, type SourceLayer } from "@/geo";
import { sniffFormat, unknownFormatMessage } from "@/geo/detect-format";
import { GeoError } from "@/geo/errors";
import { dischargerMappingSchema, reachMappingSchema } from "@/geo/field-mapping";
import { DISCHARGER_FIELDS, guessBindings, REACH_FIELDS, toMapping } from "@/geo/mapping-fields";
import { readUploadLayer, type UploadLayer } from "@/geo/read-upload";
import { formatPath } from "@/lib/model/errors";
import { networkOptionsSchema } from "@/lib/validation/network";

function fail(code: number, lines: string[]): never {
  for (const l of lines) process.stderr.write(`${l}\n`);
  process.exit(code);
}

const USAGE =
  "usage: npm run network -- check REACHES [--dischargers FILE] [--mapping FILE.json] [--epsg CODE] [--dischargers-epsg CODE] [--tolerance-m M] [--outlet REACH_ID]";

const epsg = (flag: string) => z.coerce.number({ message: `${flag} must be a number` }).int(`${flag} must be a whole EPSG code`).positive(`${flag} must be a positive EPSG code`);

/** The command line after parsing, checked with zod like an API body. */
const argsSchema = z.object({
  reaches: z.string().min(1),
  dischargers: z.string().min(1).optional(),
  mapping: z.string().min(1).optional(),
  epsg: epsg("--epsg").optional(),
  dischargersEpsg: epsg("--dischargers-epsg").optional(),
  toleranceM: z.coerce.number({ message: "--tolerance-m must be a number" }).optional(),
  outlet: z.string().min(1).optional(),
});

/** `--mapping`: the API's own reach and discharger mapping schemas. */
const mappingFileSchema = z.object({ reaches: reachMappingSchema.optional(), dischargers: dischargerMappingSchema.optional() }).strict();

const issues = (e: z.ZodError, root: string) => e.issues.map((i) => `  ${formatPath(root === "" ? i.path : [root, ...i.path], "arguments")}: ${i.message}`);

function readBytes(path: string): Uint8Array {
  try {
    return readFileSync(path);
  } catch (e) {
    fail(2, [`${path}: cannot read the file (${(e as NodeJS.ErrnoException).code ?? "error"})`]);
  }
}

async function readLayer(path: string, layer: UploadLayer, code: number | undefined): Promise<SourceLayer> {
  const bytes = readBytes(path);
  const name = basename(path);
  const format = sniffFormat(name, bytes);
  if (!format) fail(2, [`${path}: ${unknownFormatMessage(name)}`]);
  try {
    return await readUploadLayer(format, bytes, { epsg: code }, layer, name);
  } catch (e) {
    if (e instanceof GeoError) fail(2, [`${path}: ${e.message}`]);
    fail(2, [`${path}: the file could not be read (${e instanceof Error ? e.message : String(e)})`]);
  }
}

async function main(argv: string[]): Promise<void> {
  const [command, ...rest] = argv;
  if (command !== "check") fail(2, [USAGE]);
  let parsed: ReturnType<typeof parseArgs>;
  try {
    parsed = parseArgs({
      args: rest,
      allowPositionals: true,
      options: {
        dischargers: { type: "string" },
        mapping: { type: "string" },
        epsg: { type: "string" },
        "dischargers-epsg": { type: "string" },
        "tolerance-m": { type: "string" },
        outlet: { type: "string" },
      },
    });
  } catch (e) {
    fail(2, [(e as Error).message, USAGE]);
  }
  if (parsed.positionals.length !== 1) fail(2, ["give exactly one reach file", USAGE]);
  const v = parsed.values;
  const args = argsSchema.safeParse({
    reaches: parsed.positionals[0],
    dischargers: v.dischargers,
    mapping: v.mapping,
    epsg: v.epsg,
    dischargersEpsg: v["dischargers-epsg"],
    toleranceM: v["tolerance-m"],
    outlet: v.outlet,
  });
  if (!args.success) fail(2, ["invalid arguments", ...issues(args.error, "")]);
  const a = args.data;

  let mappingFile: z.infer<typeof mappingFileSchema> = {};
  if (a.mapping) {
    let data: unknown;
    try {
      data = JSON.parse(new TextDecoder().decode(readBytes(a.mapping)));
    } catch (e) {
      fail(2, [`${a.mapping}: not valid JSON (${(e as Error).message})`]);
    }
    const m = mappingFileSchema.safeParse(data);
    if (!m.success) fail(2, [`${a.mapping}: invalid mapping`, ...issues(m.error, "")]);
    mappingFile = m.data;
  }
  const options = networkOptionsSchema.safeParse({
    ...(a.toleranceM !== undefined ? { toleranceM: a.toleranceM } : {}),
    ...(a.outlet ? { outlets: [{ reachId: a.outlet }] } : {}),
  });
  if (!options.success) fail(2, ["invalid options", ...issues(options.error, "").map((l) => l.replace("toleranceM", "--tolerance-m"))]);

  const reaches = await readLayer(a.reaches, "reaches", a.epsg);
  const dischargers = a.dischargers ? await readLayer(a.dischargers, "dischargers", a.dischargersEpsg) : undefined;
  // Without --mapping, the wizard's suggested mapping from the files' field names.
  const reachMapping = reachMappingSchema.safeParse(mappingFile.reaches ?? toMapping(REACH_FIELDS, guessBindings(REACH_FIELDS, reaches.fields)));
  if (!reachMapping.success) fail(2, [`${a.reaches}: no usable reach mapping (give one with --mapping)`, ...issues(reachMapping.error, "reaches")]);
  const dischargerMapping = dischargers
    ? dischargerMappingSchema.safeParse(mappingFile.dischargers ?? toMapping(DISCHARGER_FIELDS, guessBindings(DISCHARGER_FIELDS, dischargers.fields)))
    : undefined;
  if (dischargerMapping && !dischargerMapping.success) {
    fail(2, [`${a.dischargers}: no usable discharger mapping (give one with --mapping)`, ...issues(dischargerMapping.error, "dischargers")]);
  }
  let report: ReturnType<typeof validateImport>;
  try {
    report = validateImport({ reaches, reachMapping: reachMapping.data, dischargers, dischargerMapping: dischargerMapping?.data }, options.data);
  } catch (e) {
    if (e instanceof GeoError) fail(2, [`${a.mapping ?? a.reaches}: ${e.message}`]);
    throw e;
  }
  process.stdout.write(`${JSON.stringify({ report }, null, 2)}\n`);
  process.exit(report.errors.length > 0 ? 1 : 0);
}

main(process.argv.slice(2)).catch((e: unknown) => fail(2, [`the check could not be run: ${e instanceof Error ? e.message : String(e)}`]));
