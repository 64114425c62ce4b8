import { NextResponse } from "next/server";
import { route } from "@/lib/api/route";

export const dynamic = "force-dynamic";

/**
 * Who is signed in, for the header of the pages every reader shares (published plans are
 * stored once for everyone, so their header asks here from the browser). Anyone may ask:
 * a signed-out caller, or one whose session was ended, is told `signedIn: false` rather
 * than refused, and nothing else about the account is said. Never stored by any cache.
 */
export const GET = route({ access: { public: true } }, async ({ actor }) =>
  NextResponse.json(actor ? { signedIn: true, name: actor.name } : { signedIn: false }, { headers: { "cache-control": "private, no-store" } }),
);
