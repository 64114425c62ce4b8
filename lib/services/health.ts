import { connectionErrorLabel, getDb, isDatabaseUnavailable, noteDatabaseDown, noteDatabaseUp } from "@/db/client";
import { pingDatabase } from "@/db/queries/health";

export interface DatabaseHealth {
  ok: boolean;
  /** "up", or "down" while PostgreSQL cannot be reached (stopped, restarting, refusing connections). */
  state: "up" | "down";
  latencyMs: number;
  /** Down: the connection error's code (ECONNREFUSED, 57P01, …) or message. */
  error?: string;
}

/** One round trip to PostgreSQL through the process pool (which reconnects by itself). */
export async function checkDatabase(): Promise<DatabaseHealth> {
  const started = performance.now();
  const latencyMs = () => Math.round(performance.now() - started);
  try {
    await pingDatabase(getDb());
    noteDatabaseUp("health");
    return { ok: true, state: "up", latencyMs: latencyMs() };
  } catch (error) {
    // an error other than a lost connection (say, a bad password) is a fault too, but worth its own log line
    if (isDatabaseUnavailable(error)) noteDatabaseDown("health", error);
    else console.error("[health] database check failed", error);
    return { ok: false, state: "down", latencyMs: latencyMs(), error: connectionErrorLabel(error) };
  }
}
