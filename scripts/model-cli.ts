/**
 * Sagline model CLI.
 *   npm run model -- FILE.json      → the run as JSON (MODEL.md §8)
 *   npm run model -- FILE.json --condition NAME
 *                                   → the run under one of the file's allocation.conditions
 *   npm run allocate -- FILE.json   → the allocation as JSON
 * Bad input: exit code 1 and one line per problem, `field.path: message`; never a stack trace.
 * Usage errors: exit code 2.
 */
import { readFileSync } from "node:fs";
import { allocate } from "@/lib/model/allocation/allocate";
import { applyCondition } from "@/lib/model/allocation/conditions";
import { ModelInputError } from "@/lib/model/errors";
import { runModel } from "@/lib/model/network/run";
import { parseModelFile } from "@/lib/validation/model-file";

function fail(code: number, lines: string[]): never {
  for (const l of lines) process.stderr.write(`${l}\n`);
  process.exit(code);
}

function main(argv: string[]): void {
  const [command, file, ...rest] = argv;
  let conditionName: string | null = null;
  if (command === "run" && rest.length === 2 && rest[0] === "--condition") conditionName = rest[1];
  else if (command === "run" && rest.length === 1 && rest[0].startsWith("--condition=")) conditionName = rest[0].slice("--condition=".length);
  if ((command !== "run" && command !== "allocate") || !file || (rest.length > 0 && conditionName === null) || conditionName === "") {
    fail(2, ["usage: model-cli run FILE.json [--condition NAME] | model-cli allocate FILE.json"]);
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
  let model = parsed.file;
  if (conditionName !== null) {
    const conditions = model.allocation?.conditions ?? [];
    const at = conditions.findIndex((c) => c.name === conditionName);
    if (at < 0) {
      const known = conditions.length ? `; the file's conditions: ${conditions.map((c) => JSON.stringify(c.name)).join(", ")}` : "; the file has no allocation.conditions";
      fail(1, [`${file}: --condition: no condition named ${JSON.stringify(conditionName)}${known}`]);
    }
    try {
      model = applyCondition(model, conditions[at], ["allocation", "conditions", at]);
    } catch (e) {
      if (e instanceof ModelInputError) fail(1, [`${file}: ${e.message}`]);
      throw e;
    }
  }
  try {
    const out = command === "run" ? runModel(model) : allocate(model);
    process.stdout.write(`${JSON.stringify(out, null, 2)}\n`);
  } catch (e) {
    if (e instanceof ModelInputError || e instanceof RangeError) fail(1, [`${file}: ${e.message}`]);
    fail(1, [`${file}: the model could not be computed: ${e instanceof Error ? e.message : String(e)}`]);
  }
}

main(process.argv.slice(2));
