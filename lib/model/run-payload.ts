import { allocate, type AllocationResult } from "./allocation/allocate";
import { runsAfterAllocation } from "./allocation/after";
import { runModel, type RunResult } from "./network/run";
import type { ModelFile } from "./types";
import type { CalibrationRecord } from "../calibration/payload";

/** A stored run's result: DO under each design condition, and the allocation when there is one. */
export interface RunPayload {
  warnings: string[];
  /** Model runs: today's loads under each condition. Allocation runs: the allocated loads under each condition. */
  conditions: { name: string; run: RunResult }[];
  allocation?: AllocationResult;
  /** Calibration runs: the fit to a survey (lib/calibration/payload.ts); `conditions` then holds the fitted model's run. */
  calibration?: CalibrationRecord;
}

/**
 * Everything a run computes from its stored model files, pure: a model run runs each
 * condition's file; an allocation run allocates over its one file (its further conditions
 * inside, the file's own condition named as the scenario names it) and then runs every
 * condition with the allocated loads. `onProgress` hears the share done (0–1) as it goes.
 */
export function computeRunPayload(
  kind: "model" | "allocation",
  files: { name: string; file: ModelFile }[],
  warnings: string[],
  onProgress: (done: number) => void = () => {},
): RunPayload {
  if (kind === "model") {
    const conditions = files.map((f, i) => {
      const run = runModel(f.file);
      onProgress((i + 1) / files.length);
      return { name: f.name, run };
    });
    return { warnings, conditions };
  }
  const { name, file } = files[0];
  const allocation = allocate(file, { own_condition_name: name });
  onProgress(0.7);
  return { warnings, conditions: runsAfterAllocation(file, allocation, name), allocation };
}
