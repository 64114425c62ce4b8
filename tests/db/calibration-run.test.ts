import { beforeAll, describe, expect, it } from "vitest";
import { calibrate, modelledDo, withParameters } from "@/lib/calibration/calibrate";
import type { CalibrationSpec } from "@/lib/calibration/payload";
import { createComputePool } from "@/lib/compute/pool";
import { AppError } from "@/lib/errors";
import type { ModelFile } from "@/lib/model/types";
import { runModel } from "@/lib/model/network/run";
import { createCalibrationRun, createRun, getRun, listCalibrationChoices, processRun } from "@/lib/services/runs";
import { fittedKineticsText } from "@/lib/results/fitted-kinetics";
import { closeDueReviews, openReview, proposePlan, publishPlan } from "@/lib/services/plans";
import { getPublishedPlanWithMap, planAllocationsCsv, planReachesGeoJson } from "@/lib/services/plan-reports";
import { planReport } from "@/lib/reports/plan-report-data";
import { uploadGaugeRecord } from "@/lib/services/gauges";
import { gaugeUploadSchema } from "@/lib/validation/gauges";
import { demoGaugeBytes } from "../support/gauge-record";
import { createScenario } from "@/lib/services/scenarios";
import { uploadSurvey } from "@/lib/services/surveys";
import { calibrationRunSchema } from "@/lib/validation/calibration";
import { scenarioCreateSchema } from "@/lib/validation/scenario";
import { surveyUploadSchema } from "@/lib/validation/surveys";
import { commitDemo } from "../support/demo-network";
import { fileDb } from "../support/file-db";
import { scoped } from "../support/scoped";
import { uploadDemoSurvey } from "../support/survey";
import { buildWorld, type World } from "../support/world";

const db = fileDb();
let w: World;
let scenarioId: string;
let demoSurvey: Awaited<ReturnType<typeof uploadDemoSurvey>>;

beforeAll(async () => {
  w = await buildWorld(db);
  await commitDemo(db, w.users.planner, w.basinId);
  demoSurvey = await uploadDemoSurvey(db, w.users.planner, w.basinId);
  const scenario = await scoped(createScenario)(
    db,
    w.users.planner,
    w.basinId,
    scenarioCreateSchema.parse({ name: "Survey day", inputs: { conditions: [{ name: "7Q10" }, { name: "12 August 2026", flowScale: 1.4, temperatureC: 24.5 }] } }),
  );
  scenarioId = scenario.id;
});

const ask = (body: unknown) => scoped(createCalibrationRun)(db, w.users.planner, w.basinId, scenarioId, calibrationRunSchema.parse(body));
const inputsOf = async (runId: string) =>
  (await db.selectFrom("runs").select("model_file").where("id", "=", runId).executeTakeFirstOrThrow()).model_file as unknown as { files: { name: string; file: ModelFile }[]; calibration: CalibrationSpec };

async function refused(p: Promise<unknown>): Promise<AppError> {
  const e = await p.then(
    () => null,
    (x: unknown) => x,
  );
  expect(e).toBeInstanceOf(AppError);
  return e as AppError;
}

describe("calibration runs", () => {
  it("recovers a known k_d from DO the model itself produced at the survey's stations (an exact case)", async () => {
    // first a calibration run, to get the survey-day condition's model file as the app builds it
    const probe = await ask({ surveyId: demoSurvey.id, condition: "12 August 2026", fit: [{ parameter: "kd20_per_day", reaches: "all", min: 0.01, max: 2, start: 0.3 }] });
    const { files } = await inputsOf(probe.id);
    expect(files.map((f) => f.name)).toEqual(["12 August 2026"]);
    const file = files[0].file;
    // "observations" made by the model with k_d = 0.45 /d on every reach, at the demo stations' places
    const truth = [{ parameter: "kd20_per_day" as const, reaches: file.reaches.map((r) => r.id), min: 0.01, max: 2, start: 0.45 }];
    const places = demoSurvey.samples.map((s) => ({ station: s.station, reach: s.reach, km: s.km, do_mg_l: 0 }));
    const made = modelledDo(withParameters(file, truth, [0.45]), places);
    const csv = ["station,reach,km,do", ...places.map((p, i) => `${p.station},${p.reach},${p.km},${made[i]}`)].join("\n");
    const synthetic = await scoped(uploadSurvey)(db, w.users.planner, w.basinId, { name: "made.csv", bytes: Buffer.from(csv) }, surveyUploadSchema.parse({ name: "Made by the model" }));

    // a second survey made the same way at other places (half-way to each station), to check the fit against
    const elsewhere = places.map((p) => ({ ...p, km: p.km / 2 }));
    const madeElsewhere = modelledDo(withParameters(file, truth, [0.45]), elsewhere);
    const csv2 = ["station,reach,km,do", ...elsewhere.map((p, i) => `${p.station}b,${p.reach},${p.km},${madeElsewhere[i]}`)].join("\n");
    const second = await scoped(uploadSurvey)(db, w.users.planner, w.basinId, { name: "made2.csv", bytes: Buffer.from(csv2) }, surveyUploadSchema.parse({ name: "Made elsewhere" }));

    const queued = await ask({
      surveyId: synthetic.id,
      validationSurveyId: second.id,
      condition: "12 August 2026",
      fit: [{ parameter: "kd20_per_day", reaches: "all", min: 0.01, max: 2, start: 0.2 }],
    });
    expect(queued).toMatchObject({ kind: "calibration", status: "queued", reused: false });
    await processRun(db, queued.id);
    const run = await scoped(getRun)(db, w.users.planner, w.basinId, queued.id);
    expect(run.status).toBe("done");
    const cal = run.result!.calibration!;
    expect(cal.parameters[0].value).toBeCloseTo(0.45, 6);
    expect(cal.rmse_mg_l).toBeLessThan(1e-6);
    expect(cal.survey).toMatchObject({ id: synthetic.id, name: "Made by the model", sha256: synthetic.sha256, networkVersion: 1 });
    expect(cal.condition).toBe("12 August 2026");
    // checked against the second survey without refitting: its DO was made with the value the fit found
    expect(cal.validation!.survey).toMatchObject({ id: second.id, name: "Made elsewhere" });
    expect(cal.validation!.residuals.length).toBe(16);
    expect(cal.validation!.rmse_mg_l).toBeLessThan(1e-5);
    // the run's DO is the model with the fitted value
    const stored = await inputsOf(queued.id);
    const fitted = runModel(withParameters(stored.files[0].file, stored.calibration.fit, [cal.parameters[0].value]));
    expect(run.result!.conditions[0].run.minimum).toEqual(fitted.minimum);
    expect(run.result!.conditions[0].run.reaches).toEqual(fitted.reaches);
    // and the fit is calibrate() on exactly the inputs the run stored
    const again = calibrate(stored.files[0].file, stored.calibration.observations, stored.calibration.fit);
    expect(cal.parameters).toEqual(again.parameters);
    // the same request again returns the finished run
    const same = { surveyId: synthetic.id, validationSurveyId: second.id, condition: "12 August 2026", fit: [{ parameter: "kd20_per_day", reaches: "all", min: 0.01, max: 2, start: 0.2 }] };
    expect(await ask(same)).toMatchObject({ id: queued.id, reused: true });
    // without the check against the second survey it is another computation
    expect(await ask({ ...same, validationSurveyId: undefined })).toMatchObject({ reused: false });
    expect((await refused(ask({ ...same, validationSurveyId: synthetic.id }))).details).toEqual([{ path: "validationSurveyId", message: "The same survey as surveyId" }]);
  });

  it("fits the demo survey with standard errors and statistics, listing the samples it used", async () => {
    const queued = await ask({
      surveyId: demoSurvey.id,
      condition: "12 August 2026",
      fit: [
        { parameter: "kd20_per_day", reaches: "all", min: 0.05, max: 3, start: 0.3 },
        { parameter: "sod20_g_m2_day", reaches: ["TR-03", "TR-04", "TR-05", "TR-06"], min: 0, max: 5, start: 0.5 },
      ],
    });
    // computed as the background worker computes it: in a worker thread, with its progress
    const pool = createComputePool({ size: 1, timeoutMs: 60_000 });
    const progress: number[] = [];
    try {
      await processRun(db, queued.id, (job, onProgress) =>
        pool.payload(job, (d) => {
          progress.push(d);
          onProgress(d);
        }),
      );
    } finally {
      await pool.close();
    }
    expect(progress.length).toBeGreaterThan(1);
    expect(progress.at(-1)).toBe(1);
    const run = await scoped(getRun)(db, w.users.planner, w.basinId, queued.id);
    expect(run.status).toBe("done");
    const cal = run.result!.calibration!;
    expect(cal.residuals.length).toBe(16);
    expect(cal.leftOut).toEqual([]);
    expect(cal.parameters.map((p) => p.parameter)).toEqual(["kd20_per_day", "sod20_g_m2_day"]);
    expect(cal.fit[1].reaches).toEqual(["TR-03", "TR-04", "TR-05", "TR-06"]);
    for (const r of cal.residuals) expect(r.residual_mg_l).toBeCloseTo(r.observed_mg_l - r.modelled_mg_l, 12);
    expect(Number.isFinite(cal.rmse_mg_l)).toBe(true);
  });

  it("a scenario uses a finished calibration's fitted values on the reaches it fitted, recording where they came from", async () => {
    const queued = await ask({ name: "Main-stem August fit", surveyId: demoSurvey.id, condition: "12 August 2026", fit: [{ parameter: "kd20_per_day", reaches: ["TR-03", "TR-04"], min: 0.05, max: 3, start: 0.3 }] });
    const early = await refused(
      scoped(createScenario)(db, w.users.planner, w.basinId, scenarioCreateSchema.parse({ name: "Too early", inputs: { conditions: [{ name: "7Q10" }], fittedKinetics: { runId: queued.id } } })),
    );
    expect(early.details).toEqual([{ path: "inputs.fittedKinetics.runId", message: "The calibration has not finished: use it once it has" }]);
    await processRun(db, queued.id);
    const fit = (await scoped(getRun)(db, w.users.planner, w.basinId, queued.id)).result!.calibration!;
    const kd = fit.parameters[0].value;
    const forged = { surveyName: "forged", surveySha256: "0", surveyFirstTime: null, condition: "x", finishedAt: "x", rmseMgL: 0, biasMgL: 0, nse: 1, samples: 99, parameters: [], validation: null };
    const scenario = await scoped(createScenario)(
      db,
      w.users.planner,
      w.basinId,
      // a source sent by the client is replaced by the calibration's own record
      scenarioCreateSchema.parse({ name: "Calibrated 7Q10", inputs: { conditions: [{ name: "7Q10" }], fittedKinetics: { runId: queued.id, source: forged } } }),
    );
    expect(scenario.inputs.fittedKinetics!.source).toMatchObject({
      name: "Main-stem August fit",
      surveyName: demoSurvey.name,
      surveySha256: demoSurvey.sha256,
      condition: "12 August 2026",
      rmseMgL: fit.rmse_mg_l,
      samples: 16,
      parameters: [{ parameter: "kd20_per_day", reaches: ["TR-03", "TR-04"], value: kd, stdError: fit.parameters[0].std_error }],
      validation: null,
    });
    expect(fittedKineticsText(scenario.inputs.fittedKinetics!.source!)).toMatch(/^“Main-stem August fit”: Deoxygenation rate k_d at 20 °C \(1\/d\) /);
    expect((await scoped(listCalibrationChoices)(db, w.users.planner, w.basinId)).find((c) => c.runId === queued.id)).toMatchObject({ name: "Main-stem August fit", surveyName: demoSurvey.name });
    const run = await scoped(createRun)(db, w.users.planner, w.basinId, scenario.id, "model");
    const { files } = await inputsOf(run.id);
    const byId = new Map(files[0].file.reaches.map((r) => [r.id, r]));
    expect(byId.get("TR-03")!.kd20_per_day).toBe(kd);
    expect(byId.get("TR-04")!.kd20_per_day).toBe(kd);
    // other reaches keep the scenario's value (the default 0.3 /d)
    expect(byId.get("TR-01")!.kd20_per_day).toBe(0.3);
    const notCalibration = await refused(
      scoped(createScenario)(db, w.users.planner, w.basinId, scenarioCreateSchema.parse({ name: "Wrong run", inputs: { conditions: [{ name: "7Q10" }], fittedKinetics: { runId: run.id } } })),
    );
    expect(notCalibration.details).toEqual([{ path: "inputs.fittedKinetics.runId", message: "There is no such calibration in this basin" }]);
  });

  it("a published plan records the fitted coefficients and the gauge's 7Q10 it was computed with, in the methods its page and PDF print", async () => {
    const queued = await ask({ surveyId: demoSurvey.id, condition: "12 August 2026", fit: [{ parameter: "kd20_per_day", reaches: "all", min: 0.05, max: 3, start: 0.35 }] });
    await processRun(db, queued.id);
    const gauge = await scoped(uploadGaugeRecord)(db, w.users.planner, w.basinId, { name: "q.csv", bytes: demoGaugeBytes() }, gaugeUploadSchema.parse({ name: "Quillford gauge", reachId: "TR-04" }));
    const scenario = await scoped(createScenario)(
      db,
      w.users.planner,
      w.basinId,
      scenarioCreateSchema.parse({ name: "Calibrated, gauged 7Q10", inputs: { conditions: [{ name: "7Q10", gaugeFlow: { gaugeId: gauge.id, statistic: "7Q10" } }], fittedKinetics: { runId: queued.id } } }),
    );
    const run = await scoped(createRun)(db, w.users.planner, w.basinId, scenario.id, "allocation");
    await processRun(db, run.id);
    const plan = await scoped(proposePlan)(db, w.users.planner, w.basinId, { runId: run.id, title: "Calibrated plan" });
    const now = Date.now();
    await scoped(openReview)(db, w.users.lead, w.basinId, plan.id, { startsAt: new Date(now - 60_000).toISOString(), endsAt: new Date(now + 31 * 86_400_000).toISOString(), timeZone: "UTC" });
    await closeDueReviews(db, new Date(now + 32 * 86_400_000));
    await scoped(publishPlan)(db, w.users.lead, w.basinId, plan.id, { acknowledgedThreadIds: [], statement: "" });
    const published = (await getPublishedPlanWithMap(db, w.basinId, plan.id))!;
    const methods = planReport(published.plan, { name: published.basin.name, unitSystem: published.basin.unitSystem }, null).methods.flatMap((g) => g.items);
    const fitted = methods.find((m) => m.label === "Fitted to a survey")!.value;
    const kd = (await scoped(getRun)(db, w.users.planner, w.basinId, queued.id)).result!.calibration!.parameters[0].value;
    expect(fitted).toContain(`fitted to the survey “${demoSurvey.name}” (16 samples, SHA-256 ${demoSurvey.sha256.slice(0, 16)}…) on the condition “12 August 2026”`);
    expect(fitted).toContain(kd.toPrecision(3));
    // the exports say so too: the CSV's notes and the GeoJSON's plan member
    const csv = await planAllocationsCsv(db, null, w.basinId, plan.id);
    expect(String(csv.body)).toContain(`Kinetics fitted to a survey: Deoxygenation rate k_d at 20 °C (1/d) ${kd.toPrecision(3)}`);
    const geojson = JSON.parse(String((await planReachesGeoJson(db, null, w.basinId, plan.id)).body)) as { plan: { kinetics: string } };
    expect(geojson.plan.kinetics).toMatch(/^Kinetics fitted to a survey: .*fitted to the survey “August 2026 main-stem survey”/);
    expect(methods.find((m) => m.label === "7Q10")!.value).toMatch(/^7Q10 of Quillford gauge: 0\.\d+ m³\/s at TR-04, 30 years of daily record 1994-04-01 to 2024-03-31/);
  });

  it("names the field at fault: a condition, a reach or a survey the scenario cannot use", async () => {
    const base = { surveyId: demoSurvey.id, condition: "12 August 2026", fit: [{ parameter: "kd20_per_day", reaches: "all", min: 0.05, max: 3, start: 0.3 }] };
    expect((await refused(ask({ ...base, condition: "Spring" }))).details).toEqual([{ path: "condition", message: "One of 7Q10, 12 August 2026" }]);
    expect((await refused(ask({ ...base, fit: [{ ...base.fit[0], reaches: ["XX-9"] }] }))).details).toEqual([{ path: "fit.0.reaches", message: "Unknown reach XX-9" }]);
    expect((await refused(ask({ ...base, surveyId: "00000000-0000-4000-8000-000000000000" }))).details).toEqual([{ path: "surveyId", message: "Unknown survey" }]);
    expect((await refused(ask({ ...base, weights: { "TS-99": 2 } }))).details).toEqual([{ path: "weights.TS-99", message: "No such station in the survey" }]);
    expect(() => calibrationRunSchema.parse({ ...base, weights: { "TS-01": 0 } })).toThrow(/a weight must be above 0/);
    // weights given with the request go to the stations named; the others keep the survey's (1)
    const weighted = await ask({ ...base, weights: { "TS-07": 4, "TS-08": 0.5 } });
    const obs = (await inputsOf(weighted.id)).calibration.observations;
    expect(obs.find((o) => o.station === "TS-07")!.weight).toBe(4);
    expect(obs.find((o) => o.station === "TS-08")!.weight).toBe(0.5);
    expect(obs.find((o) => o.station === "TS-01")!.weight).toBeUndefined();
    const twice = await refused(ask({ ...base, fit: [base.fit[0], { ...base.fit[0], reaches: ["TR-03"] }] }));
    expect(twice.details).toEqual([{ path: "fit.1.reaches", message: "kd20_per_day of TR-03 is already fitted by entry 1" }]);
    const small = await scoped(uploadSurvey)(db, w.users.planner, w.basinId, { name: "one.csv", bytes: Buffer.from("station,reach,km,do\nA,TR-03,1,6\n") }, surveyUploadSchema.parse({ name: "One sample" }));
    expect((await refused(ask({ ...base, surveyId: small.id }))).message).toMatch(/has 1 DO value\(s\) for 1 coefficient\(s\)/);
    expect(() => calibrationRunSchema.parse({ ...base, fit: [{ ...base.fit[0], start: 9 }] })).toThrow(/start must lie within min–max/);
  });

  it("a stakeholder may not start one", async () => {
    const e = await refused(
      scoped(createCalibrationRun)(db, w.users.stakeholder, w.basinId, scenarioId, calibrationRunSchema.parse({ surveyId: demoSurvey.id, condition: "7Q10", fit: [{ parameter: "kd20_per_day", reaches: "all", min: 0.05, max: 3, start: 0.3 }] })),
    );
    expect(e.code).toBe("forbidden");
  });
});
