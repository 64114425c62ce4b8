import { NextResponse } from "next/server";
import { z } from "zod";
import { isDatabaseUnavailable, noteDatabaseDown } from "@/db/client";
import { AppError, type FieldIssue } from "@/lib/errors";

/** zod issues → `{ path, message }` with dotted paths ("" becomes "body"). */
export function fieldIssues(error: z.ZodError, root = "body"): FieldIssue[] {
  return error.issues.map((i) => ({ path: i.path.length ? i.path.join(".") : root, message: i.message }));
}

export function errorResponse(error: unknown): NextResponse {
  if (error instanceof AppError) {
    return NextResponse.json(
      { error: { code: error.code, message: error.message, ...(error.details ? { details: error.details } : {}) } },
      { status: error.status },
    );
  }
  // PostgreSQL down or restarting: not the caller's fault and worth trying again
  // shortly. Logged once per outage (db/client), not once per request.
  if (isDatabaseUnavailable(error)) {
    noteDatabaseDown("api", error);
    return NextResponse.json(
      { error: { code: "unavailable", message: "The database is not reachable right now; try again in a minute" } },
      { status: 503, headers: { "retry-after": "10" } },
    );
  }
  // Unexpected: log it here, once, and tell the caller nothing internal.
  console.error("[api] unexpected error", error);
  return NextResponse.json({ error: { code: "internal", message: "Something went wrong on the server" } }, { status: 500 });
}

export function invalid(error: z.ZodError, what: string, root?: string): AppError {
  const details = fieldIssues(error, root);
  const first = details[0];
  return new AppError("invalid", `Invalid ${what}: ${first.path} — ${first.message}`, details);
}
