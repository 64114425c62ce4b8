import type { Worker } from "node:worker_threads";
import { startWorker } from "./start-worker";

/** Why a job did not come back from its worker. */
export type PoolFailure = { kind: "failed"; message: string } | { kind: "exited"; code: number } | { kind: "timeout"; ms: number } | { kind: "closed" };

/** What a message from the worker means for its job: still going (undefined), a result, or an error. */
export type Outcome = { value: unknown } | { error: Error } | undefined;

export interface WorkerPoolSpec<Res extends { id: number }> {
  url: URL;
  size: number;
  /** Per-job limit in ms; past it the worker is terminated (and replaced on the next job). */
  timeoutMs: number;
  /** Reads a message addressed to a job; `observe` is that job's own listener (progress). */
  settle(res: Res, observe?: (res: Res) => void): Outcome;
  /** The error a job is rejected with when its worker fails, exits, runs out of time or the pool closes. */
  failure(f: PoolFailure): Error;
}

export interface WorkerPool<Job, Res> {
  submit(job: Job, observe?: (res: Res) => void): Promise<unknown>;
  /** Terminates every worker; queued jobs are rejected. */
  close(): Promise<void>;
}

interface Pending<Job, Res> {
  id: number;
  job: Job;
  observe?: (res: Res) => void;
  resolve: (v: unknown) => void;
  reject: (e: Error) => void;
}

/**
 * A few worker threads taking `{ id, job }` messages in turn: jobs queue when every worker
 * is busy, a worker that fails or exits is replaced on the next job, and a job past its time
 * limit has its worker terminated. Idle workers do not keep the process alive.
 */
export function createWorkerPool<Job, Res extends { id: number }>(spec: WorkerPoolSpec<Res>): WorkerPool<Job, Res> {
  const slots: Array<{ worker: Worker | null; busy: boolean }> = Array.from({ length: spec.size }, () => ({ worker: null, busy: false }));
  const queue: Pending<Job, Res>[] = [];
  let nextId = 1;
  let closed = false;

  const spawn = (): Worker => {
    const w = startWorker(spec.url);
    w.unref();
    return w;
  };

  const dispatch = () => {
    for (const slot of slots) {
      if (slot.busy || queue.length === 0) continue;
      const job = queue.shift() as Pending<Job, Res>;
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
      const onMessage = (res: Res) => {
        if (res.id !== job.id) return;
        const outcome = spec.settle(res, job.observe);
        if (!outcome) return;
        finish();
        if ("error" in outcome) job.reject(outcome.error);
        else job.resolve(outcome.value);
      };
      const onError = (e: Error) => {
        slot.worker = null;
        finish();
        job.reject(spec.failure({ kind: "failed", message: e.message }));
      };
      const onExit = (code: number) => {
        slot.worker = null;
        finish();
        job.reject(spec.failure({ kind: "exited", code }));
      };
      const timer = setTimeout(() => {
        worker.off("exit", onExit);
        slot.worker = null;
        void worker.terminate();
        finish();
        job.reject(spec.failure({ kind: "timeout", ms: spec.timeoutMs }));
      }, spec.timeoutMs);
      worker.on("message", onMessage);
      worker.on("error", onError);
      worker.on("exit", onExit);
      worker.postMessage({ id: job.id, job: job.job });
    }
  };

  return {
    submit: (job, observe) =>
      new Promise<unknown>((resolve, reject) => {
        if (closed) return reject(spec.failure({ kind: "closed" }));
        queue.push({ id: nextId++, job, observe, resolve, reject });
        dispatch();
      }),
    async close() {
      closed = true;
      for (const p of queue.splice(0)) p.reject(spec.failure({ kind: "closed" }));
      await Promise.all(slots.map((s) => s.worker?.terminate()));
      slots.forEach((s) => (s.worker = null));
    },
  };
}
