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

/** Bytes handed to the socket per step of a streamed body: small enough to let other requests run between steps. */
const STREAM_SLICE = 256 * 1024;

/**
 * A response whose body is already-encoded bytes, sent as a stream of slices (views, no
 * copies): a body of many megabytes is neither concatenated nor written in one step on the
 * event loop.
 */
export function bytesResponse(parts: readonly Uint8Array[], contentType: string, init: ResponseInit = {}): Response {
  let part = 0;
  let at = 0;
  const body = new ReadableStream<Uint8Array>({
    pull(controller) {
      while (part < parts.length && at >= parts[part].byteLength) [part, at] = [part + 1, 0];
      if (part === parts.length) return controller.close();
      const piece = parts[part].subarray(at, at + STREAM_SLICE);
      at += piece.byteLength;
      controller.enqueue(piece);
    },
  });
  const headers = new Headers(init.headers);
  headers.set("content-type", contentType);
  headers.set("content-length", String(parts.reduce((n, p) => n + p.byteLength, 0)));
  return new Response(body, { ...init, headers });
}
