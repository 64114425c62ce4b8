/**
 * Writes the demo basin's invented gauge record, examples/tamsel-quillford-gauge-daily.csv:
 * 30 climatic years (1 Apr 1994 – 31 Mar 2024) of daily mean flow (m³/s) at an invented gauge,
 * "Tamsel River at Quillford Mill", on the invented Tamsel River. A seasonal cycle with a
 * late-summer low, year-to-year wetness, day-to-day persistence and storm pulses, from a seeded
 * generator (pure-rand's xoroshiro128+, seed 20261203), so the file is the same every time.
 * Invented data for the demo only — never an expected value in a test.
 *   npx tsx scripts/make-demo-gauge.ts
 */
import { writeFileSync } from "node:fs";
import { uniformFloat64 } from "pure-rand/distribution/uniformFloat64";
import { xoroshiro128plus } from "pure-rand/generator/xoroshiro128plus";

const rng = xoroshiro128plus(20261203);
const u = () => uniformFloat64(rng);
/** A standard normal draw (Box–Muller). */
const normal = () => Math.sqrt(-2 * Math.log(1 - u())) * Math.cos(2 * Math.PI * u());

// sized so the gauge's 7Q10 sits near the demo network's design flow at TR-04 (0.44 m³/s), where the gauge stands
const SCALE = 0.48;
const start = Date.UTC(1994, 3, 1);
const end = Date.UTC(2024, 3, 1);
const rows = ["date,flow"];
let year = -1;
let wetness = 1;
let memory = 0;
let storm = 0;
for (let t = start; t < end; t += 86_400_000) {
  const d = new Date(t);
  const climatic = d.getUTCMonth() >= 3 ? d.getUTCFullYear() : d.getUTCFullYear() - 1;
  if (climatic !== year) {
    year = climatic;
    wetness = Math.exp(0.35 * normal()); // a dry or wet year
  }
  const doy = (t - Date.UTC(d.getUTCFullYear(), 0, 1)) / 86_400_000;
  const seasonal = 6.5 + 5 * Math.cos((2 * Math.PI * (doy - 60)) / 365.25); // high in early spring, low in late summer
  memory = 0.92 * memory + 0.08 * normal();
  if (u() < 0.035) storm += 4 + 10 * u();
  storm *= 0.8;
  const flow = Math.max(0.02, SCALE * (seasonal * wetness * Math.exp(0.25 * memory) + storm));
  rows.push(`${d.toISOString().slice(0, 10)},${flow.toFixed(3)}`);
}
writeFileSync("examples/tamsel-quillford-gauge-daily.csv", `${rows.join("\n")}\n`);
console.log(`wrote ${rows.length - 1} days to examples/tamsel-quillford-gauge-daily.csv`);
