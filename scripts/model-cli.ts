/**
 * Sagline model CLI.
 *   npm run model -- FILE.json      → the run as JSON (MODEL.md §8)
 *   npm run allocate -- FILE.json   → the allocation as JSON
 * Bad input: exit code 1 and one line per problem, `field.path: message`; never a stack trace.
 * Usage errors: exit code 2.
 */
import { readFileSync } from "node:fs";
import { allocate } from "@/lib/model/allocation/allocate";
import { ModelInputError } from "@/lib/model/errors";
import { runModel } from "@/lib/model/network/run";
import { parseModelFile } from "@/lib/validation/model-file";

function fail(code: number, lines: string[]): never {
  for (const l of lines) process.stderr.write(`${l}\n`);
  process.exit(code);
}

function main(argv: string[]): void {
  const [command, file, ...rest] = argv;
  if ((command !== "run" && command !== "allocate") || !file || rest.length > 0) {
    fail(2, ["usage: model-cli run FILE.json | model-cli allocate FILE.json"]);
  }
  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch (e) {
    fail(1, [`${file}: cannot read the file (${(e as NodeJS.ErrnoException).code ?? "error"})`]);
  }
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    fail(1, [`${file}: not valid JSON (${(e as Error).message})`]);
  }
  const parsed = parseModelFile(data);
  if (!parsed.ok) fail(1, [`${file}: invalid model file`, ...parsed.issues.map((i) => `  ${i.path}: ${i.message}`)]);
  if (command === "allocate" && !parsed.file.allocation) {
    fail(1, [`${file}: invalid model file`, "  allocation: is required for allocate"]);
  }
  try {
    const out = command === "run" ? runModel(parsed.file) : allocate(parsed.file);
    process.stdout.write(`${JSON.stringify(out, null, 2)}\n`);
  } catch (e) {
    if (e instanceof ModelInputError || e instanceof RangeError) fail(1, [`${file}: ${e.message}`]);
    fail(1, [`${file}: the model could not be computed: ${e instanceof Error ? e.message : String(e)}`]);
  }
}

main(process.argv.slice(2));
