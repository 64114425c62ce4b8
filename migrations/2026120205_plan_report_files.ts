import { sql, type Kysely } from "kysely";

// A published plan never changes, so its PDF report is rendered once and kept:
// rendering costs about a second of CPU, and the public may ask for it often.

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("plan_report_files")
    .addColumn("plan_id", "uuid", (c) => c.primaryKey().references("plans.id"))
    .addColumn("pdf", "bytea", (c) => c.notNull())
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("plan_report_files").execute();
}
