import { sql, type Kysely } from "kysely";

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  // Stored in each session's JWT at sign-in and compared on every request;
  // raising it (password reset, a basin role removed or changed) ends every
  // session the person had.
  await db.schema
    .alterTable("users")
    .addColumn("session_version", "integer", (c) => c.notNull().defaultTo(0))
    .execute();
  // rate-limiter-flexible's RateLimiterPostgres table (lib/security/rate-limit.ts), made
  // here so the app never runs DDL at run time; its layout is the library's own:
  // key = "<limit>:<subject>", points used in the window, expire = end of the window (ms since 1970).
  await db.schema
    .createTable("rate_limits")
    .addColumn("key", "varchar(255)", (c) => c.primaryKey())
    .addColumn("points", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("expire", "bigint")
    .execute();
  await sql`create index rate_limits_expire_idx on rate_limits (expire)`.execute(db);
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("rate_limits").execute();
  await db.schema.alterTable("users").dropColumn("session_version").execute();
}
