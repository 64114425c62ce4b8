import { getDb, isDatabaseUnavailable, noteDatabaseDown, noteDatabaseUp } from "@/db/client";
import { pingDatabase } from "@/db/queries/health";
import { processRun, type RunCompute } from "@/lib/services/runs";

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * Wait until PostgreSQL answers again, or until `deadline` (epoch ms).
 * Returns whether it answered.
 */
export async function waitForDatabase(deadline: number, everyMs = 1_000): Promise<boolean> {
  while (Date.now() < deadline) {
    try {
      await pingDatabase(getDb());
      noteDatabaseUp("worker");
      return true;
    } catch (error) {
      if (!isDatabaseUnavailable(error)) throw error;
      noteDatabaseDown("worker", error);
      await sleep(everyMs);
    }
  }
  return false;
}

/**
 * One run job, within its time limit (`compute` does the computation — in the background
 * worker, a worker thread that is terminated past the limit): a database outage in the middle waits
 * for the database and computes the run again (processRun starts over from
 * the stored inputs), instead of leaving the job to expire. Any error left is
 * thrown to pg-boss, which retries the job or fails it; the sweeper then
 * fails the run with a reason.
 */
export async function runJob(runId: string, limitSeconds: number, compute?: RunCompute): Promise<void> {
  const deadline = Date.now() + limitSeconds * 1000 - 2_000;
  for (;;) {
    try {
      await processRun(getDb(), runId, compute);
      return;
    } catch (error) {
      if (!isDatabaseUnavailable(error)) throw error;
      noteDatabaseDown("worker", error);
      if (!(await waitForDatabase(deadline))) throw error;
      console.log(`[runs] run ${runId}: the database is back, computing it again`);
    }
  }
}
