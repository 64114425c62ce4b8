import "server-only";
import { getServerSession } from "next-auth";
import { getToken } from "next-auth/jwt";
import type { NextRequest } from "next/server";
import { cache } from "react";
import { getDb } from "@/db/client";
import { loadActor, type Actor } from "./guard";
import { authOptions } from "./options";

/** The actor behind an API request (session cookie or bearer JWT), or null (signed out, or a stale session). */
export async function actorFromRequest(req: NextRequest): Promise<Actor | null> {
  const token = await getToken({ req, secret: process.env.NEXTAUTH_SECRET });
  return loadActor(getDb(), token?.sub, token?.sv ?? 0);
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
