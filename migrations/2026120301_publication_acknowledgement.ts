import type { Kysely } from "kysely";

// What the lead acknowledged when publishing a plan whose review left threads
// without a response: the threads as they stood, who acknowledged, when, and the
// lead's statement. Printed in the responsiveness summary; null when every thread
// with a comment had its response.

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("plans").addColumn("publication_acknowledgement", "jsonb").execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("plans").dropColumn("publication_acknowledgement").execute();
}
