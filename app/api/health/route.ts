import { NextResponse } from "next/server";
import { checkDatabase } from "@/lib/services/health";

export const dynamic = "force-dynamic";

/** Liveness plus database reachability; 503 when PostgreSQL does not answer. */
export async function GET(): Promise<Response> {
  const db = await checkDatabase();
  return NextResponse.json({ status: db.ok ? "ok" : "degraded", database: db }, { status: db.ok ? 200 : 503 });
}
