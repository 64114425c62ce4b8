import { NextResponse } from "next/server";
import { route } from "@/lib/api/route";
import { checkDatabase } from "@/lib/services/health";

export const dynamic = "force-dynamic";

/** Liveness plus database reachability; 503 saying the database is down when PostgreSQL does not answer. */
export const GET = route({ access: { public: true } }, async () => {
  const database = await checkDatabase();
  if (database.ok) return NextResponse.json({ status: "ok", database });
  return NextResponse.json(
    { status: "unavailable", message: "The database is down or restarting; the service answers again when it is back", database },
    { status: 503, headers: { "retry-after": "10" } },
  );
});
