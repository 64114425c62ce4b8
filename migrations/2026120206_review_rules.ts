import { sql, type Kysely } from "kysely";

// A basin's shortest review period, in days: a formal comment period of a TMDL has a
// minimum length set by the jurisdiction (30 days is common practice); the lead sets it,
// 0 meaning no minimum.

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable("basins")
    .addColumn("min_review_days", "integer", (c) => c.notNull().defaultTo(30).check(sql`min_review_days between 0 and 365`))
    .execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("basins").dropColumn("min_review_days").execute();
}
