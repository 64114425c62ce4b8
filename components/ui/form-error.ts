import { ApiError } from "@/lib/queries/fetcher";

/** Put an API error's field details onto a react-hook-form; returns the message for the rest. */
export function applyApiError(
  error: unknown,
  setError: (name: never, e: { type: string; message: string }) => void,
  fields: readonly string[],
): string {
  if (error instanceof ApiError) {
    let unplaced = false;
    for (const d of error.details ?? []) {
      if (fields.includes(d.path)) setError(d.path as never, { type: "server", message: d.message });
      else unplaced = true;
    }
    return unplaced || !error.details?.length ? error.message : "";
  }
  return error instanceof Error ? error.message : "Something went wrong";
}
