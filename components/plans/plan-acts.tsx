"use client";
import { ApiError } from "@/lib/queries/fetcher";

/**
 * What the server said when a plan action (a mutation from lib/queries) failed, for a form
 * that shows `fields` beside its inputs: each field's message, and the general message when
 * none of those fields was named (so nothing the server said is lost or said twice).
 */
export function serverMessages(error: Error | null, fields: readonly string[]) {
  if (!error) return { field: {} as Record<string, string>, general: null };
  const named: Record<string, string> = {};
  if (error instanceof ApiError) for (const d of error.details ?? []) named[d.path] ??= d.message;
  const field = Object.fromEntries(fields.filter((f) => named[f]).map((f) => [f, named[f]]));
  return { field, general: Object.keys(field).length === 0 ? error.message : null };
}

/** A message from the server under a field or a form. */
export function FieldMessage({ text, id }: { text: string | null | undefined; id?: string }) {
  if (!text) return null;
  return (
    <p className="field-error" role="alert" id={id}>
      {text}
    </p>
  );
}
