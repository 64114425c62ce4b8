import { createRequire } from "node:module";
import { dirname, join } from "node:path";
import { pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";
import { ModelInputError } from "../model/errors";
import type { AllocationResult } from "../model/allocation/allocate";
import type { RunResult } from "../model/network/run";
import type { ModelFile } from "../model/types";
import type { ComputeJob, ComputeRequest, ComputeResponse, SerializedError } from "./protocol";

/** A job failed inside the worker for a reason other than bad input. */
export class ComputeError extends Error {
  constructor(message: string, name = "ComputeError") {
    super(message);
    this.name = name;
  }
}

/** A job ran past its time limit; its worker was terminated and will be replaced. */
export class ComputeTimeoutError extends Error {
  constructor(ms: number) {
    super(`the computation did not finish within ${ms} ms`);
    this.name = "ComputeTimeoutError";
  }
}

export interface ComputePoolOptions {
  /** Worker threads. Default 1 (solves are CPU-bound; the server keeps the rest). */
  size?: number;
  /** Per-job limit in ms; the worker is terminated when it is exceeded. Default 60 000. */
  timeoutMs?: number;
  /** Worker entry. Default: worker.ts beside this file (or worker.js in a compiled build). */
  workerUrl?: URL;
}

export interface ComputePool {
  run(file: ModelFile): Promise<RunResult>;
  allocate(file: ModelFile, options?: Extract<ComputeJob, { kind: "allocate" }>["options"]): Promise<AllocationResult>;
  /** Terminates every worker; pending jobs are rejected. */
  close(): Promise<void>;
}

function revive(e: SerializedError): Error {
  if (e.name === "ModelInputError" && e.path) return new ModelInputError(e.path, e.message.slice(e.message.indexOf(": ") + 2));
  return new ComputeError(e.message, e.name);
}

/**
 * Starts a worker on `url`. A .ts entry (running from sources under tsx or vitest) is
 * started through a small bootstrap that registers tsx's ESM loader inside the worker
 * first: Node 20 does not apply an `--import` loader from execArgv to a worker's entry.
 */
export function startWorker(url: URL): Worker {
  if (!url.pathname.endsWith(".ts")) return new Worker(url);
  // Resolved at run time from the project folder: a bundler turns a literal
  // `require.resolve("tsx/…")` into its own module id (seen in the Next.js build).
  const tsxManifest = ["tsx", "package.json"].join("/");
  const tsxDir = dirname(createRequire(pathToFileURL(join(process.cwd(), "package.json")).href).resolve(tsxManifest));
  const api = pathToFileURL(join(tsxDir, "dist/esm/api/index.mjs")).href;
  const code = `import(${JSON.stringify(api)}).then((m) => { m.register(); return import(${JSON.stringify(url.href)}); });`;
  return new Worker(code, { eval: true });
}

interface Slot {
  worker: Worker | null;
  busy: boolean;
}

interface Pending {
  id: number;
  job: ComputeJob;
  resolve: (v: unknown) => void;
  reject: (e: Error) => void;
}

/**
 * A small pool of worker threads that run model and allocation jobs so that a request
 * handler never blocks the event loop on an LP. Jobs queue when every worker is busy.
 * Example: `const pool = createComputePool(); const run = await pool.run(file); await pool.close();`
 */
export function createComputePool(options: ComputePoolOptions = {}): ComputePool {
  const size = options.size ?? 1;
  const timeoutMs = options.timeoutMs ?? 60_000;
  const ext = import.meta.url.endsWith(".ts") ? "ts" : "js";
  const url = options.workerUrl ?? new URL(`./worker.${ext}`, import.meta.url);
  const slots: Slot[] = Array.from({ length: size }, () => ({ worker: null, busy: false }));
  const queue: Pending[] = [];
  let nextId = 1;
  let closed = false;

  const spawn = (): Worker => {
    const w = startWorker(url);
    w.unref();
    return w;
  };

  const dispatch = () => {
    for (const slot of slots) {
      if (slot.busy || queue.length === 0) continue;
      const job = queue.shift() as Pending;
      slot.busy = true;
      const worker = (slot.worker ??= spawn());
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
      const onMessage = (res: ComputeResponse) => {
        if (res.id !== job.id) return;
        finish();
        if (res.ok) job.resolve(res.result);
        else job.reject(revive(res.error));
      };
      const onError = (e: Error) => {
        slot.worker = null;
        finish();
        job.reject(new ComputeError(`the compute worker failed: ${e.message}`));
      };
      const onExit = (code: number) => {
        slot.worker = null;
        finish();
        job.reject(new ComputeError(`the compute worker exited (code ${code})`));
      };
      const timer = setTimeout(() => {
        worker.off("exit", onExit);
        slot.worker = null;
        void worker.terminate();
        finish();
        job.reject(new ComputeTimeoutError(timeoutMs));
      }, timeoutMs);
      worker.on("message", onMessage);
      worker.on("error", onError);
      worker.on("exit", onExit);
      worker.postMessage({ id: job.id, job: job.job } satisfies ComputeRequest);
    }
  };

  const submit = (job: ComputeJob) =>
    new Promise<unknown>((resolve, reject) => {
      if (closed) return reject(new ComputeError("the compute pool is closed"));
      queue.push({ id: nextId++, job, resolve, reject });
      dispatch();
    });

  return {
    run: (file) => submit({ kind: "run", file }) as Promise<RunResult>,
    allocate: (file, opts) => submit({ kind: "allocate", file, options: opts }) as Promise<AllocationResult>,
    async close() {
      closed = true;
      for (const p of queue.splice(0)) p.reject(new ComputeError("the compute pool is closed"));
      await Promise.all(slots.map((s) => s.worker?.terminate()));
      slots.forEach((s) => (s.worker = null));
    },
  };
}
