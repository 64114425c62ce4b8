import type { Kysely } from "kysely";

// A temperature record's design temperature by the default rule (90th percentile of
// June–September daily means), worked out in the import worker when it is uploaded, so a
// list of records never reads their daily values. Records kept before show none (null).

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("temperature_records").addColumn("summer", "jsonb").execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("temperature_records").dropColumn("summer").execute();
}
