import { runModel } from "@/lib/model/network/run";
import type { RunPayload } from "@/lib/model/run-payload";
import type { ModelFile } from "@/lib/model/types";
import { calibrate, withParameters, type CalibrationResult, type FitEntry, type Observation } from "./calibrate";

/** Where a calibration's observations came from, recorded with the run. */
export interface CalibrationSurveyRecord {
  id: string;
  name: string;
  fileName: string;
  sha256: string;
  networkVersion: number;
  /** When the samples were taken (first and last time as written). */
  firstTime: string | null;
  lastTime: string | null;
}

/** What a calibration run is asked (stored in the run's inputs). */
export interface CalibrationSpec {
  survey: CalibrationSurveyRecord;
  /** The scenario condition whose flows and temperatures stand for the survey's day. */
  condition: string;
  observations: Observation[];
  fit: FitEntry[];
  /** Samples of the survey left out, and why (no DO value). */
  leftOut: { station: string; row: number; reason: string }[];
}

/** A calibration run's result beside the fitted model's DO (RunPayload.calibration). */
export interface CalibrationRecord extends CalibrationResult {
  survey: CalibrationSurveyRecord;
  condition: string;
  fit: FitEntry[];
  leftOut: CalibrationSpec["leftOut"];
}

/**
 * Everything a calibration run computes, pure: the fit (lib/calibration/calibrate.ts) on the
 * condition's model file, then the model run with the fitted values, so that the run's
 * profile, map and tables show the calibrated river. `onProgress` hears the share done.
 */
export function computeCalibrationPayload(file: { name: string; file: ModelFile }, spec: CalibrationSpec, warnings: string[], onProgress: (done: number) => void = () => {}): RunPayload {
  const result = calibrate(file.file, spec.observations, spec.fit, { onProgress: (i, limit) => onProgress(Math.min(0.9, i / limit)) });
  const fitted = withParameters(
    file.file,
    spec.fit,
    result.parameters.map((p) => p.value),
  );
  const run = runModel(fitted);
  onProgress(1);
  return {
    warnings: [...warnings, ...result.warnings],
    conditions: [{ name: file.name, run }],
    calibration: { ...result, survey: spec.survey, condition: spec.condition, fit: spec.fit, leftOut: spec.leftOut },
  };
}
