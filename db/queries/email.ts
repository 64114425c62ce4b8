import { sql } from "kysely";
import type { Db } from "../client";
import type { EmailKind } from "../schema";

export interface NewOutboxRow {
  basin_id: string | null;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  kind: EmailKind;
  dedupe_key: string;
}

/** Inserts one outbox row; false when its dedupe key is already there. */
export async function insertOutboxRow(db: Db, row: NewOutboxRow): Promise<boolean> {
  const inserted = await db
    .insertInto("email_outbox")
    .values(row)
    .onConflict((oc) => oc.column("dedupe_key").doNothing())
    .returning("id")
    .executeTakeFirst();
  return inserted !== undefined;
}

/**
 * Claims up to `limit` due rows (pending, or sending with a lapsed claim) for
 * one sender: marks them sending, counts the attempt and sets the claim's
 * expiry, all in one statement. SKIP LOCKED lets several workers claim side
 * by side without taking the same row.
 */
export async function claimDueEmails(db: Db, now: Date, claimUntil: Date, limit: number) {
  return db
    .updateTable("email_outbox")
    .set({ status: "sending", attempts: sql<number>`attempts + 1`, next_attempt_at: claimUntil })
    .where(
      "id",
      "in",
      db
        .selectFrom("email_outbox")
        .select("id")
        .where("status", "in", ["pending", "sending"])
        .where("next_attempt_at", "<=", now)
        .orderBy("next_attempt_at")
        .orderBy("id")
        .limit(limit)
        .forUpdate()
        .skipLocked(),
    )
    // re-checked on the locked row itself, so a row claimed meanwhile is not taken twice
    .where("status", "in", ["pending", "sending"])
    .where("next_attempt_at", "<=", now)
    .returning(["id", "to_address", "subject", "text_body", "html_body", "attempts", "dedupe_key", "kind"])
    .execute();
}


export async function markEmailSent(db: Db, id: string, messageId: string, now: Date): Promise<void> {
  await db
    .updateTable("email_outbox")
    .set({ status: "sent", sent_at: now, message_id: messageId, last_error: null })
    .where("id", "=", id)
    .where("status", "=", "sending")
    .execute();
}

export async function markEmailRetry(db: Db, id: string, error: string, nextAttemptAt: Date): Promise<void> {
  await db
    .updateTable("email_outbox")
    .set({ status: "pending", last_error: error, next_attempt_at: nextAttemptAt })
    .where("id", "=", id)
    .where("status", "=", "sending")
    .execute();
}

export async function markEmailFailed(db: Db, id: string, error: string): Promise<void> {
  await db
    .updateTable("email_outbox")
    .set({ status: "failed", last_error: error })
    .where("id", "=", id)
    .where("status", "=", "sending")
    .execute();
}

/** Outbox rows, newest first (for inspection and tests). */
export async function listOutbox(db: Db, options: { basinId?: string; limit?: number } = {}) {
  let q = db.selectFrom("email_outbox").selectAll().orderBy("created_at", "desc").orderBy("id", "desc").limit(options.limit ?? 200);
  if (options.basinId) q = q.where("basin_id", "=", options.basinId);
  return q.execute();
}
