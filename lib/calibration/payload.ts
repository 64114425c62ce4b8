import { runModel } from "@/lib/model/network/run";
import type { RunPayload } from "@/lib/model/run-payload";
import type { ModelFile } from "@/lib/model/types";
import { calibrate, validate, withParameters, type CalibrationResult, type FitEntry, type Observation } from "./calibrate";

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
  /** The fitted set's name, as the planner gave it (else the survey's name on the condition). */
  name?: string;
  survey: CalibrationSurveyRecord;
  /** The scenario condition whose flows and temperatures stand for the survey's day. */
  condition: string;
  observations: Observation[];
  fit: FitEntry[];
  /** Samples of the survey left out, and why (no DO value). */
  leftOut: { station: string; row: number; reason: string }[];
  /** A second survey the fitted model is checked against, without refitting. */
  validation?: { survey: CalibrationSurveyRecord; observations: Observation[]; leftOut: { station: string; row: number; reason: string }[] };
}

/** The fitted model against the second survey: the same statistics, nothing refitted. */
export type ValidationRecord = ReturnType<typeof validate> & { survey: CalibrationSurveyRecord; leftOut: CalibrationSpec["leftOut"] };

/** A calibration run's result beside the fitted model's DO (RunPayload.calibration). */
export interface CalibrationRecord extends CalibrationResult {
  name?: string;
  survey: CalibrationSurveyRecord;
  condition: string;
  fit: FitEntry[];
  leftOut: CalibrationSpec["leftOut"];
  validation?: ValidationRecord;
}

/**
 * Everything a calibration run computes, pure: the fit (lib/calibration/calibrate.ts) on the
 * condition's model file, then the model run with the fitted values, so that the run's
 * profile, map and tables show the calibrated river, and (when asked) the fitted model's
 * statistics against a second survey on the same condition, without refitting. `onProgress` hears the share done.
 */
export function computeCalibrationPayload(file: { name: string; file: ModelFile }, spec: CalibrationSpec, warnings: string[], onProgress: (done: number) => void = () => {}): RunPayload {
  const result = calibrate(file.file, spec.observations, spec.fit, { onProgress: (i, limit) => onProgress(Math.min(0.9, i / limit)) });
  const fitted = withParameters(
    file.file,
    spec.fit,
    result.parameters.map((p) => p.value),
  );
  const run = runModel(fitted);
  const validation = spec.validation ? { ...validate(fitted, spec.validation.observations), survey: spec.validation.survey, leftOut: spec.validation.leftOut } : undefined;
  onProgress(1);
  return {
    warnings: [...warnings, ...result.warnings],
    conditions: [{ name: file.name, run }],
    calibration: { ...result, ...(spec.name ? { name: spec.name } : {}), survey: spec.survey, condition: spec.condition, fit: spec.fit, leftOut: spec.leftOut, ...(validation ? { validation } : {}) },
  };
}
