import { computeCalibrationPayload } from "../calibration/payload";
import { computeRunPayload, type RunPayload } from "../model/run-payload";
import type { ComputeJob } from "./protocol";

export type StoredRunJob = Omit<Extract<ComputeJob, { kind: "payload" }>, "kind">;

/** Everything a stored run computes from its inputs, by its kind: model and allocation runs (lib/model/run-payload), calibrations (lib/calibration/payload). Pure. */
export function storedRunPayload(job: StoredRunJob, onProgress: (done: number) => void = () => {}): RunPayload {
  if (job.runKind === "calibration") {
    if (!job.calibration) throw new Error("A calibration run's inputs hold no calibration");
    return computeCalibrationPayload(job.files[0], job.calibration, job.warnings, onProgress);
  }
  return computeRunPayload(job.runKind, job.files, job.warnings, onProgress);
}
