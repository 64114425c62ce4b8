import { getDb } from "@/db/client";
import { pingDatabase } from "@/db/queries/health";

export interface DatabaseHealth {
  ok: boolean;
  latencyMs: number;
  error?: string;
}

export async function checkDatabase(): Promise<DatabaseHealth> {
  const started = performance.now();
  try {
    await pingDatabase(getDb());
    return { ok: true, latencyMs: Math.round(performance.now() - started) };
  } catch (error) {
    const code = (error as { code?: string }).code;
    return { ok: false, latencyMs: Math.round(performance.now() - started), error: code ?? "unreachable" };
  }
}
