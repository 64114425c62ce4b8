/** The `error` member of a Sagline API error body. */
export type ErrorBody = { error: { code: string; message: string; details?: { path: string; message: string; code?: string }[] } };
export const err = (json: unknown) => (json as ErrorBody).error;
