import "server-only";
import { getServerSession } from "next-auth";
import { getToken } from "next-auth/jwt";
import type { NextRequest } from "next/server";
import { getDb } from "@/db/client";
import { loadActor, type Actor } from "./guard";
import { authOptions } from "./options";

/** The actor behind an API request (session cookie or bearer JWT), or null. */
export async function actorFromRequest(req: NextRequest): Promise<Actor | null> {
  const token = await getToken({ req, secret: process.env.NEXTAUTH_SECRET });
  return loadActor(getDb(), token?.sub);
}

/** The actor for a server component or server action, or null when signed out. */
export async function currentActor(): Promise<Actor | null> {
  const session = await getServerSession(authOptions);
  return loadActor(getDb(), session?.user?.id);
}
