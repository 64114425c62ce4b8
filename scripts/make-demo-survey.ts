/**
 * Writes examples/tamsel-river-calibration.json: the demo model file (examples/tamsel-river.json)
 * with an invented synoptic survey of DO at 25 invented stations along the Tamsel River and its
 * tributaries, and the coefficients a planner would fit. The "observations" are the model's DO
 * with deoxygenation 0.42 /d on the main stem and 0.30 /d elsewhere and SOD 2.6 g/m²/d,
 * plus noise (σ 0.12 mg/L) from a seeded generator (pure-rand xoroshiro128+, seed 151203).
 * Invented data for the demo only — never an expected value in a test.
 *   npx tsx scripts/make-demo-survey.ts
 */
import { readFileSync, writeFileSync } from "node:fs";
import { uniformFloat64 } from "pure-rand/distribution/uniformFloat64";
import { xoroshiro128plus } from "pure-rand/generator/xoroshiro128plus";
import { modelledDo, withParameters, type FitEntry } from "../lib/calibration/calibrate";
import type { ModelFile } from "../lib/model/types";

const file = JSON.parse(readFileSync("examples/tamsel-river.json", "utf8")) as ModelFile;
const main = file.reaches.filter((r) => r.id.startsWith("TR-")).map((r) => r.id);
const others = file.reaches.filter((r) => !r.id.startsWith("TR-")).map((r) => r.id);
const all = file.reaches.map((r) => r.id);
const fit: FitEntry[] = [
  { parameter: "kd20_per_day", reaches: main, min: 0.05, max: 2, start: 0.3 },
  { parameter: "kd20_per_day", reaches: others, min: 0.05, max: 2, start: 0.3 },
  { parameter: "sod20_g_m2_day", reaches: all, min: 0, max: 8, start: 2 },
];
const truth = withParameters(file, fit, [0.42, 0.3, 2.6]);
const rng = xoroshiro128plus(151203);
const normal = () => Math.sqrt(-2 * Math.log(1 - uniformFloat64(rng))) * Math.cos(2 * Math.PI * uniformFloat64(rng));
const stations: { station: string; reach: string; km: number }[] = [];
for (const r of file.reaches) {
  const n = r.id.startsWith("TR-") ? 2 : 1;
  for (let k = 1; k <= n; k++) stations.push({ station: `TS-${String(stations.length + 1).padStart(2, "0")}`, reach: r.id, km: Number(((r.length_km * k) / (n + 1)).toFixed(2)) });
}
const exact = modelledDo(truth, stations.map((s) => ({ ...s, do_mg_l: 0 })));
const observations = stations.map((s, i) => ({ ...s, do_mg_l: Number((exact[i] + 0.12 * normal()).toFixed(2)) }));
writeFileSync("examples/tamsel-river-calibration.json", `${JSON.stringify({ ...file, calibration: { observations, fit } }, null, 2)}\n`);
console.log(`wrote ${observations.length} observations to examples/tamsel-river-calibration.json`);
