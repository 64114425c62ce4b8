import { encode } from "next-auth/jwt";
import { NextRequest } from "next/server";

type Handler = (req: NextRequest, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

export interface CallOptions {
  /** Signed-in user id; omit for a signed-out request. */
  userId?: string;
  params?: Record<string, string>;
  /** A value to send as JSON, or a raw string sent as is. */
  body?: unknown;
  /** Query-string parameters. */
  query?: Record<string, string>;
  /**
   * Extra request headers; null leaves a default out. A write is sent the way
   * Sagline's own pages send it (Host, Origin and Sec-Fetch-Site of the app).
   */
  headers?: Record<string, string | null>;
}

/**
 * Call a route handler in-process the way Next.js would: a real NextRequest
 * with a real next-auth session cookie (a JWT signed with NEXTAUTH_SECRET).
 */
export async function callRoute(
  handler: Handler,
  method: string,
  { userId, params = {}, body, query, headers: extra }: CallOptions = {},
): Promise<{ status: number; json: unknown; headers: Headers }> {
  const url = new URL("http://127.0.0.1/api/test");
  const headers = new Headers({ host: url.host });
  if (method !== "GET" && method !== "HEAD") {
    headers.set("origin", url.origin);
    headers.set("sec-fetch-site", "same-origin");
  }
  for (const [k, v] of Object.entries(extra ?? {})) {
    if (v === null) headers.delete(k);
    else headers.set(k, v);
  }
  if (userId) {
    const token = await encode({ token: { sub: userId }, secret: process.env.NEXTAUTH_SECRET! });
    headers.set("cookie", `next-auth.session-token=${token}`);
  }
  let payload: string | FormData | undefined;
  if (body instanceof FormData) {
    payload = body;
  } else if (body !== undefined) {
    payload = typeof body === "string" ? body : JSON.stringify(body);
    headers.set("content-type", "application/json");
  }
  for (const [k, v] of Object.entries(query ?? {})) url.searchParams.set(k, v);
  const req = new NextRequest(url, { method, headers, body: payload });
  const res = await handler(req, { params: Promise.resolve(params) });
  const text = await res.text();
  const json = (res.headers.get("content-type") ?? "").includes("json") && text ? JSON.parse(text) : text || null;
  return { status: res.status, json, headers: res.headers };
}
