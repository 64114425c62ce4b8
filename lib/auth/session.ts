import "server-only";
import { LRUCache } from "lru-cache";
import { getServerSession } from "next-auth";
import { decode, getToken, type JWT, type JWTDecodeParams } from "next-auth/jwt";
import type { NextRequest } from "next/server";
import { cache } from "react";
import { getDb } from "@/db/client";
import { loadActor, type Actor } from "./guard";
import { authOptions } from "./options";

/**
 * Decoded session tokens by their text, until each one's own expiry. A token is
 * encrypted and authenticated with the server's secret, so the same text always
 * decodes to the same claims; decoding (key derivation and AES-GCM) is the
 * costliest step of a signed-in read, and the claims say only who — whether
 * that account and session are still good is read from the database on every
 * request (loadActor's session-version check), cached or not.
 */
const decoded = new LRUCache<string, JWT>({ max: 10_000, ttlAutopurge: false });

async function cachedDecode(params: JWTDecodeParams): Promise<JWT | null> {
  const key = `${params.secret}\u0000${params.token ?? ""}`;
  const hit = decoded.get(key);
  if (hit) return hit;
  const claims = await decode(params);
  const expiresMs = typeof claims?.exp === "number" ? claims.exp * 1000 - Date.now() : 0;
  if (claims && expiresMs > 0) decoded.set(key, claims, { ttl: expiresMs });
  return claims;
}

/** The session's claims behind an API request (session cookie or bearer JWT): who, and the session version; null when signed out. */
export async function sessionFromRequest(req: NextRequest): Promise<{ userId: string; sessionVersion: number } | null> {
  const token = await getToken({ req, secret: process.env.NEXTAUTH_SECRET, decode: cachedDecode });
  return token?.sub ? { userId: token.sub, sessionVersion: typeof token.sv === "number" ? token.sv : 0 } : null;
}

/**
 * The actor for a server component or server action, or null when signed out
 * or the session is stale. Read once per request (React cache): the layout
 * and the page share one session decode and one user row.
 */
export const currentActor = cache(async (): Promise<Actor | null> => {
  const session = await getServerSession(authOptions);
  return loadActor(getDb(), session?.user?.id, session?.user?.sv ?? 0);
});
