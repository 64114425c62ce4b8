/** A path into the model file, as zod reports it: `["dischargers", 2, "km"]`. */
export type FieldPath = ReadonlyArray<string | number>;

/**
 * Bad model input that the schema alone cannot catch (a cycle, a discharger beyond its
 * reach, a reach without flow). Carries the field path so the CLI and the API can name the
 * offending field exactly as a zod error would.
 */
export class ModelInputError extends Error {
  readonly path: FieldPath;

  constructor(path: FieldPath, message: string) {
    super(`${formatPath(path)}: ${message}`);
    this.name = "ModelInputError";
    this.path = path;
  }
}

/**
 * The one formatter of a field path, for model errors and zod issues alike (the API's
 * model-file issues, the CLIs): `["dischargers", 2, "km"]` → `dischargers[2].km`; an empty
 * path reads `empty` (default `(model)`, the whole file).
 */
export function formatPath(path: ReadonlyArray<PropertyKey>, empty = "(model)"): string {
  let out = "";
  for (const part of path) {
    if (typeof part === "number") out += `[${part}]`;
    else out += out === "" ? String(part) : `.${String(part)}`;
  }
  return out === "" ? empty : out;
}

// The field path is `path` followed by `key` when given; it is only built when throwing,
// so that validating a 10 000-reach network allocates nothing.
const at = (path: FieldPath, key?: string | number): FieldPath => (key === undefined ? path : [...path, key]);

/** Throws a ModelInputError (at `path`/`key`) unless `value` is a finite number. */
export function requireFinite(value: number, path: FieldPath, key?: string | number): number {
  if (!Number.isFinite(value)) throw new ModelInputError(at(path, key), `must be a finite number (got ${value})`);
  return value;
}

/** Throws a ModelInputError (at `path`/`key`) unless `value` is finite and > 0. */
export function requirePositive(value: number, path: FieldPath, key?: string | number): number {
  requireFinite(value, path, key);
  if (value <= 0) throw new ModelInputError(at(path, key), `must be greater than zero (got ${value})`);
  return value;
}

/** Throws a ModelInputError (at `path`/`key`) unless `value` is finite and ≥ 0. */
export function requireNonNegative(value: number, path: FieldPath, key?: string | number): number {
  requireFinite(value, path, key);
  if (value < 0) throw new ModelInputError(at(path, key), `must not be negative (got ${value})`);
  return value;
}
