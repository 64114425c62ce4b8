import type { AllocateOptions } from "../model/allocation/allocate";
import type { ModelFile } from "../model/types";

/** A job for the compute worker. */
export type ComputeJob = { kind: "run"; file: ModelFile } | { kind: "allocate"; file: ModelFile; options?: Omit<AllocateOptions, "inspect_lp"> };

/** An error as it crosses the thread boundary (stack traces stay in the worker). */
export interface SerializedError {
  name: string;
  message: string;
  /** Field path of a ModelInputError. */
  path?: Array<string | number>;
}

export type ComputeRequest = { id: number; job: ComputeJob };
export type ComputeResponse = { id: number; ok: true; result: unknown } | { id: number; ok: false; error: SerializedError };
