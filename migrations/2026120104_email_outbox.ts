import { sql, type Kysely } from "kysely";

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  // The transactional outbox: a row is written in the same transaction as the
  // event it announces; the sender (lib/email/sender.ts) delivers it later.
  await db.schema
    .createTable("email_outbox")
    .addColumn("id", "bigserial", (c) => c.primaryKey())
    .addColumn("basin_id", "uuid", (c) => c.references("basins.id").onDelete("set null"))
    .addColumn("to_address", "text", (c) => c.notNull())
    .addColumn("subject", "text", (c) => c.notNull())
    .addColumn("text_body", "text", (c) => c.notNull())
    .addColumn("html_body", "text")
    .addColumn("kind", "text", (c) => c.notNull())
    // an event queued twice sends once
    .addColumn("dedupe_key", "text", (c) => c.notNull().unique())
    .addColumn("status", "text", (c) => c.notNull().defaultTo("pending"))
    .addColumn("attempts", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("last_error", "text")
    // pending: when to try next; sending: when the claim lapses (crash recovery)
    .addColumn("next_attempt_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("sent_at", "timestamptz")
    .addColumn("message_id", "text")
    .addCheckConstraint("email_outbox_status", sql`status in ('pending', 'sending', 'sent', 'failed')`)
    .addCheckConstraint(
      "email_outbox_kind",
      sql`kind in ('review_opened', 'thread_reply', 'review_closing', 'plan_published', 'account')`,
    )
    .addCheckConstraint("email_outbox_attempts", sql`attempts >= 0`)
    .execute();
  // the sender's scan: due rows that are not finished
  await sql`create index email_outbox_due_idx on email_outbox (next_attempt_at) where status in ('pending', 'sending')`.execute(db);
  await db.schema.createIndex("email_outbox_basin_idx").on("email_outbox").columns(["basin_id", "created_at"]).execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("email_outbox").execute();
}
