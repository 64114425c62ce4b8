import { LRUCache } from "lru-cache";
import { createHash } from "node:crypto";
import { insertAuditEvent } from "@/db/queries/audit";
import { isDatabaseUnavailable, type Db } from "@/db/client";
import { listUnfinishedRuns, setUnfinishedRunState } from "@/db/queries/run-faults";
import { findDoneRunByHash, findRun, findRunJsonText, findScenario, insertRun, listDoneCalibrations, listRuns as listRunRows, runForWork } from "@/db/queries/scenarios";
import type { RunKind } from "@/db/schema";
import { enqueueRun, findRunJob, runTimeLimitSeconds } from "@/lib/jobs/queue";
import { ComputeTimeoutError } from "@/lib/compute/pool";
import { ModelInputError, type ModelFile, type RunPayload, type RunResult } from "@/lib/model";
import { storedRunPayload, type StoredRunJob } from "@/lib/compute/stored-run";
import type { CalibrationSpec } from "@/lib/calibration/payload";
import type { BasinScope } from "@/lib/auth/scope";
import { AppError, notFound } from "@/lib/errors";
import { buildConditionFiles, buildModelFile, ScenarioInputError } from "@/lib/scenarios/build-model-file";
import { MODEL_VERSION, SATURATION_METHOD } from "@/lib/scenarios/model-version";
import type { CalibrationRunRequest } from "@/lib/validation/calibration";
import { scenarioInputsSchema, type ScenarioInputs } from "@/lib/validation/scenario";
import { loadNetworkForModel } from "./scenarios";
import { getSurvey, type SurveyDto } from "./surveys";

/** What a run computes: the model files it will use, as stored with it. */
export interface RunInputs {
  kind: RunKind;
  /** Model runs: one file per condition; allocation runs: one file (further conditions inside); calibrations: the survey's condition. */
  files: { name: string; file: ModelFile }[];
  warnings: string[];
  /** Calibration runs: the survey's observations and what is fitted (lib/calibration/payload.ts). */
  calibration?: CalibrationSpec;
  /**
   * The scenario exactly as it was run (name, version, network and inputs),
   * so a plan proposed later records what this run used, not what the
   * scenario says by then. Runs stored before this field existed lack it.
   */
  scenario?: RunScenarioRecord;
}

/** The scenario as a run used it. */
export interface RunScenarioRecord {
  id: string;
  name: string;
  version: number;
  networkId: string;
  inputs: ScenarioInputs;
}

/** Key-sorted JSON, so equal inputs hash equally. */
function stableJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(stableJson).join(",")}]`;
  if (value && typeof value === "object") {
    const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined);
    entries.sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${stableJson(v)}`).join(",")}}`;
  }
  return JSON.stringify(value);
}

/** What makes two runs the same computation (a calibration's survey and fit too; model and allocation hashes are as they always were). */
export const inputsHash = (inputs: RunInputs) =>
  createHash("sha256")
    .update(stableJson({ model: MODEL_VERSION, kind: inputs.kind, files: inputs.files, ...(inputs.calibration ? { calibration: inputs.calibration } : {}) }))
    .digest("hex");

export interface RunSummaryDto {
  id: string;
  scenarioId: string;
  scenarioName: string;
  scenarioVersion: number;
  kind: RunKind;
  status: string;
  progress: number;
  error: string | null;
  inputsHash: string;
  modelVersion: string;
  methods: Record<string, unknown>;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

/** A stored run's result (lib/model/run-payload). */
export type RunResultPayload = RunPayload;

export interface RunDto extends RunSummaryDto {
  result: RunResultPayload | null;
  modelFiles: { name: string; file: ModelFile }[];
}

type RunRow = NonNullable<Awaited<ReturnType<typeof findRun>>>;
const summary = (r: RunRow & { scenario_name: string }): RunSummaryDto => ({
  id: r.id,
  scenarioId: r.scenario_id,
  scenarioName: r.scenario_name,
  scenarioVersion: r.scenario_version,
  kind: r.kind,
  status: r.status,
  progress: r.progress,
  error: r.error,
  inputsHash: r.inputs_hash,
  modelVersion: r.model_version,
  methods: r.methods,
  createdAt: r.created_at.toISOString(),
  startedAt: r.started_at?.toISOString() ?? null,
  finishedAt: r.finished_at?.toISOString() ?? null,
});

/**
 * Queue a model or allocation run of a scenario as it is now. The model
 * files are built (and checked) here, stored with the run and hashed; a
 * finished run with the same inputs is returned instead of computing again.
 */
export async function createRun(scope: BasinScope, scenarioId: string, kind: "model" | "allocation"): Promise<RunSummaryDto & { reused: boolean }> {
  scope.require("scenario.run");
  const { db, basin } = scope;
  const scenario = await findScenario(db, basin.id, scenarioId);
  if (!scenario) throw notFound("Scenario");
  const inputs = scenarioInputsSchema.parse(scenario.inputs);
  const network = await loadNetworkForModel(db, scenario.network_id);
  const runInputs = scenarioFiles(() => {
    if (kind === "model") {
      const files = buildConditionFiles(network, inputs, basin.do_criterion_mg_l);
      return { kind, files: files.map(({ name, file }) => ({ name, file })), warnings: files.flatMap((f) => f.warnings) };
    }
    const built = buildModelFile(network, inputs, basin.do_criterion_mg_l, true);
    return { kind, files: [{ name: inputs.conditions[0].name, file: built.file }], warnings: built.warnings };
  });
  return queueRun(scope, scenario, inputs, runInputs, { kind });
}

/** The model files a scenario builds, its input problems as a 422 naming the field. */
function scenarioFiles(build: () => RunInputs): RunInputs {
  try {
    return build();
  } catch (error) {
    if (error instanceof ScenarioInputError) {
      throw new AppError("invalid", error.message, [{ path: error.path, message: error.message }]);
    }
    throw error;
  }
}

type ScenarioRow = NonNullable<Awaited<ReturnType<typeof findScenario>>>;

/** Store and queue a run (or return the finished run with the very same inputs), audited. */
async function queueRun(scope: BasinScope, scenario: ScenarioRow, inputs: ScenarioInputs, runInputs: RunInputs, details: Record<string, unknown>): Promise<RunSummaryDto & { reused: boolean }> {
  const { db, actor, basin } = scope;
  const kind = runInputs.kind;
  runInputs.scenario = { id: scenario.id, name: scenario.name, version: scenario.version, networkId: scenario.network_id, inputs };
  const hash = inputsHash(runInputs);
  const done = await findDoneRunByHash(db, basin.id, kind, hash);
  if (done) {
    const row = (await findRun(db, basin.id, done.id, false))!;
    return { ...summary(row), reused: true };
  }
  const { id } = await db.transaction().execute(async (trx) => {
    const run = await insertRun(trx, {
      basinId: basin.id,
      scenarioId: scenario.id,
      scenarioVersion: scenario.version,
      kind,
      inputsHash: hash,
      modelFile: runInputs,
      modelVersion: MODEL_VERSION,
      userId: actor.id,
    });
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "run.queued",
      targetType: "run",
      targetId: run.id,
      details: { scenario: scenario.name, ...details },
    });
    // the job is written in this transaction: no run row without its job, and no job without its run
    await enqueueRun(run.id, trx);
    return run;
  });
  return { ...summary((await findRun(db, basin.id, id, false))!), reused: false };
}

/**
 * Queue a calibration: the coefficients `request.fit` names, fitted by bounded least squares
 * to the DO of a survey's samples on the scenario's condition that stands for the survey's day
 * (its flows, temperatures and today's loads), in the background worker like any run. Samples
 * without DO are left out and listed; a sample on a reach the scenario's network lacks, a
 * condition or reach the scenario does not have, or fewer samples than coefficients is a 422
 * naming the field.
 */
export async function createCalibrationRun(scope: BasinScope, scenarioId: string, request: CalibrationRunRequest): Promise<RunSummaryDto & { reused: boolean }> {
  scope.require("scenario.run");
  const { db, basin } = scope;
  const scenario = await findScenario(db, basin.id, scenarioId);
  if (!scenario) throw notFound("Scenario");
  const surveyFor = (id: string, path: string) =>
    getSurvey(scope, id).catch((e: unknown) => {
      if (e instanceof AppError && e.code === "not_found") throw new AppError("invalid", "There is no such survey in this basin", [{ path, message: "Unknown survey" }]);
      throw e;
    });
  const survey = await surveyFor(request.surveyId, "surveyId");
  if (request.validationSurveyId === request.surveyId) {
    throw new AppError("invalid", "Check the fit against another survey than the one it is fitted to", [{ path: "validationSurveyId", message: "The same survey as surveyId" }]);
  }
  const second = request.validationSurveyId ? await surveyFor(request.validationSurveyId, "validationSurveyId") : null;
  const inputs = scenarioInputsSchema.parse(scenario.inputs);
  const network = await loadNetworkForModel(db, scenario.network_id);
  const files = scenarioFiles(() => {
    const built = buildConditionFiles(network, inputs, basin.do_criterion_mg_l);
    return { kind: "calibration", files: built.map(({ name, file }) => ({ name, file })), warnings: built.flatMap((f) => f.warnings) };
  });
  const chosen = files.files.find((f) => f.name === request.condition);
  if (!chosen) {
    throw new AppError("invalid", `The scenario has no condition "${request.condition}"`, [{ path: "condition", message: `One of ${files.files.map((f) => f.name).join(", ")}` }]);
  }
  const reaches = new Map(chosen.file.reaches.map((r) => [r.id, r]));
  const allReaches = [...reaches.keys()];
  const fit = request.fit.map((f, i) => {
    const ids = f.reaches === "all" ? allReaches : f.reaches;
    const unknown = ids.find((id) => !reaches.has(id));
    if (unknown) throw new AppError("invalid", `Reach "${unknown}" is not in the scenario's network`, [{ path: `fit.${i}.reaches`, message: `Unknown reach ${unknown}` }]);
    return { parameter: f.parameter, reaches: [...ids], min: f.min, max: f.max, start: f.start };
  });
  // one value per coefficient per reach: the same coefficient twice on a reach cannot be fitted
  const seen = new Map<string, number>();
  fit.forEach((f, i) => {
    for (const id of f.reaches) {
      const key = `${f.parameter} ${id}`;
      const first = seen.get(key);
      if (first !== undefined) {
        throw new AppError("invalid", `${f.parameter} of reach ${id} is fitted twice (entries ${first + 1} and ${i + 1})`, [{ path: `fit.${i}.reaches`, message: `${f.parameter} of ${id} is already fitted by entry ${first + 1}` }]);
      }
      seen.set(key, i);
    }
  });
  const observationsOf = (s: SurveyDto, path: string) => {
    const observed = s.samples.filter((x) => x.do_mg_l !== null);
    const missing = observed.find((x) => !reaches.has(x.reach));
    if (missing) {
      throw new AppError("invalid", `Station ${missing.station} of the survey ${s.name} lies on reach ${missing.reach}, which the scenario's network does not have`, [
        { path, message: `The survey was placed on network version ${s.networkVersion}` },
      ]);
    }
    return {
      survey: { id: s.id, name: s.name, fileName: s.fileName, sha256: s.sha256, networkVersion: s.networkVersion, firstTime: s.firstTime, lastTime: s.lastTime },
      observations: observed.map((x) => {
        const weight = (path === "surveyId" ? request.weights?.[x.station] : undefined) ?? x.weight;
        return { station: x.station, reach: x.reach, km: Math.min(x.km, reaches.get(x.reach)!.length_km), do_mg_l: x.do_mg_l!, ...(weight !== null && weight !== undefined ? { weight } : {}) };
      }),
      leftOut: s.samples.filter((x) => x.do_mg_l === null).map((x) => ({ station: x.station, row: x.row, reason: "no DO value" })),
    };
  };
  const fitted = observationsOf(survey, "surveyId");
  const unknownStation = Object.keys(request.weights ?? {}).find((st) => !survey.samples.some((x) => x.station === st));
  if (unknownStation) throw new AppError("invalid", `The survey has no station "${unknownStation}" to weight`, [{ path: `weights.${unknownStation}`, message: "No such station in the survey" }]);
  const observed = fitted.observations;
  const validation = second ? observationsOf(second, "validationSurveyId") : undefined;
  if (validation && validation.observations.length === 0) {
    throw new AppError("invalid", `The survey ${second!.name} has no DO values to check the fit against`, [{ path: "validationSurveyId", message: "No DO values" }]);
  }
  if (observed.length <= fit.length) {
    throw new AppError("invalid", `The survey has ${observed.length} DO value(s) for ${fit.length} coefficient(s): a fit needs more observations than coefficients`, [
      { path: "fit", message: "Fit fewer coefficients, or use a survey with more DO values" },
    ]);
  }
  const calibration: CalibrationSpec = { ...(request.name ? { name: request.name } : {}), survey: fitted.survey, condition: chosen.name, observations: observed, fit, leftOut: fitted.leftOut, ...(validation ? { validation } : {}) };
  const runInputs: RunInputs = { kind: "calibration", files: [chosen], warnings: files.warnings, calibration };
  return queueRun(scope, scenario, inputs, runInputs, { kind: "calibration", survey: survey.name, condition: chosen.name, ...(second ? { validationSurvey: second.name } : {}) });
}

/** A finished calibration as a scenario may choose it (its fitted values then replace the reaches' coefficients). */
export interface CalibrationChoice {
  runId: string;
  /** The planner's name for the fitted set, or null. */
  name: string | null;
  scenarioName: string;
  surveyName: string;
  condition: string;
  rmseMgL: number;
  finishedAt: string;
}

export async function listCalibrationChoices(scope: BasinScope): Promise<CalibrationChoice[]> {
  scope.require("scenario.read");
  return (await listDoneCalibrations(scope.db, scope.basin.id)).map((r) => ({
    runId: r.id,
    name: r.set_name,
    scenarioName: r.scenario_name,
    surveyName: r.survey_json_name,
    condition: r.condition_json,
    rmseMgL: Number(r.rmse),
    finishedAt: r.finished_at!.toISOString(),
  }));
}

/** A readable reason for a failed run (never a stack trace). */
export function failureReason(error: unknown): string {
  if (error instanceof ModelInputError) return `${error.path.join(".")}: ${error.message}`;
  if (error instanceof ComputeTimeoutError) return `The computation did not finish within the run's time limit (${Math.round(error.ms / 1000)} s) and was stopped; the network or the allocation may be too large for one run`;
  if (error instanceof Error) return error.message;
  return String(error);
}

/** Methods used, recorded with the run: reaeration formula per reach, θ rule, saturation. */
function methodsOf(runs: RunResult[]): Record<string, unknown> {
  const ka: Record<string, string[]> = {};
  for (const run of runs) {
    for (const r of run.reaches) ka[r.id] = [...new Set([...(ka[r.id] ?? []), ...r.segments.map((s) => s.ka_method)])];
  }
  return { reaeration: ka, deoxygenation_theta_rule: runs[0]?.kinetics.deoxygenation_rule, theta: runs[0]?.kinetics.theta, saturation: SATURATION_METHOD };
}

/** How a run's computation is done: in this thread (tests, CLI) or in a worker thread with a time limit (the background worker). */
export type RunCompute = (job: StoredRunJob, onProgress: (done: number) => void) => Promise<RunPayload>;

const computeInline: RunCompute = async (job, onProgress) => storedRunPayload(job, onProgress);

/**
 * The job: compute a queued run and store its result or its failure reason.
 * Every write applies only while the run is unfinished, so a run the sweeper
 * has failed stays failed. A lost database connection is thrown (nothing can
 * be stored; the worker tries again when the database is back); any other
 * error fails the run with a readable reason and is logged once with its stack.
 */
export async function processRun(db: Db, runId: string, compute: RunCompute = computeInline): Promise<void> {
  const run = await runForWork(db, runId);
  if (!run || run.status === "done" || run.status === "failed") return;
  if (!(await setUnfinishedRunState(db, runId, { status: "running", progress: 0.05, started: true }))) return;
  // progress is written in order, one update at a time, while the computation goes on
  let written: Promise<unknown> = Promise.resolve();
  const onProgress = (done: number) => {
    written = written.then(() => setUnfinishedRunState(db, runId, { status: "running", progress: 0.05 + 0.9 * done })).catch(() => undefined);
  };
  try {
    const inputs = run.model_file as unknown as RunInputs;
    const payload = await compute({ runKind: run.kind, files: inputs.files, warnings: inputs.warnings, ...(inputs.calibration ? { calibration: inputs.calibration } : {}) }, onProgress);
    await written;
    await setUnfinishedRunState(db, runId, {
      status: "done",
      progress: 1,
      result: payload,
      methods: methodsOf(payload.conditions.map((c) => c.run)),
      finished: true,
    });
  } catch (error) {
    await written;
    if (isDatabaseUnavailable(error)) throw error;
    // bad input is the planner's to fix and says so; anything else is a fault the operator must see, once, with the run id
    if (!(error instanceof ModelInputError)) console.error(`[runs] run ${runId} failed`, error);
    await setUnfinishedRunState(db, runId, { status: "failed", error: failureReason(error), finished: true });
  }
}

/** What the queue knows of a run's job (lib/jobs/queue findRunJob; replaceable in tests). */
export type RunJobLookup = (runId: string) => Promise<{ state: string; output: unknown } | null>;

/** How long a run's job may be missing from the queue before its run is failed (covers a queue being reset). */
const MISSING_JOB_GRACE_MS = 60_000;

function jobFailureMessage(output: unknown): string {
  const o = output as { message?: unknown; value?: { message?: unknown } } | null;
  const m = o?.message ?? o?.value?.message;
  return typeof m === "string" ? m : "";
}

/** The reason a planner reads when a run's job ended without the run finishing. */
export function reasonForJob(job: { state: string; output: unknown } | null, limitSeconds = runTimeLimitSeconds()): string | null {
  const limit = limitSeconds >= 120 ? `${Math.round(limitSeconds / 60)} minutes` : `${limitSeconds} seconds`;
  if (!job) return "The run's job is no longer on the queue (the queue was cleared), so it will not be computed. Run it again.";
  if (job.state === "cancelled") return "The run's job was cancelled before it finished. Run it again.";
  if (job.state === "completed") return "The worker finished the run's job without storing a result. Run it again.";
  if (job.state !== "failed") return null;
  const message = jobFailureMessage(job.output);
  if (/timeout|exceeded/i.test(message)) return `The run did not finish within its time limit of ${limit}, also when tried again. Run it again; if it keeps happening, tell the operator.`;
  if (isDatabaseUnavailable({ message })) return "The worker lost its database connection while computing this run, also when tried again. Run it again.";
  return "The worker could not finish this run, also when tried again. Run it again; if it keeps happening, tell the operator.";
}

/**
 * The worker's sweep: fail every run that will never finish on its own —
 * its job failed (error or time limit, retries spent), was cancelled, or is
 * gone from the queue, or it has been running longer than the time limit
 * with a job nobody is working (its worker died). Each failure gets a reason
 * for the planner and one log line for the operator. Returns how many it failed.
 */
export async function sweepStuckRuns(db: Db, lookupJob: RunJobLookup = findRunJob, now = new Date()): Promise<number> {
  const limitMs = runTimeLimitSeconds() * 1000;
  let failed = 0;
  for (const run of await listUnfinishedRuns(db, now)) {
    const job = await lookupJob(run.id);
    let reason = reasonForJob(job);
    if (!job && now.getTime() - run.created_at.getTime() < MISSING_JOB_GRACE_MS) reason = null;
    // an active job past its limit is failed by pg-boss's maintenance; this catches a worker gone without it
    if (!reason && job?.state === "active" && run.status === "running" && run.started_at && now.getTime() - run.started_at.getTime() > limitMs + MISSING_JOB_GRACE_MS) {
      reason = "The worker stopped while computing this run (it may have been restarted). Run it again.";
    }
    if (!reason) continue;
    if (await setUnfinishedRunState(db, run.id, { status: "failed", error: reason, finished: true })) {
      failed += 1;
      console.error(`[runs] run ${run.id} failed by the sweeper: job ${job ? job.state : "missing"}${jobFailureMessage(job?.output) ? ` (${jobFailureMessage(job?.output)})` : ""}`);
    }
  }
  return failed;
}

export async function listRuns(scope: BasinScope, scenarioId?: string): Promise<RunSummaryDto[]> {
  scope.require("scenario.read");
  const { db, basin } = scope;
  // a scenario that is not this basin's is not found, rather than a list with nothing in it
  if (scenarioId !== undefined && !(await findScenario(db, basin.id, scenarioId))) throw notFound("Scenario");
  return (await listRunRows(db, basin.id, scenarioId)).map(summary);
}

export async function getRun(scope: BasinScope, runId: string): Promise<RunDto> {
  scope.require("scenario.read");
  const { db, basin } = scope;
  const row = await findRun(db, basin.id, runId, true);
  if (!row) throw notFound("Run");
  const r = row as typeof row & { result: RunResultPayload | null; model_file: RunInputs };
  return { ...summary(r), result: r.result, modelFiles: r.model_file.files };
}

/**
 * The scenario as this run used it: the record stored with the run, or — for
 * a run stored before runs kept it — the scenario itself while it is still at
 * the version that was run (every save bumps the version, so equal versions
 * mean equal name, network and inputs). Null when neither can be had.
 */
export async function runScenarioRecord(db: Db, basinId: string, run: RunDto): Promise<RunScenarioRecord | null> {
  const row = (await findRun(db, basinId, run.id, true)) as { model_file?: RunInputs } | undefined;
  const stored = row?.model_file?.scenario;
  if (stored) return { ...stored, inputs: scenarioInputsSchema.parse(stored.inputs) };
  const scenario = await findScenario(db, basinId, run.scenarioId);
  if (!scenario || scenario.version !== run.scenarioVersion) return null;
  return { id: scenario.id, name: scenario.name, version: scenario.version, networkId: scenario.network_id, inputs: scenarioInputsSchema.parse(scenario.inputs) };
}

/** Status only (for polling). */
export async function getRunStatus(scope: BasinScope, runId: string): Promise<RunSummaryDto> {
  scope.require("scenario.read");
  const { db, basin } = scope;
  const row = await findRun(db, basin.id, runId, false);
  if (!row) throw notFound("Run");
  return summary(row);
}

/**
 * The same document as getRun, assembled from the stored JSON text: a stored
 * result is read often (results pages, comparisons, review) and never changes,
 * so it is not parsed and serialised again on every request.
 */
export async function getRunJson(scope: BasinScope, runId: string): Promise<{ bytes: Uint8Array<ArrayBuffer>; etag: string }> {
  scope.require("scenario.read");
  const { db, basin } = scope;
  // a finished run of this basin read before by this process: nothing about it can have changed
  const key = `${basin.id}/${runId.toLowerCase()}`;
  const kept = finishedRuns.get(key);
  if (kept) return kept;
  // the small row first: it proves the run exists in this basin and says whether it can change
  const brief = await findRun(db, basin.id, runId, false);
  if (!brief) throw notFound("Run");
  const etag = `"${brief.id}-${brief.status}-${brief.finished_at?.getTime() ?? 0}"`;
  const row = await findRunJsonText(db, basin.id, runId);
  if (!row) throw notFound("Run");
  const head = JSON.stringify(summary(row));
  const bytes = utf8.encode(`${head.slice(0, -1)},"result":${row.result_text ?? "null"},"modelFiles":${row.files_text}}`);
  const final = brief.status === "done" || brief.status === "failed";
  if (final && row.status === brief.status) finishedRuns.set(key, { bytes, etag });
  return { bytes, etag };
}

/**
 * Finished runs' JSON documents (UTF-8 bytes and ETag) by basin and run id, up to 64 MiB.
 * Keeping them is sound because a run's final state is final: the only writes to a run
 * (setUnfinishedRunState) touch a queued or running one, and runs are never deleted
 * (a scenario with runs cannot be, nor can a basin). Rendering one from PostgreSQL's jsonb
 * costs more than all the rest of a read, and encoding the text again on every response
 * costs more than sending it; the caller's role is still checked first, on every request.
 */
const utf8 = new TextEncoder();
const finishedRuns = new LRUCache<string, { bytes: Uint8Array<ArrayBuffer>; etag: string }>({
  maxSize: 64 * 1024 * 1024,
  sizeCalculation: (kept) => Math.max(1, kept.bytes.byteLength),
});
