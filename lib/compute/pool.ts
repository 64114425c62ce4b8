import { ModelInputError } from "../model/errors";
import type { AllocationResult } from "../model/allocation/allocate";
import type { RunResult } from "../model/network/run";
import type { RunPayload } from "../model/run-payload";
import type { ModelFile } from "../model/types";
import type { ComputeJob, ComputeResponse, SerializedError } from "./protocol";
import { createWorkerPool } from "./worker-pool";

/** A job failed inside the worker for a reason other than bad input. */
export class ComputeError extends Error {
  constructor(message: string, name = "ComputeError") {
    super(message);
    this.name = name;
  }
}

/** A job ran past its time limit; its worker was terminated and will be replaced. */
export class ComputeTimeoutError extends Error {
  constructor(readonly ms: number) {
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
  /** Everything a stored run computes (lib/model/run-payload), with its progress (0–1). */
  payload(job: Omit<Extract<ComputeJob, { kind: "payload" }>, "kind">, onProgress?: (done: number) => void): Promise<RunPayload>;
  /** Terminates every worker; pending jobs are rejected. */
  close(): Promise<void>;
}

function revive(e: SerializedError): Error {
  if (e.name === "ModelInputError" && e.path) return new ModelInputError(e.path, e.message.slice(e.message.indexOf(": ") + 2));
  const err = new ComputeError(e.message, e.name);
  if (e.stack) err.stack = `${e.name}: ${e.message}\n    (in the compute worker)\n${e.stack.split("\n").slice(1).join("\n")}`;
  return err;
}

/**
 * A small pool of worker threads that run model and allocation jobs so that a request
 * handler never blocks the event loop on an LP. Jobs queue when every worker is busy.
 * Example: `const pool = createComputePool(); const run = await pool.run(file); await pool.close();`
 */
export function createComputePool(options: ComputePoolOptions = {}): ComputePool {
  const timeoutMs = options.timeoutMs ?? 60_000;
  const ext = import.meta.url.endsWith(".ts") ? "ts" : "js";
  const pool = createWorkerPool<ComputeJob, ComputeResponse>({
    url: options.workerUrl ?? new URL(`./worker.${ext}`, import.meta.url),
    size: options.size ?? 1,
    timeoutMs,
    settle: (res, observe) => {
      if ("progress" in res) {
        observe?.(res);
        return undefined;
      }
      return res.ok ? { value: res.result } : { error: revive(res.error) };
    },
    failure: (f) => {
      if (f.kind === "timeout") return new ComputeTimeoutError(f.ms);
      if (f.kind === "closed") return new ComputeError("the compute pool is closed");
      return new ComputeError(f.kind === "failed" ? `the compute worker failed: ${f.message}` : `the compute worker exited (code ${f.code})`);
    },
  });
  return {
    run: (file) => pool.submit({ kind: "run", file }) as Promise<RunResult>,
    allocate: (file, opts) => pool.submit({ kind: "allocate", file, options: opts }) as Promise<AllocationResult>,
    payload: (job, onProgress) =>
      pool.submit({ kind: "payload", ...job }, (res) => {
        if ("progress" in res) onProgress?.(res.progress);
      }) as Promise<RunPayload>,
    close: pool.close,
  };
}
