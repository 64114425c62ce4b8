/**
 * Benchmarks of the computation core (`npm run bench`). Prints figures; never fails on speed.
 *   1. Model run on seeded synthetic dendritic networks of 1k and 10k reaches.
 *   2. The same network through an ODE integrator (odex) at equal accuracy: the ratio.
 *   3. Allocation with 50/200/500 dischargers on 10k reaches vs HiGHS on the full LP.
 *   4. GIS import of a synthetic 10k-reach zipped shapefile with 1k dischargers
 *      (parse + reprojection + topology + snapping); target ≤ 3 s.
 *   5. Self-crossing check of 2k/16k/100k-vertex lines against turf kinks().
 *   6. Lengths on the WGS84 ellipsoid against turf's sphere and GeographicLib, per million segments.
 *   7. Design flows (1Q10, 7Q10, 30Q5, 7Q2) from a 50-year daily record; target ≤ 200 ms.
 *   8. Calibration of the demo basin to its invented survey (≤ 5 s) and of a 1,000-reach network
 *      with 50 stations (≤ 60 s).
 *   9. Committing a 2k-reach network with 200 dischargers into PostgreSQL (a throwaway database
 *      on the test cluster, started when needed); target ≤ 2 s. `--no-db` skips it.
 *  10. Reads that scale (issue 14, scripts/bench/reads.ts): `next start` from the existing build
 *      on a throwaway demo database — the trivial route, a stored-run read (200 and 304), the
 *      published page and downloads, and bare node:http on the same bytes, at 20 and 50
 *      connections; goal: the run read ≤ 1.5× the trivial route's cost. Needs `npm run build`
 *      (skipped, saying so, without one); `--no-db` skips it.
 * Targets (issue 3): 10k-reach run ≤ 20 ms; ≥ 100× faster than the ODE integrator;
 * 500-discharger allocation ≤ 2 s and no slower than HiGHS on the full LP.
 * Options: `npm run bench -- --quick` skips the 10k ODE comparison and the 500-discharger case.
 */
import { runModelBench } from "./run-bench";
import { odeBench } from "./ode-bench";
import { allocationBench } from "./allocation-bench";
import { geoImportBench } from "./geo-import";
import { selfCrossingsBench } from "./self-crossings-bench";
import { geodesicBench } from "./geodesic-bench";
import { networkCommitBench } from "./network-commit-bench";
import { designFlowBench } from "./design-flow-bench";
import { calibrationBench } from "./calibration-bench";
import { readsBench } from "./reads";

const quick = process.argv.includes("--quick");

async function main() {
  console.log(`Sagline computation-core benchmarks — node ${process.version}, ${new Date().toISOString()}`);
  console.log("Wall-clock ms, median and minimum of several runs. On a shared, loaded machine the minimum is the better estimate of CPU cost. Figures, not pass/fail.\n");
  for (const reaches of [1000, 10_000]) runModelBench(reaches);
  odeBench(1000);
  if (!quick) odeBench(10_000);
  for (const dischargers of quick ? [50, 200] : [50, 200, 500]) await allocationBench(10_000, dischargers);
  await geoImportBench(10_000, 1000);
  selfCrossingsBench();
  geodesicBench();
  designFlowBench(50);
  calibrationBench();
  if (!process.argv.includes("--no-db")) {
    await networkCommitBench(2000, 200);
    await readsBench(5);
  }
}

main().then(() => process.exit(0), (e: unknown) => {
  console.error(e instanceof Error ? e.message : String(e));
  process.exit(1);
});
