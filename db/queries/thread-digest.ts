import { sql } from "kysely";
import type { Db } from "../client";
import type { EmailKind } from "../schema";

/**
 * Serialises notice-writing for one recipient and thread until the caller's
 * transaction ends, so a comment committed just before is seen by the next.
 */
export async function lockThreadNotices(trx: Db, threadId: string, userId: string): Promise<void> {
  await sql`select pg_advisory_xact_lock(hashtext(${`thread_notice:${threadId}:${userId}`}))`.execute(trx);
}

export async function outboxRowExists(db: Db, dedupeKey: string): Promise<boolean> {
  return (await db.selectFrom("email_outbox").select("id").where("dedupe_key", "=", dedupeKey).executeTakeFirst()) !== undefined;
}

/**
 * Writes the row, or rewrites its content while it is still pending (not yet
 * claimed by a sender). False when the row exists and is being or has been sent.
 */
export async function upsertPendingOutboxRow(
  db: Db,
  row: { basin_id: string | null; to_address: string; subject: string; text_body: string; html_body: string; kind: EmailKind; dedupe_key: string; next_attempt_at: Date },
): Promise<boolean> {
  const res = await db
    .insertInto("email_outbox")
    .values(row)
    .onConflict((oc) =>
      oc
        .column("dedupe_key")
        .doUpdateSet({ subject: row.subject, text_body: row.text_body, html_body: row.html_body })
        .where("email_outbox.status", "=", "pending"),
    )
    .returning("id")
    .executeTakeFirst();
  return res !== undefined;
}

/** True when `id` names a comment of the thread (not a planner's response). */
export async function isThreadComment(db: Db, threadId: string, id: string): Promise<boolean> {
  const row = await db
    .selectFrom("comments")
    .select("id")
    .where(sql<string>`id::text`, "=", id)
    .where("thread_id", "=", threadId)
    .executeTakeFirst();
  return row !== undefined;
}

/** Comments in a thread since `since` by anyone but `exceptUserId`: how many, and the latest `limit` (oldest first). */
export async function threadCommentsSince(db: Db, threadId: string, exceptUserId: string, since: Date, limit: number) {
  const base = db
    .selectFrom("comments")
    .where("thread_id", "=", threadId)
    .where("created_at", ">=", since)
    .where((eb) => eb.or([eb("author_id", "is", null), eb("author_id", "!=", exceptUserId)]));
  const { n } = await base.select((eb) => eb.fn.countAll<string>().as("n")).executeTakeFirstOrThrow();
  const latest = await base
    .select(["author_name", "author_role", "body", "created_at"])
    .orderBy("created_at", "desc")
    .limit(limit)
    .execute();
  return { total: Number(n), latest: latest.reverse() };
}
