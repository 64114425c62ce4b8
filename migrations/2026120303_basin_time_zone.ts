import { sql, type Kysely } from "kysely";

// A basin's time zone (IANA name): every date and time a basin's pages, e-mails and
// reports show is given in it, with the zone named. Null until the lead sets it or
// the basin's first review opens (that review's zone is taken). Basins that already
// had reviews take the zone of their first one.

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("basins").addColumn("time_zone", "text", (c) => c.check(sql`length(time_zone) between 1 and 64`)).execute();
  await sql`
    update basins b set time_zone = first.time_zone
    from (
      select distinct on (p.basin_id) p.basin_id, r.time_zone
      from review_periods r join plans p on p.id = r.plan_id
      order by p.basin_id, r.created_at
    ) first
    where first.basin_id = b.id`.execute(db);
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("basins").dropColumn("time_zone").execute();
}
