/** Error codes Sagline returns, each with its HTTP status. */
export const ERROR_STATUS = {
  bad_request: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  unsupported_media_type: 415,
  invalid: 422,
  internal: 500,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;

/** One problem with one input field; `path` is the dotted field path. */
export interface FieldIssue {
  path: string;
  message: string;
}

/** A failure a caller can act on; turned into `{ error: { code, message, details } }`. */
export class AppError extends Error {
  readonly code: ErrorCode;
  readonly details?: unknown;

  constructor(code: ErrorCode, message: string, details?: unknown) {
    super(message);
    this.name = "AppError";
    this.code = code;
    this.details = details;
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }
}

export const notFound = (what: string) => new AppError("not_found", `${what} was not found`);
export const forbidden = (message = "You do not have permission to do this") => new AppError("forbidden", message);
export const unauthenticated = () => new AppError("unauthenticated", "Sign in to continue");
export const conflict = (message: string, details?: unknown) => new AppError("conflict", message, details);
