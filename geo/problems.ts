import type { Geometry } from "geojson";

/** Every problem the import validation can report. */
export type ProblemCode =
  | "empty_layer"
  | "wrong_geometry_type"
  | "missing_geometry"
  | "coordinates_invalid"
  | "coordinates_out_of_range"
  | "zero_length"
  | "self_crossing"
  | "multipart_disconnected"
  | "missing_value"
  | "invalid_number"
  | "negative_value"
  | "invalid_email"
  | "duplicate_id"
  | "disconnected_parts"
  | "closed_loop"
  | "braid"
  | "loop"
  | "gap"
  | "ends_mid_reach"
  | "reach_reversed"
  | "downstream_id_unknown"
  | "downstream_id_mismatch"
  | "reach_too_long"
  | "length_override_differs"
  | "outlet_invalid"
  | "outlet_uncertain"
  | "datum_shift_approximate"
  | "text_encoding_invalid"
  | "discharger_too_far"
  | "discharger_reassigned"
  | "reassign_unknown_reach";

export type Severity = "error" | "warning";

/**
 * One finding of the validation. Errors block a commit; warnings don't.
 * `features` names the reaches (by id) or dischargers (by permit id) at fault, or the
 * file position ("feature 3", "row 7") when the id itself is missing.
 */
export interface Problem {
  code: ProblemCode;
  severity: Severity;
  message: string;
  features: string[];
  field?: string;
  /** WGS84 geometry to highlight on the map. */
  geometry?: Geometry;
}

export const problem = (
  severity: Severity,
  code: ProblemCode,
  message: string,
  features: string[],
  extra: Pick<Problem, "field" | "geometry"> = {},
): Problem => ({ code, severity, message, features, ...extra });

export const error = (code: ProblemCode, message: string, features: string[], extra?: Pick<Problem, "field" | "geometry">) =>
  problem("error", code, message, features, extra);

export const warning = (code: ProblemCode, message: string, features: string[], extra?: Pick<Problem, "field" | "geometry">) =>
  problem("warning", code, message, features, extra);

/** "A, B, C" or "A, B, … and 7 more" for messages that name many features. */
export function nameList(names: readonly string[], max = 10): string {
  if (names.length <= max) return names.join(", ");
  return `${names.slice(0, max).join(", ")} and ${names.length - max} more`;
}

/**
 * Appends `items` to `target` one by one. `target.push(...items)` passes every item as an
 * argument and overflows the call stack past ~100k items (a 200k-row CSV did).
 */
export function appendAll<T>(target: T[], ...lists: ReadonlyArray<readonly T[]>): void {
  for (const items of lists) for (const item of items) target.push(item);
}
