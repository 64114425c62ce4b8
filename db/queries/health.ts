import { sql } from "kysely";
import type { Db } from "../client";

/** One round trip to PostgreSQL. */
export async function pingDatabase(db: Db): Promise<void> {
  await sql`select 1`.execute(db);
}
