import type { Db } from "../client";
import type { RunStatus } from "../schema";

/**
 * Queries for runs whose work may have gone wrong (a worker that died, a job
 * that timed out): they only ever touch a run that has not finished, so a
 * late writer can never undo a run's final state.
 */

const UNFINISHED: RunStatus[] = ["queued", "running"];

/** Runs still queued or running, created before `createdBefore` (oldest first). */
export async function listUnfinishedRuns(db: Db, createdBefore: Date, limit = 500) {
  return db
    .selectFrom("runs")
    .select(["id", "status", "created_at", "started_at"])
    .where("status", "in", UNFINISHED)
    .where("created_at", "<", createdBefore)
    .orderBy("created_at")
    .limit(limit)
    .execute();
}

/** Update a run only while it is queued or running; false when it had already finished. */
export async function setUnfinishedRunState(
  db: Db,
  id: string,
  v: { status: RunStatus; progress?: number; error?: string | null; result?: unknown; methods?: unknown; started?: boolean; finished?: boolean },
): Promise<boolean> {
  const res = await db
    .updateTable("runs")
    .set({
      status: v.status,
      ...(v.progress !== undefined ? { progress: v.progress } : {}),
      ...(v.error !== undefined ? { error: v.error } : {}),
      ...(v.result !== undefined ? { result: JSON.stringify(v.result) } : {}),
      ...(v.methods !== undefined ? { methods: JSON.stringify(v.methods) } : {}),
      ...(v.started ? { started_at: new Date() } : {}),
      ...(v.finished ? { finished_at: new Date() } : {}),
    })
    .where("id", "=", id)
    .where("status", "in", UNFINISHED)
    .executeTakeFirst();
  return Number(res.numUpdatedRows) > 0;
}
