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
import type { CommitRows, ImportJob, ImportRequest, ImportResponse, ImportStage, ReadResult, UploadBytes, ValidateResult } from "./import-protocol";

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

async function read(u: UploadBytes, layer: "reaches" | "dischargers") {
  try {
    return await readUploadLayer(u.format, u.bytes, u.options, layer, u.fileName);
  } catch (e) {
    if (e instanceof GeoError) throw new ReadFailure(e, u.path);
    throw e;
  }
}

const summarise = (ps: Problem[]) => ps.map((p) => ({ code: p.code, message: p.message, features: p.features }));

async function run(id: number, job: ImportJob): Promise<ReadResult | ValidateResult> {
  const progress = (stage: ImportStage, fraction: number) => port.postMessage({ id, type: "progress", stage, fraction } satisfies ImportResponse);
  if (job.kind === "read") {
    const source = await read(job.upload, job.layer);
    const sha256 = createHash("sha256").update(job.upload.bytes).digest("hex");
    return { crs: source.crs, featureCount: source.features.length, fields: source.fields, sha256 };
  }
  progress("reading reaches", 0);
  const reaches = await read(job.reaches, "reaches");
  if (job.dischargers) progress("reading dischargers", 0);
  const dischargers = job.dischargers ? await read(job.dischargers, "dischargers") : undefined;
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
    errors: summarise(report.errors),
    warnings: summarise(report.warnings),
    permits: [...new Set(net.dischargers.map((d) => d.attributes.permitId).filter(Boolean))],
  };
  if (!job.forCommit) result.reportJson = JSON.stringify(report);
  else {
    const rows: CommitRows = {
      totalLengthKm: net.totalLengthKm,
      nodes: net.nodes.map((n) => ({ key: n.id, kind: n.kind, lon: n.position[0], lat: n.position[1] })),
      reaches: net.reaches.map((r) => ({
        key: r.id,
        name: r.attributes.name ?? null,
        downstreamKey: r.downstreamReachId ?? null,
        upstreamNode: r.upstreamNodeId,
        downstreamNode: r.downstreamNodeId,
        part: r.component,
        flipped: r.flipped,
        geometryLengthKm: r.geometryLengthKm,
        lengthKm: r.lengthKm,
        coordinates: JSON.stringify(r.coordinates),
        attributes: JSON.stringify(r.attributes),
        sourceIndex: r.sourceIndex,
      })),
      dischargers: net.dischargers.map((d) => ({
        id: d.id,
        permitId: d.attributes.permitId,
        name: d.attributes.name,
        reachId: d.reachId,
        chainageKm: d.chainageKm,
        modelChainageKm: d.modelChainageKm,
        snapDistanceM: d.snapDistanceM,
        assignment: d.assignment,
        position: d.position,
        snapped: d.snapped,
        attributes: JSON.stringify({ ...d.attributes, geometryChainageKm: d.chainageKm }),
        sourceIndex: d.sourceIndex,
      })),
    };
    result.commit = rows;
  }
  return result;
}

port.on("message", (req: ImportRequest) => {
  run(req.id, req.job).then(
    (result) => port.postMessage({ id: req.id, type: "done", result } satisfies ImportResponse),
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
