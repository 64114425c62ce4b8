import NextAuth from "next-auth";
import type { NextRequest } from "next/server";
import { authOptions } from "@/lib/auth/options";
import { RATE_LIMITED_PREFIX, signInRetryAt } from "@/lib/auth/sign-in-errors";

const handler = NextAuth(authOptions);

type Ctx = { params: Promise<{ nextauth: string[] }> };

/**
 * next-auth answers a refused credentials sign-in with 401 and the error in
 * the redirect URL; a rate-limited one is turned into 429 with Retry-After
 * (same body, so next-auth's client still reads the error and the sign-in
 * page says when to try again).
 */
async function post(req: NextRequest, ctx: Ctx): Promise<Response> {
  const res: Response = await handler(req, ctx);
  if (!req.nextUrl.pathname.endsWith("/callback/credentials")) return res;
  const target = res.headers.get("location") ?? (await readUrl(res.clone()));
  const error = target ? safeErrorParam(target) : null;
  const retryAt = error?.startsWith(RATE_LIMITED_PREFIX) ? signInRetryAt(error) : null;
  if (!retryAt) return res;
  const headers = new Headers(res.headers);
  headers.set("retry-after", String(Math.max(1, Math.ceil((retryAt.getTime() - Date.now()) / 1000))));
  return new Response(res.body, { status: 429, headers });
}

async function readUrl(res: Response): Promise<string | null> {
  if (!(res.headers.get("content-type") ?? "").includes("json")) return null;
  try {
    const body = (await res.json()) as { url?: unknown };
    return typeof body.url === "string" ? body.url : null;
  } catch {
    return null;
  }
}

function safeErrorParam(target: string): string | null {
  try {
    return new URL(target, "http://localhost").searchParams.get("error");
  } catch {
    return null;
  }
}

export { handler as GET, post as POST };
