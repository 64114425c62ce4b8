import { describe, expect, it } from "vitest";
import { modelledDo, validate } from "@/lib/calibration/calibrate";
import { runModel } from "@/lib/model";
import type { RunResult } from "@/lib/model/network/run";
import { MI_TO_KM } from "@/lib/model/units";
import { profileSeries } from "@/lib/results/profile-series";
import { doAlongReach, fitStatistics, KM_SLACK, observedOnPath, surveyResiduals, type SurveySampleInput } from "@/lib/results/survey-residuals";
import { chainFile } from "./fixtures";

/** A run whose reach A carries DO = 9 − 0.5·km exactly at km 0, 2, 4, 6 (9, 8, 7, 6 mg/L): linear, so interpolation is exact. */
const linearRun = (): Pick<RunResult, "reaches"> => ({
  reaches: [
    {
      id: "A",
      points: [0, 2, 4, 6].map((km) => ({ km, do_mg_l: 9 - 0.5 * km })),
    },
  ] as unknown as RunResult["reaches"],
});

const sample = (station: string, reach: string, km: number, do_mg_l: number | null, time: string | null = "2026-08-12T08:15"): SurveySampleInput => ({ station, time, reach, km, do_mg_l });

describe("modelled DO along a reach", () => {
  const points = [0, 2, 4, 6].map((km) => ({ km, do_mg_l: 9 - 0.5 * km }));

  it("is exact on a linear profile, between points and at them", () => {
    // 9 − 0.5·1 = 8.5; 9 − 0.5·3.5 = 7.25; 9 − 0.5·4 = 7 (a point); 9 − 0.5·0 = 9 (the head)
    expect(doAlongReach(points, 1)).toBe(8.5);
    expect(doAlongReach(points, 3.5)).toBe(7.25);
    expect(doAlongReach(points, 4)).toBe(7);
    expect(doAlongReach(points, 0)).toBe(9);
  });

  it("reads the reach's end within the placement slack, and nothing past it or before the head", () => {
    // the last point is km 6, DO 9 − 3 = 6
    expect(doAlongReach(points, 6)).toBe(6);
    expect(doAlongReach(points, 6 + KM_SLACK / 2)).toBe(6);
    expect(doAlongReach(points, 6 + 2 * KM_SLACK)).toBeNull();
    expect(doAlongReach(points, -0.1)).toBeNull();
    expect(doAlongReach([], 0)).toBeNull();
  });

  it("takes the value after mixing at an outfall, where two points share one km", () => {
    // before mixing (1, 7), after mixing (1, 5): at km 1 → 5; halfway to (2, 5.5) → (5 + 5.5)/2 = 5.25; halfway from (0, 8) → 7.5
    const outfall = [
      { km: 0, do_mg_l: 8 },
      { km: 1, do_mg_l: 7 },
      { km: 1, do_mg_l: 5 },
      { km: 2, do_mg_l: 5.5 },
    ];
    expect(doAlongReach(outfall, 1)).toBe(5);
    expect(doAlongReach(outfall, 1.5)).toBe(5.25);
    expect(doAlongReach(outfall, 0.5)).toBe(7.5);
  });

  it("agrees with the model's exact DO at its profile points, the outfall's km included (after mixing, as calibration places a station)", () => {
    const file = chainFile();
    const run = runModel(file);
    const r2 = run.reaches.find((r) => r.id === "R2")!;
    // F1 is 1.5 km down R2: its km appears twice among R2's points
    expect(r2.points.filter((p) => p.km === 1.5)).toHaveLength(2);
    const kms = [...new Set(r2.points.map((p) => p.km))];
    const exact = modelledDo(file, kms.map((km) => ({ reach: "R2", km, do_mg_l: 0 })));
    // both are the closed-form DO of the same segment at the same travel time: equal to round-off
    kms.forEach((km, i) => expect(doAlongReach(r2.points, km)).toBeCloseTo(exact[i], 9));
  });
});

describe("fit statistics", () => {
  it("matches the hand arithmetic on three samples", () => {
    // observed o = 9, 7, 7; modelled m = 8.5, 7.5, 6.5
    // residuals o − m = 0.5, −0.5, 0.5 → Σ(o − m)² = 0.25·3 = 0.75 → RMSE = √(0.75/3) = √0.25 = 0.5
    // bias = mean(m − o) = (−0.5 + 0.5 − 0.5)/3 = −1/6
    // ō = 23/3; o − ō = 4/3, −2/3, −2/3 → Σ(o − ō)² = 16/9 + 4/9 + 4/9 = 24/9 = 8/3
    // NSE = 1 − 0.75/(8/3) = 1 − 9/32 = 23/32 = 0.71875
    const s = fitStatistics([
      { observed: 9, modelled: 8.5 },
      { observed: 7, modelled: 7.5 },
      { observed: 7, modelled: 6.5 },
    ]);
    expect(s.n).toBe(3);
    expect(s.rmse_mg_l).toBeCloseTo(0.5, 12);
    expect(s.bias_mg_l).toBeCloseTo(-1 / 6, 12);
    expect(s.nse).toBeCloseTo(23 / 32, 12);
  });

  it("gives no NSE for one sample or observations that do not vary, and nothing at all for none", () => {
    // one pair (7, 6.5): RMSE = |0.5| = 0.5, bias = 6.5 − 7 = −0.5
    expect(fitStatistics([{ observed: 7, modelled: 6.5 }])).toEqual({ n: 1, rmse_mg_l: 0.5, bias_mg_l: -0.5, nse: null });
    // Σ(o − ō)² = 0: NSE undefined; RMSE = √((0.25 + 0.25)/2) = 0.5, bias = (−0.5 + 0.5)/2 = 0
    expect(fitStatistics([
      { observed: 7, modelled: 7.5 },
      { observed: 7, modelled: 6.5 },
    ])).toEqual({ n: 2, rmse_mg_l: 0.5, bias_mg_l: 0, nse: null });
    expect(fitStatistics([])).toEqual({ n: 0, rmse_mg_l: null, bias_mg_l: null, nse: null });
  });

  it("uses calibration's definitions (same RMSE, bias sign and NSE as validate() at stations on profile points)", () => {
    const file = chainFile();
    const run = runModel(file);
    // stations at profile points of R1 and R2 (the outfall's km among them), observed values away from the model
    const stations = [
      { reach: "R1", km: 1, do_mg_l: 7.9 },
      { reach: "R2", km: 1.5, do_mg_l: 6.1 },
      { reach: "R2", km: 3, do_mg_l: 6.8 },
      { reach: "R3", km: 2.5, do_mg_l: 7.2 },
    ];
    const ours = surveyResiduals(run, stations.map((s, i) => sample(`S${i}`, s.reach, s.km, s.do_mg_l)));
    const theirs = validate(file, stations);
    expect(ours.statistics.n).toBe(4);
    expect(ours.statistics.rmse_mg_l).toBeCloseTo(theirs.rmse_mg_l, 9);
    expect(ours.statistics.bias_mg_l).toBeCloseTo(theirs.bias_mg_l, 9);
    expect(ours.statistics.nse).toBeCloseTo(theirs.nse!, 9);
    ours.rows.forEach((r, i) => expect(r.residual_mg_l).toBeCloseTo(theirs.residuals[i].residual_mg_l, 9));
  });
});

describe("a survey against a run", () => {
  it("interpolates each sample on the linear reach and computes the residuals and statistics by hand", () => {
    // modelled at km 1, 3, 5: 9 − 0.5 = 8.5, 9 − 1.5 = 7.5, 9 − 2.5 = 6.5 (exact: DO is linear in km);
    // observed 9, 7, 7: the three-sample case above → RMSE 0.5, bias −1/6, NSE 23/32
    const out = surveyResiduals(linearRun(), [sample("TS-1", "A", 1, 9), sample("TS-2", "A", 3, 7), sample("TS-3", "A", 5, 7)]);
    expect(out.rows.map((r) => r.modelled_mg_l)).toEqual([8.5, 7.5, 6.5]);
    // residual = observed − modelled: 9 − 8.5, 7 − 7.5, 7 − 6.5
    expect(out.rows.map((r) => r.residual_mg_l)).toEqual([0.5, -0.5, 0.5]);
    expect(out.rows.every((r) => r.onNetwork)).toBe(true);
    expect(out.statistics.n).toBe(3);
    expect(out.statistics.rmse_mg_l).toBeCloseTo(0.5, 12);
    expect(out.statistics.bias_mg_l).toBeCloseTo(-1 / 6, 12);
    expect(out.statistics.nse).toBeCloseTo(23 / 32, 12);
    expect(out.withoutDo).toBe(0);
  });

  it("lists a sample on a reach the run does not have, or past a reach's length, as not on this run's network, outside the statistics", () => {
    const out = surveyResiduals(linearRun(), [
      sample("TS-1", "A", 1, 9),
      sample("TS-X", "B", 0.5, 6.3),
      sample("TS-2", "A", 3, 7),
      // reach A is 6 km long in the run
      sample("TS-Y", "A", 6.5, 6.1),
      sample("TS-3", "A", 5, 7),
      sample("TS-Z", "A", 2, null),
    ]);
    // every sample with DO keeps its row, in the survey's order; the one without DO is counted, not listed
    expect(out.rows.map((r) => r.station)).toEqual(["TS-1", "TS-X", "TS-2", "TS-Y", "TS-3"]);
    expect(out.withoutDo).toBe(1);
    const x = out.rows[1];
    expect(x).toMatchObject({ station: "TS-X", onNetwork: false, why: "reach", observed_mg_l: 6.3, modelled_mg_l: null, residual_mg_l: null });
    expect(out.rows[3]).toMatchObject({ station: "TS-Y", onNetwork: false, why: "beyond", modelled_mg_l: null, residual_mg_l: null });
    // the statistics are those of the three on the network (the hand case above), unchanged by the two off it
    expect(out.statistics.n).toBe(3);
    expect(out.statistics.rmse_mg_l).toBeCloseTo(0.5, 12);
    expect(out.statistics.nse).toBeCloseTo(23 / 32, 12);
  });

  it("has no statistics when no sample is on the network", () => {
    const out = surveyResiduals(linearRun(), [sample("TS-X", "B", 0.5, 6.3)]);
    expect(out.statistics).toEqual({ n: 0, rmse_mg_l: null, bias_mg_l: null, nse: null });
  });
});

describe("observed samples on a profile chart's path", () => {
  const file = chainFile();
  const run = runModel(file);
  const rows = surveyResiduals(run, [sample("S-R2", "R2", 1, 6.5), sample("S-S1", "S1", 1, 7.5), sample("S-R1", "R1", 2, 7.8), sample("S-Q", "Q9", 1, 7)]).rows;

  it("places each sample at its reach's start plus its km, in km and in miles (1 mi = 1.609344 km), leaving off those not on the path", () => {
    // path R1 (3 km) → R2 (4 km) → R3: R2 starts at 3 km, so 1 km down R2 is at 3 + 1 = 4 km; R1 km 2 is at 2 km
    const km = observedOnPath(profileSeries(run, file, "R1", "SI"), rows);
    expect(km.map((p) => [p.station, p.distance])).toEqual([
      ["S-R1", 2],
      ["S-R2", 4],
    ]);
    const mi = observedOnPath(profileSeries(run, file, "R1", "US"), rows);
    expect(mi[0].distance).toBeCloseTo(2 / MI_TO_KM, 12);
    expect(mi[1].distance).toBeCloseTo(4 / MI_TO_KM, 12);
    // from S1's head (S1 → R3) only S1's sample is on the path, 1 km down
    expect(observedOnPath(profileSeries(run, file, "S1", "SI"), rows).map((p) => [p.station, p.distance])).toEqual([["S-S1", 1]]);
  });

  it("carries the observed, modelled and residual values of its row", () => {
    const [p] = observedOnPath(profileSeries(run, file, "S1", "SI"), rows);
    const row = rows.find((r) => r.station === "S-S1")!;
    expect(p).toMatchObject({ do_mg_l: 7.5, modelled_mg_l: row.modelled_mg_l, residual_mg_l: row.residual_mg_l });
    expect(p.residual_mg_l).toBeCloseTo(7.5 - p.modelled_mg_l, 12);
  });
});
