"use client";
import { useState } from "react";
import { ApiError } from "@/lib/queries/fetcher";
import { usePlanAction } from "@/lib/queries/plans";

export type Act = (path: string, json?: unknown, method?: string) => Promise<boolean>;

/** The last action that failed: where it was sent, its message, and the server's message per field. */
export interface ActFailure {
  path: string;
  method: string;
  message: string;
  fields: Record<string, string>;
}

/**
 * Plan actions (review, comments, responses) with the last failure; `act` resolves to whether
 * it worked. A form finds its own failure by path and method and shows the field messages
 * next to its fields.
 */
export function usePlanActs(basinId: string, planId: string): { act: Act; failure: ActFailure | null } {
  const action = usePlanAction(basinId, planId);
  const [failure, setFailure] = useState<ActFailure | null>(null);
  const act: Act = async (path, json, method = "POST") => {
    setFailure(null);
    try {
      await action.mutateAsync({ path, json, method });
      return true;
    } catch (e) {
      const fields: Record<string, string> = {};
      if (e instanceof ApiError) for (const d of e.details ?? []) fields[d.path] ??= d.message;
      setFailure({ path, method, message: e instanceof Error ? e.message : String(e), fields });
      return false;
    }
  };
  return { act, failure };
}

/**
 * What the server said about the last failed action sent to `path` with `method`, for a form
 * that shows `fields` beside its inputs: each field's message, and the general message when
 * none of those fields was named (so nothing the server said is lost or said twice).
 */
export function failureFor(failure: ActFailure | null, path: string, method: string, fields: readonly string[]) {
  if (!failure || failure.path !== path || failure.method !== method) return { field: {} as Record<string, string>, general: null };
  const field = Object.fromEntries(fields.filter((f) => failure.fields[f]).map((f) => [f, failure.fields[f]]));
  return { field, general: Object.keys(field).length === 0 ? failure.message : null };
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

