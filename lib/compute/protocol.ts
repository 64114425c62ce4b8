import type { AllocateOptions } from "../model/allocation/allocate";
import type { ModelFile } from "../model/types";
import type { CalibrationSpec } from "../calibration/payload";

/** A job for the compute worker: one model run, one allocation, or everything a stored run computes. */
export type ComputeJob =
  | { kind: "run"; file: ModelFile }
  | { kind: "allocate"; file: ModelFile; options?: Omit<AllocateOptions, "inspect_lp"> }
  | { kind: "payload"; runKind: "model" | "allocation" | "calibration"; files: { name: string; file: ModelFile }[]; warnings: string[]; calibration?: CalibrationSpec };

/** An error as it crosses the thread boundary. */
export interface SerializedError {
  name: string;
  message: string;
  /** Field path of a ModelInputError. */
  path?: Array<string | number>;
  /** The worker's stack of an unexpected error (not of bad input), for the operator's log. */
  stack?: string;
}

export type ComputeRequest = { id: number; job: ComputeJob };
export type ComputeResponse =
  | { id: number; ok: true; result: unknown }
  | { id: number; ok: false; error: SerializedError }
  /** A payload job's share done so far (0–1), before its result. */
  | { id: number; progress: number };
