import { join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import type { GaugeReadResult, SurveyReadResult, TemperatureReadResult, ImportErrorData, ImportJob, ImportResponse, ImportStage, ReadResult, ValidateResult } from "./import-protocol";
import { createWorkerPool } from "./worker-pool";

/** An import job failed in the worker; `data` carries a GeoError's code and details. */
export class ImportJobError extends Error {
  constructor(readonly data: ImportErrorData) {
    super(data.message);
    this.name = "ImportJobError";
  }
}

export type ProgressListener = (stage: ImportStage, fraction: number) => void;

export interface ImportPool {
  read(job: Extract<ImportJob, { kind: "read" }>): Promise<ReadResult>;
  validate(job: Extract<ImportJob, { kind: "validate" }>, onProgress?: ProgressListener): Promise<ValidateResult>;
  /** Read a gauge's daily record and compute its low flows (40–90 ms for 30 years; longer records scale with their length). */
  gauge(job: Omit<Extract<ImportJob, { kind: "gauge" }>, "kind">): Promise<GaugeReadResult>;
  /** Read a daily water-temperature record (°C). */
  temperature(job: Omit<Extract<ImportJob, { kind: "temperature" }>, "kind">): Promise<TemperatureReadResult>;
  /** Read a synoptic survey and place its samples on the network's reaches. */
  survey(job: Omit<Extract<ImportJob, { kind: "survey" }>, "kind">): Promise<SurveyReadResult>;
  close(): Promise<void>;
}

/**
 * Where the worker entry is. From sources (tsx, vitest) it sits beside this file. In the
 * Next.js production build this module is bundled into .next/, so it is found from the
 * project folder the server runs in and started from its TypeScript source through tsx
 * (as scripts/worker.ts is): that keeps one copy of the geo code and no second bundle.
 * SAGLINE_IMPORT_WORKER overrides the path.
 */
function workerUrl(): URL {
  if (process.env.SAGLINE_IMPORT_WORKER) return pathToFileURL(process.env.SAGLINE_IMPORT_WORKER);
  const here = import.meta.url;
  if (here.startsWith("file:") && here.endsWith(".ts")) return pathToFileURL(join(fileURLToPath(here), "..", "import-worker.ts"));
  return pathToFileURL(join(process.cwd(), "lib", "compute", "import-worker.ts"));
}

/**
 * Worker threads for reading uploads and validating imports, so that a large upload never
 * stalls the web server. Jobs queue when every worker is busy; a job past `timeoutMs` has its
 * worker terminated (and replaced on the next job).
 */
export function createImportPool(options: { size?: number; timeoutMs?: number } = {}): ImportPool {
  const timeoutMs = options.timeoutMs ?? 300_000;
  const pool = createWorkerPool<ImportJob, ImportResponse>({
    url: workerUrl(),
    size: options.size ?? 1,
    timeoutMs,
    settle: (res, observe) => {
      if (res.type === "progress") return void observe?.(res);
      return res.type === "done" ? { value: res.result } : { error: new ImportJobError(res.error) };
    },
    failure: (f) => {
      if (f.kind === "timeout") {
        return new ImportJobError({ name: "ImportTimeout", code: "import_timeout", message: `The import took longer than ${Math.round(f.ms / 1000)} s and was stopped` });
      }
      if (f.kind === "closed") return new Error("the import pool is closed");
      return new Error(f.kind === "failed" ? `the import worker failed: ${f.message}` : `the import worker exited (code ${f.code})`);
    },
  });
  const progress = (onProgress?: ProgressListener) =>
    onProgress && ((res: ImportResponse) => res.type === "progress" && onProgress(res.stage, res.fraction));
  return {
    read: (job) => pool.submit(job) as Promise<ReadResult>,
    validate: (job, onProgress) => pool.submit(job, progress(onProgress)) as Promise<ValidateResult>,
    gauge: (job) => pool.submit({ kind: "gauge", ...job }) as Promise<GaugeReadResult>,
    survey: (job) => pool.submit({ kind: "survey", ...job }) as Promise<SurveyReadResult>,
    temperature: (job) => pool.submit({ kind: "temperature", ...job }) as Promise<TemperatureReadResult>,
    close: pool.close,
  };
}

const holder = globalThis as typeof globalThis & { __saglineImportPool?: ImportPool };

/**
 * The server's one import pool (SAGLINE_IMPORT_WORKERS threads, default 1), kept on
 * globalThis because Next.js may load this module once per route bundle.
 */
export function importPool(): ImportPool {
  if (!holder.__saglineImportPool) {
    const size = Number(process.env.SAGLINE_IMPORT_WORKERS ?? 1);
    holder.__saglineImportPool = createImportPool({ size: Number.isInteger(size) && size > 0 ? size : 1 });
  }
  return holder.__saglineImportPool;
}
