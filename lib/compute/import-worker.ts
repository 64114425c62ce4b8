/**
 * Worker-thread entry for network imports: reads uploads and runs the import validation off
 * the web server's event loop, posting progress as it goes. Pure computation, no I/O.
 */
import { createHash } from "node:crypto";
import { parentPort } from "node:worker_threads";
import { GeoError } from "../../geo/errors";
import { readUploadLayer } from "../../geo/read-upload";
import { validateImport, type ValidateProgress } from "../../geo/validate";
import type { Problem } from "../../geo/problems";
import { DEFAULT_DESIGN_TEMPERATURE_RULE, designTemperature } from "../hydrology/design-temperature";
import { lowFlowStatistics } from "../hydrology/low-flow";
import { readDailyRecord, readDailyTemperature, RecordError } from "../hydrology/read-record";
import { placeSamples } from "../survey/place-stations";
import { readSurvey } from "../survey/read-survey";
import { MAX_LISTED_PROBLEMS, type GaugeReadResult, type SurveyReadResult, type TemperatureReadResult, type ImportJob, type ImportRequest, type ImportResponse, type ImportStage, type ReadResult, type UploadBytes, type ValidateResult } from "./import-protocol";

if (!parentPort) throw new Error("lib/compute/import-worker.ts must be started as a worker thread");
const port = parentPort;

class ReadFailure extends Error {
  constructor(
    readonly cause: GeoError,
    readonly path: string,
  ) {
    super(cause.message);
  }
}

/**
 * The upload's bytes in this thread's own memory: the web server hands them over in a
 * SharedArrayBuffer (no copy on its thread), and parsers expect ordinary buffers.
 */
const own = (bytes: Uint8Array) => (bytes.buffer instanceof SharedArrayBuffer ? new Uint8Array(bytes) : bytes);

async function read(u: UploadBytes, layer: "reaches" | "dischargers") {
  try {
    return await readUploadLayer(u.format, u.bytes, u.options, layer, u.fileName);
  } catch (e) {
    if (e instanceof GeoError) throw new ReadFailure(e, u.path);
    throw e;
  }
}

/** Rows as JSON arrays of at most `max` weight each (rows, or vertices for reaches): a few MB of text per insert. */
function chunks<T>(items: readonly T[], max: number, weight: (t: T) => number, row: (t: T) => unknown): string[] {
  const out: string[] = [];
  let part: unknown[] = [];
  let w = 0;
  for (const t of items) {
    const tw = weight(t);
    if (part.length > 0 && w + tw > max) {
      out.push(JSON.stringify(part));
      [part, w] = [[], 0];
    }
    part.push(row(t));
    w += tw;
  }
  if (part.length > 0) out.push(JSON.stringify(part));
  return out;
}

const summarise = (ps: Problem[]) => ps.map((p) => ({ code: p.code, message: p.message, features: p.features }));

/** A daily flow record: UTF-8 text, read in its unit, with its low-flow statistics; a bad line is an answer, not a failure. */
function readGauge(job: Extract<ImportJob, { kind: "gauge" }>): GaugeReadResult {
  const bytes = own(job.bytes);
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return { ok: false, message: `${job.fileName} is not UTF-8 text: upload the record as CSV (date,flow) or rdb text` };
  }
  try {
    const days = readDailyRecord(text, job.unit);
    if (days.length === 0) return { ok: false, message: `${job.fileName}: the record has no days` };
    const report = lowFlowStatistics(days, { climaticYearStart: job.climaticYearStart });
    const dates = days.map((d) => d.date).sort();
    return {
      ok: true,
      report,
      sha256: createHash("sha256").update(bytes).digest("hex"),
      dayCount: days.length,
      missingDays: days.filter((d) => d.flow === null).length,
      firstDay: dates[0],
      lastDay: dates[dates.length - 1],
    };
  } catch (e) {
    if (e instanceof RecordError || e instanceof RangeError) return { ok: false, message: `${job.fileName}: ${e.message}` };
    throw e;
  }
}

/** A daily water-temperature record: UTF-8 text read in its unit; a bad line is an answer, not a failure. */
function readTemperature(job: Extract<ImportJob, { kind: "temperature" }>): TemperatureReadResult {
  const bytes = own(job.bytes);
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return { ok: false, message: `${job.fileName} is not UTF-8 text: upload the record as CSV (date,temperature) or rdb text` };
  }
  try {
    const days = readDailyTemperature(text, job.unit);
    if (days.length === 0) return { ok: false, message: `${job.fileName}: the record has no days` };
    let summer = null;
    try {
      summer = designTemperature(days, DEFAULT_DESIGN_TEMPERATURE_RULE);
    } catch (e) {
      if (!(e instanceof RangeError)) throw e;
    }
    return {
      ok: true,
      daysJson: JSON.stringify(days),
      summer,
      sha256: createHash("sha256").update(bytes).digest("hex"),
      dayCount: days.length,
      missingDays: days.filter((d) => d.value === null).length,
      firstDay: days[0].date,
      lastDay: days[days.length - 1].date,
    };
  } catch (e) {
    if (e instanceof RecordError) return { ok: false, message: `${job.fileName}: ${e.message}` };
    throw e;
  }
}

/** A survey file read and its samples placed; a row that cannot be used is an answer (the problems), not a failure. */
async function readAndPlaceSurvey(job: Extract<ImportJob, { kind: "survey" }>): Promise<SurveyReadResult> {
  const bytes = own(job.bytes);
  let read;
  try {
    read = await readSurvey(job.format, bytes, job.fileName, job.options);
  } catch (e) {
    if (e instanceof GeoError) throw new ReadFailure(e, "file");
    throw e;
  }
  const columns = read.columns as Record<string, string>;
  if (read.problems.length > 0) return { ok: false, problems: read.problems, columns };
  const { placed, problems } = placeSamples(job.reaches, read.samples, { maxSnapDistanceM: job.maxSnapDistanceM });
  if (problems.length > 0) return { ok: false, problems, columns };
  return { ok: true, samples: placed, sha256: createHash("sha256").update(bytes).digest("hex"), columns };
}

async function run(id: number, job: ImportJob): Promise<ReadResult | ValidateResult | GaugeReadResult | SurveyReadResult | TemperatureReadResult> {
  const progress = (stage: ImportStage, fraction: number) => port.postMessage({ id, type: "progress", stage, fraction } satisfies ImportResponse);
  if (job.kind === "gauge") return readGauge(job);
  if (job.kind === "survey") return readAndPlaceSurvey(job);
  if (job.kind === "temperature") return readTemperature(job);
  if (job.kind === "read") {
    const upload = { ...job.upload, bytes: own(job.upload.bytes) };
    const source = await read(upload, job.layer);
    const sha256 = createHash("sha256").update(upload.bytes).digest("hex");
    return { crs: source.crs, featureCount: source.features.length, fields: source.fields, sha256 };
  }
  progress("reading reaches", 0);
  const reaches = await read({ ...job.reaches, bytes: own(job.reaches.bytes) }, "reaches");
  if (job.dischargers) progress("reading dischargers", 0);
  const dischargers = job.dischargers ? await read({ ...job.dischargers, bytes: own(job.dischargers.bytes) }, "dischargers") : undefined;
  const stages = { lines: "checking lines", network: "building the network", dischargers: "placing dischargers" } as const;
  const onProgress: ValidateProgress = (stage, fraction) => progress(stages[stage], fraction);
  const report = validateImport(
    { reaches, reachMapping: job.reachMapping, dischargers, dischargerMapping: job.dischargers ? job.dischargerMapping : undefined },
    job.options,
    onProgress,
  );
  progress("writing the report", 0);
  const net = report.network;
  const result: ValidateResult = {
    permitsJson: JSON.stringify([...new Set(net.dischargers.map((d) => d.attributes.permitId).filter(Boolean))]),
  };
  if (!job.forCommit) result.reportJson = new TextEncoder().encode(JSON.stringify(report));
  else {
    const placed = net.dischargers.filter((d) => d.reachId && d.snapped && d.chainageKm !== undefined);
    const unplaced = net.dischargers.find((d) => !placed.includes(d));
    const facilities = new Map(placed.map((d) => [d.attributes.permitId, { name: d.attributes.name, permit_id: d.attributes.permitId }]));
    result.commit = {
      errors: summarise(report.errors.slice(0, MAX_LISTED_PROBLEMS)),
      errorCount: report.errors.length,
      warningCount: report.warnings.length,
      storedReport: JSON.stringify({ errors: [], warnings: summarise(report.warnings) }),
      totalLengthKm: net.totalLengthKm,
      reachCount: net.reaches.length,
      outfallCount: placed.length,
      unplaced: unplaced?.id,
      nodes: chunks(net.nodes, 2000, () => 1, (n) => ({ node_key: n.id, kind: n.kind, lon: n.position[0], lat: n.position[1] })),
      reaches: chunks(net.reaches, 50_000, (r) => r.coordinates.length, (r) => ({
        reach_key: r.id,
        name: r.attributes.name ?? null,
        downstream_key: r.downstreamReachId ?? null,
        upstream_node: r.upstreamNodeId,
        downstream_node: r.downstreamNodeId,
        part: r.component,
        flipped: r.flipped,
        geometry_length_km: r.geometryLengthKm,
        length_km: r.lengthKm,
        coordinates: r.coordinates,
        attributes: r.attributes,
        source_index: r.sourceIndex,
      })),
      facilities: chunks([...facilities.values()], 2000, () => 1, (f) => f),
      outfalls: chunks(placed, 2000, () => 1, (d) => ({
        permit_id: d.attributes.permitId,
        reach_key: d.reachId,
        chainage_km: d.modelChainageKm ?? d.chainageKm,
        snap_distance_m: d.snapDistanceM ?? 0,
        assignment: d.assignment,
        lon: d.position[0],
        lat: d.position[1],
        snapped_lon: d.snapped![0],
        snapped_lat: d.snapped![1],
        attributes: { ...d.attributes, geometryChainageKm: d.chainageKm },
        source_index: d.sourceIndex,
      })),
    };
  }
  return result;
}

port.on("message", (req: ImportRequest) => {
  run(req.id, req.job).then(
    (result) => {
      const bytes = "reportJson" in result ? result.reportJson : undefined;
      port.postMessage({ id: req.id, type: "done", result } satisfies ImportResponse, bytes ? [bytes.buffer as ArrayBuffer] : []);
    },
    (e: unknown) => {
      const inner = e instanceof ReadFailure ? e.cause : e;
      const err = inner instanceof Error ? inner : new Error(String(inner));
      port.postMessage({
        id: req.id,
        type: "failed",
        error: {
          name: err.name,
          message: err.message,
          ...(inner instanceof GeoError ? { code: inner.code, details: inner.details } : {}),
          ...(e instanceof ReadFailure ? { path: e.path } : {}),
        },
      } satisfies ImportResponse);
    },
  );
});
