/** Off-the-event-loop computation for the server (node:worker_threads). */
export { ComputeError, ComputeTimeoutError, createComputePool, type ComputePool, type ComputePoolOptions } from "./pool";
export type { ComputeJob } from "./protocol";
