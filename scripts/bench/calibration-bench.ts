/**
 * Calibration (issue 15: the demo basin ≤ 5 s; a 1,000-reach network with 50 stations ≤ 60 s):
 * bounded Levenberg–Marquardt with central-difference Jacobians, one model run per parameter
 * vector. The demo uses its invented survey (examples/tamsel-river-calibration.json); the
 * large case a seeded synthetic network whose "survey" is the model's own DO with known
 * coefficients, so the fit must come back to them. Reference: one model run of the same file,
 * to say how many model runs the fit cost.
 */
import { readFileSync } from "node:fs";
import { performance } from "node:perf_hooks";
import { calibrate, modelledDo, withParameters, type FitEntry, type Observation } from "../../lib/calibration/calibrate";
import { runModel } from "../../lib/model/network/run";
import type { ModelFile } from "../../lib/model/types";
import { ms, time } from "./measure";
import { seededRandom, syntheticNetwork } from "./synthetic";

function report(label: string, file: ModelFile, observations: Observation[], fit: FitEntry[], targetMs: number) {
  const one = time(() => runModel(file), 3).median;
  const t0 = performance.now();
  const r = calibrate(file, observations, fit);
  const total = performance.now() - t0;
  console.log(
    `calibration, ${label}: ${ms(total)} against the ${targetMs / 1000} s target (${(total / targetMs).toFixed(2)}×), ${r.iterations} iterations, ` +
      `≈ ${Math.round(total / one)} model runs of ${ms(one)}; rmse ${r.rmse_mg_l.toFixed(3)} mg/L; ` +
      r.parameters.map((p) => `${p.parameter} ${p.value.toFixed(3)} ± ${p.std_error?.toFixed(3) ?? "—"}`).join(", "),
  );
}

export function calibrationBench(): void {
  const demo = JSON.parse(readFileSync("examples/tamsel-river-calibration.json", "utf8")) as ModelFile & { calibration: { observations: Observation[]; fit: FitEntry[] } };
  const { calibration, ...file } = demo;
  report(`demo basin (${file.reaches.length} reaches, ${calibration.observations.length} stations, ${calibration.fit.length} coefficients)`, file, calibration.observations, calibration.fit, 5000);

  const net = syntheticNetwork({ reaches: 1000, dischargers: 40, seed: 15 });
  const ids = net.reaches.map((r) => r.id);
  const fit: FitEntry[] = [
    { parameter: "kd20_per_day", reaches: ids, min: 0.05, max: 3, start: 0.2 },
    { parameter: "sod20_g_m2_day", reaches: ids, min: 0, max: 8, start: 0.5 },
  ];
  const truth = withParameters(net, fit, [0.5, 1.5]);
  const rand = seededRandom(50);
  const stations = Array.from({ length: 50 }, (_, k) => {
    const r = net.reaches[Math.floor(rand() * net.reaches.length)];
    return { station: `S${k + 1}`, reach: r.id, km: Number((r.length_km * (0.2 + 0.6 * rand())).toFixed(3)), do_mg_l: 0 };
  });
  const exact = modelledDo(truth, stations);
  report("1,000-reach synthetic network, 50 stations, 2 coefficients", net, stations.map((s, i) => ({ ...s, do_mg_l: exact[i] })), fit, 60_000);
}

if (process.argv[1]?.endsWith("calibration-bench.ts")) calibrationBench();
