import { getDb } from "@/db/client";
import { getBoss, RUN_QUEUE, stopBoss } from "@/lib/jobs/queue";
import { closeDueReviews, sendClosingSoonNotices } from "@/lib/services/plans";
import { processRun } from "@/lib/services/runs";
import { sendPending } from "@/lib/email/sender";
import { smtpUrl } from "@/lib/email/transport";

/**
 * The background worker: takes model and allocation runs off the PostgreSQL
 * job queue (pg-boss). Start as many as needed against one database.
 */
const boss = await getBoss();
await boss.work<{ runId: string }>(RUN_QUEUE, { pollingIntervalSeconds: 0.5, batchSize: 1 }, async (jobs) => {
  for (const job of jobs) await processRun(getDb(), job.data.runId);
});
console.log(`Sagline worker listening on queue ${RUN_QUEUE} (pid ${process.pid})`);

// The e-mail outbox: every few seconds, deliver the due messages over SMTP_URL
// (several workers may run this side by side: rows are claimed with SKIP LOCKED).
const MAIL_INTERVAL_MS = Number(process.env.SAGLINE_MAIL_INTERVAL_MS ?? 3_000);
let mailTimer: NodeJS.Timeout | undefined;
let stopping = false;
const mailLoop = async () => {
  try {
    const report = await sendPending(getDb());
    if (report.sent + report.retried + report.failed > 0) console.log(`[mail] sent ${report.sent}, retry ${report.retried}, failed ${report.failed}`);
  } catch (error) {
    console.error("[mail] outbox run failed:", error instanceof Error ? error.message : error);
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
    .catch((error) => console.error("[review] closing-soon notices failed:", error instanceof Error ? error.message : error));
  closeDueReviews(getDb())
    .then((n) => n > 0 && console.log(`[review] closed ${n} review period(s) at their end`))
    .catch((error) => console.error("[review] closing failed:", error instanceof Error ? error.message : error));
}, REVIEW_INTERVAL_MS);

const shutdown = async () => {
  stopping = true;
  clearTimeout(mailTimer);
  clearInterval(reviewTimer);
  await stopBoss();
  await getDb().destroy();
  process.exit(0);
};
process.on("SIGTERM", shutdown);
process.on("SIGINT", shutdown);
