import { getDb } from "@/db/client";
import { getBoss, RUN_QUEUE, stopBoss } from "@/lib/jobs/queue";
import { processRun } from "@/lib/services/runs";

/**
 * The background worker: takes model and allocation runs off the PostgreSQL
 * job queue (pg-boss). Start as many as needed against one database.
 */
const boss = await getBoss();
await boss.work<{ runId: string }>(RUN_QUEUE, { pollingIntervalSeconds: 0.5, batchSize: 1 }, async (jobs) => {
  for (const job of jobs) await processRun(getDb(), job.data.runId);
});
console.log(`Sagline worker listening on queue ${RUN_QUEUE} (pid ${process.pid})`);

const shutdown = async () => {
  await stopBoss();
  await getDb().destroy();
  process.exit(0);
};
process.on("SIGTERM", shutdown);
process.on("SIGINT", shutdown);
