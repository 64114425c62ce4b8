import PgBoss from "pg-boss";
import { databaseUrl } from "@/db/client";

/** The job queue on Sagline's own PostgreSQL (pg-boss, schema "pgboss"). */
export const RUN_QUEUE = "sagline-runs";

const globalForBoss = globalThis as unknown as { saglineBoss?: Promise<PgBoss> };

async function start(url: string): Promise<PgBoss> {
  const boss = new PgBoss({ connectionString: url, max: 4 });
  boss.on("error", (e) => console.error("[jobs] queue error", e));
  await boss.start();
  await boss.createQueue(RUN_QUEUE);
  return boss;
}

/** The process-wide queue client (started on first use). */
export function getBoss(url: string = databaseUrl()): Promise<PgBoss> {
  globalForBoss.saglineBoss ??= start(url).catch((e) => {
    globalForBoss.saglineBoss = undefined;
    throw e;
  });
  return globalForBoss.saglineBoss;
}

export async function enqueueRun(runId: string): Promise<void> {
  const boss = await getBoss();
  await boss.send(RUN_QUEUE, { runId }, { retryLimit: 0, expireInSeconds: 15 * 60 });
}

export async function stopBoss(): Promise<void> {
  const boss = globalForBoss.saglineBoss;
  globalForBoss.saglineBoss = undefined;
  if (boss) await (await boss).stop({ graceful: true, wait: true });
}
