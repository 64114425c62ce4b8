/**
 * Worker-thread entry: runs model, allocation and calibration jobs off the event loop of the process
 * that asked (the web server or the background worker). Messages in: ComputeRequest; out:
 * ComputeResponse (progress messages first for a payload job). Pure computation, no I/O.
 */
import { parentPort } from "node:worker_threads";
import { allocate } from "../model/allocation/allocate";
import { ModelInputError } from "../model/errors";
import { runModel } from "../model/network/run";
import { storedRunPayload } from "./stored-run";
import type { ComputeRequest, ComputeResponse } from "./protocol";

function handle(req: ComputeRequest, progress: (done: number) => void): ComputeResponse {
  try {
    const job = req.job;
    const result =
      job.kind === "run" ? runModel(job.file) : job.kind === "allocate" ? allocate(job.file, job.options) : storedRunPayload(job, progress);
    return { id: req.id, ok: true, result };
  } catch (e) {
    const err = e instanceof Error ? e : new Error(String(e));
    return {
      id: req.id,
      ok: false,
      error: { name: err.name, message: err.message, ...(e instanceof ModelInputError ? { path: [...e.path] } : { stack: err.stack }) },
    };
  }
}

if (!parentPort) throw new Error("lib/compute/worker.ts must be started as a worker thread");
const port = parentPort;
port.on("message", (req: ComputeRequest) => port.postMessage(handle(req, (done) => port.postMessage({ id: req.id, progress: done } satisfies ComputeResponse))));
