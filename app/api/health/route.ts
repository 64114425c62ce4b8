import { NextResponse } from "next/server";
import { route } from "@/lib/api/route";
import { checkDatabase } from "@/lib/services/health";

export const dynamic = "force-dynamic";

/** Liveness plus database reachability; 503 when PostgreSQL does not answer. */
export const GET = route({ access: { public: true } }, async () => {
  const db = await checkDatabase();
  return NextResponse.json({ status: db.ok ? "ok" : "degraded", database: db }, { status: db.ok ? 200 : 503 });
});
