import { CompiledQuery } from "kysely";
import PgBoss from "pg-boss";
import { databaseUrl, isDatabaseUnavailable, noteDatabaseDown, type Db } from "@/db/client";

/** The job queue on Sagline's own PostgreSQL (pg-boss, schema "pgboss"). */
export const RUN_QUEUE = "sagline-runs";

const seconds = (name: string, fallback: number) => {
  const v = Number(process.env[name]);
  return Number.isFinite(v) && v >= 1 ? Math.floor(v) : fallback;
};

/**
 * Each run job's time limit: pg-boss fails a job still active after this long
 * (and the worker's sweeper then fails its run). The demo network's runs take
 * well under a second; a limit of minutes only stops a stuck job.
 */
export const runTimeLimitSeconds = () => seconds("SAGLINE_RUN_TIME_LIMIT_S", 10 * 60);

/**
 * A job whose worker lost the database, was killed or ran out of time is
 * tried once more before its run is failed; a run whose inputs the model
 * refuses is failed by processRun itself and never retried.
 */
export const RUN_RETRY_LIMIT = 1;

const globalForBoss = globalThis as unknown as { saglineBoss?: Promise<PgBoss> };

/** pg-boss's own pool and loops report through 'error'; an outage is logged once (db/client), anything else each time. */
function onQueueError(error: unknown): void {
  if (isDatabaseUnavailable(error)) noteDatabaseDown("job queue", error);
  else console.error("[jobs] queue error", error);
}

async function start(url: string): Promise<PgBoss> {
  // pg-boss hands its options to pg.Pool, which takes the connect timeout its types leave out
  const options: PgBoss.ConstructorOptions & { connectionTimeoutMillis: number } = {
    connectionString: url,
    max: 4,
    connectionTimeoutMillis: 10_000,
    // expiry of timed-out jobs runs in maintenance: often enough that a stuck run fails within a minute of its limit
    maintenanceIntervalSeconds: seconds("SAGLINE_QUEUE_MAINTENANCE_S", 30),
  };
  const boss = new PgBoss(options);
  boss.on("error", onQueueError);
  await boss.start();
  await boss.createQueue(RUN_QUEUE);
  return boss;
}

/** The process-wide queue client (started on first use; a failed start is tried again on the next call). */
export function getBoss(url: string = databaseUrl()): Promise<PgBoss> {
  globalForBoss.saglineBoss ??= start(url).catch((e) => {
    globalForBoss.saglineBoss = undefined;
    throw e;
  });
  return globalForBoss.saglineBoss;
}

/** pg-boss runs its insert through this, so a job commits or rolls back with the caller's transaction. */
const inTransaction = (trx: Db): PgBoss.Db => ({
  executeSql: async (text, values) => ({ rows: (await trx.executeQuery(CompiledQuery.raw(text, values))).rows as unknown[] }),
});

/**
 * Queue a run, as a job whose id is the run's id (so the sweeper can find a
 * run's job and its state). Given `trx`, the job is written in that
 * transaction: a run row never exists without its job.
 */
export async function enqueueRun(runId: string, trx?: Db): Promise<void> {
  const boss = await getBoss();
  const id = await boss.send(
    RUN_QUEUE,
    { runId },
    {
      id: runId,
      retryLimit: RUN_RETRY_LIMIT,
      retryDelay: 5,
      retryBackoff: true,
      expireInSeconds: runTimeLimitSeconds(),
      ...(trx ? { db: inTransaction(trx) } : {}),
    },
  );
  if (!id) throw new Error(`The run queue did not accept run ${runId}`);
}

/** A run's job as the queue knows it (also after it was archived), or null when the queue has no such job. */
export async function findRunJob(runId: string): Promise<{ state: string; output: unknown } | null> {
  const boss = await getBoss();
  const job = await boss.getJobById(RUN_QUEUE, runId, { includeArchive: true });
  return job ? { state: job.state, output: job.output } : null;
}

export async function stopBoss(): Promise<void> {
  const boss = globalForBoss.saglineBoss;
  globalForBoss.saglineBoss = undefined;
  const started = await boss?.catch(() => null);
  if (started) await started.stop({ graceful: true, wait: true });
}
