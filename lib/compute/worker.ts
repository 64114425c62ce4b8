/**
 * Worker-thread entry: runs model and allocation jobs off the server's event loop.
 * Messages in: ComputeRequest; out: ComputeResponse. Pure computation, no I/O.
 */
import { parentPort } from "node:worker_threads";
import { allocate } from "../model/allocation/allocate";
import { ModelInputError } from "../model/errors";
import { runModel } from "../model/network/run";
import type { ComputeRequest, ComputeResponse } from "./protocol";

function handle(req: ComputeRequest): ComputeResponse {
  try {
    const result = req.job.kind === "run" ? runModel(req.job.file) : allocate(req.job.file, req.job.options);
    return { id: req.id, ok: true, result };
  } catch (e) {
    const err = e instanceof Error ? e : new Error(String(e));
    return {
      id: req.id,
      ok: false,
      error: { name: err.name, message: err.message, ...(e instanceof ModelInputError ? { path: [...e.path] } : {}) },
    };
  }
}

if (!parentPort) throw new Error("lib/compute/worker.ts must be started as a worker thread");
const port = parentPort;
port.on("message", (req: ComputeRequest) => port.postMessage(handle(req)));
