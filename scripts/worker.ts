import { getDb, isDatabaseUnavailable, noteDatabaseDown } from "@/db/client";
import { getBoss, RUN_QUEUE, runTimeLimitSeconds, stopBoss } from "@/lib/jobs/queue";
import { runJob } from "@/lib/jobs/run-job";
import { closeDueReviews, sendClosingSoonNotices } from "@/lib/services/plans";
import { sweepStuckRuns, type RunCompute } from "@/lib/services/runs";
import { createComputePool } from "@/lib/compute/pool";
import { sendPending } from "@/lib/email/sender";
import { smtpUrl } from "@/lib/email/transport";

/**
 * The background worker: takes model and allocation runs off the PostgreSQL
 * job queue (pg-boss). Start as many as needed against one database. It
 * outlives a database restart: every loop below catches its errors and tries
 * again on its next tick, and the pools reconnect on their next query.
 */

// pg-boss settles a finished job without awaiting it; while the database is
// down that rejection has no handler, and Node's default would end the
// process. A lost connection is logged once; anything else still ends the
// process (the start command restarts it).
process.on("unhandledRejection", (reason) => {
  if (isDatabaseUnavailable(reason)) return noteDatabaseDown("job queue", reason);
  console.error("[worker] unhandled rejection", reason);
  process.exit(1);
});

let stopping = false;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

// Start even when the database is not up yet: try again every two seconds.
async function startQueue() {
  for (;;) {
    try {
      return await getBoss();
    } catch (error) {
      if (!isDatabaseUnavailable(error)) throw error;
      noteDatabaseDown("worker start", error);
      await sleep(2_000);
    }
  }
}

const boss = await startQueue();
const limit = runTimeLimitSeconds();
// The computation runs in a worker thread, so the mail loop and the review timers below
// keep their turns during a long solve, and a solve past the run's time limit is stopped
// (its thread terminated) and the run failed with the reason — a few seconds before
// pg-boss would expire the job.
const compute = createComputePool({ size: 1, timeoutMs: Math.max(1, limit - 5) * 1000 });
const pooled: RunCompute = (job, onProgress) => compute.payload(job, onProgress);
await boss.work<{ runId: string }>(RUN_QUEUE, { pollingIntervalSeconds: 0.5, batchSize: 1 }, async (jobs) => {
  for (const job of jobs) await runJob(job.data.runId, limit, pooled);
});
console.log(`Sagline worker listening on queue ${RUN_QUEUE} (pid ${process.pid}, time limit ${limit} s per run, computed in a worker thread)`);

const quietly = (what: string) => (error: unknown) => {
  if (isDatabaseUnavailable(error)) noteDatabaseDown(what, error);
  else console.error(`[${what}] failed:`, error);
};

// Runs that will never finish on their own (job failed, expired or lost,
// worker gone mid-run) are failed with a reason, so no run stays "running".
const SWEEP_INTERVAL_MS = Number(process.env.SAGLINE_SWEEP_INTERVAL_MS ?? 30_000);
let sweepTimer: NodeJS.Timeout | undefined;
const sweepLoop = async () => {
  try {
    const n = await sweepStuckRuns(getDb());
    if (n > 0) console.log(`[runs] failed ${n} run(s) that could not finish`);
  } catch (error) {
    quietly("runs sweep")(error);
  }
  if (!stopping) sweepTimer = setTimeout(sweepLoop, SWEEP_INTERVAL_MS);
};
sweepTimer = setTimeout(sweepLoop, 1_000);

// The e-mail outbox: every few seconds, deliver the due messages over SMTP_URL
// (several workers may run this side by side: rows are claimed with SKIP LOCKED).
const MAIL_INTERVAL_MS = Number(process.env.SAGLINE_MAIL_INTERVAL_MS ?? 3_000);
let mailTimer: NodeJS.Timeout | undefined;
const mailLoop = async () => {
  try {
    const report = await sendPending(getDb());
    if (report.sent + report.retried + report.failed > 0) console.log(`[mail] sent ${report.sent}, retry ${report.retried}, failed ${report.failed}`);
  } catch (error) {
    quietly("mail")(error);
  }
  if (!stopping) mailTimer = setTimeout(mailLoop, MAIL_INTERVAL_MS);
};
mailTimer = setTimeout(mailLoop, 500);
console.log(`Sagline worker sending the e-mail outbox to ${smtpUrl()} every ${MAIL_INTERVAL_MS} ms`);

// Review periods close themselves at their end, and announce that they close
// soon before it: checked every 30 s.
const REVIEW_INTERVAL_MS = Number(process.env.SAGLINE_REVIEW_INTERVAL_MS ?? 30_000);
const reviewTimer = setInterval(() => {
  sendClosingSoonNotices(getDb())
    .then((n) => n > 0 && console.log(`[review] queued ${n} "closing soon" notice(s)`))
    .catch(quietly("review notices"));
  closeDueReviews(getDb())
    .then((n) => n > 0 && console.log(`[review] closed ${n} review period(s) at their end`))
    .catch(quietly("review closing"));
}, REVIEW_INTERVAL_MS);

const shutdown = async () => {
  stopping = true;
  clearTimeout(mailTimer);
  clearTimeout(sweepTimer);
  clearInterval(reviewTimer);
  await stopBoss();
  await compute.close();
  await getDb().destroy();
  process.exit(0);
};
process.on("SIGTERM", shutdown);
process.on("SIGINT", shutdown);
