import { join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import type { Worker } from "node:worker_threads";
import type { ImportErrorData, ImportJob, ImportRequest, ImportResponse, ImportStage, ReadResult, ValidateResult } from "./import-protocol";
import { startWorker } from "./pool";

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

interface Pending {
  id: number;
  job: ImportJob;
  onProgress?: ProgressListener;
  resolve: (v: unknown) => void;
  reject: (e: Error) => void;
}

/**
 * Worker threads for reading uploads and validating imports, so that a large upload never
 * stalls the web server. Jobs queue when every worker is busy; a job past `timeoutMs` has its
 * worker terminated (and replaced on the next job).
 */
export function createImportPool(options: { size?: number; timeoutMs?: number } = {}): ImportPool {
  const size = options.size ?? 1;
  const timeoutMs = options.timeoutMs ?? 300_000;
  const url = workerUrl();
  const slots: Array<{ worker: Worker | null; busy: boolean }> = Array.from({ length: size }, () => ({ worker: null, busy: false }));
  const queue: Pending[] = [];
  let nextId = 1;
  let closed = false;

  const dispatch = () => {
    for (const slot of slots) {
      if (slot.busy || queue.length === 0) continue;
      const job = queue.shift() as Pending;
      slot.busy = true;
      const worker = (slot.worker ??= startWorker(url));
      worker.ref();
      const finish = () => {
        clearTimeout(timer);
        worker.off("message", onMessage);
        worker.off("error", onError);
        worker.off("exit", onExit);
        worker.unref();
        slot.busy = false;
        dispatch();
      };
      const onMessage = (res: ImportResponse) => {
        if (res.id !== job.id) return;
        if (res.type === "progress") return job.onProgress?.(res.stage, res.fraction);
        finish();
        if (res.type === "done") job.resolve(res.result);
        else job.reject(new ImportJobError(res.error));
      };
      const onError = (e: Error) => {
        slot.worker = null;
        finish();
        job.reject(new Error(`the import worker failed: ${e.message}`));
      };
      const onExit = (code: number) => {
        slot.worker = null;
        finish();
        job.reject(new Error(`the import worker exited (code ${code})`));
      };
      const timer = setTimeout(() => {
        worker.off("exit", onExit);
        slot.worker = null;
        void worker.terminate();
        finish();
        job.reject(new ImportJobError({ name: "ImportTimeout", code: "import_timeout", message: `The import took longer than ${Math.round(timeoutMs / 1000)} s and was stopped` }));
      }, timeoutMs);
      worker.on("message", onMessage);
      worker.on("error", onError);
      worker.on("exit", onExit);
      worker.postMessage({ id: job.id, job: job.job } satisfies ImportRequest);
    }
  };

  const submit = (job: ImportJob, onProgress?: ProgressListener) =>
    new Promise<unknown>((resolve, reject) => {
      if (closed) return reject(new Error("the import pool is closed"));
      queue.push({ id: nextId++, job, onProgress, resolve, reject });
      dispatch();
    });

  return {
    read: (job) => submit(job) as Promise<ReadResult>,
    validate: (job, onProgress) => submit(job, onProgress) as Promise<ValidateResult>,
    async close() {
      closed = true;
      for (const p of queue.splice(0)) p.reject(new Error("the import pool is closed"));
      await Promise.all(slots.map((s) => s.worker?.terminate()));
      slots.forEach((s) => (s.worker = null));
    },
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
