import { sql, type Kysely } from "kysely";

// A published plan must read the same years later. Until now three holes:
// rows could still be INSERTed into its review periods, threads and
// allocations, and its facility names and reach lines were read live from
// tables that inline edits change. Names and reach lines are now copied into
// the plan when it is proposed, and inserts under a published plan are refused.

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("plan_allocations").addColumn("facility_name", "text").execute();
  // the reach lines of the network version the plan was computed on, as proposed
  await db.schema.alterTable("plans").addColumn("reach_lines", "jsonb").execute();

  // Fill both for the plans already there (published ones too: the freeze trigger is lifted for this one statement each).
  await sql`alter table plan_allocations disable trigger plan_allocations_frozen_when_published`.execute(db);
  await sql`update plan_allocations a set facility_name = f.name from facilities f where f.id = a.facility_id`.execute(db);
  await sql`alter table plan_allocations enable trigger plan_allocations_frozen_when_published`.execute(db);
  await sql`alter table plans disable trigger plans_frozen_when_published`.execute(db);
  await sql`
    update plans p set reach_lines = (
      select coalesce(jsonb_agg(jsonb_build_object(
        'network_id', n.id, 'network_version', n.version, 'reach_key', x.reach_key, 'name', x.name,
        'length_km', x.length_km, 'downstream_key', x.downstream_key, 'coordinates', x.coordinates) order by x.reach_key), '[]'::jsonb)
      from runs r join scenarios s on s.id = r.scenario_id join networks n on n.id = s.network_id join reaches x on x.network_id = n.id
      where r.id = p.run_id)`.execute(db);
  await sql`alter table plans enable trigger plans_frozen_when_published`.execute(db);

  await sql`
    create function sagline_refuse_insert_under_published() returns trigger language plpgsql as $$
    begin
      if exists (select 1 from plans p where p.id = new.plan_id and p.status = 'published') then
        raise exception 'plan % is published and frozen; INSERT on % is not allowed', new.plan_id, tg_table_name
          using errcode = 'P0001';
      end if;
      return new;
    end $$`.execute(db);
  for (const table of ["plan_allocations", "review_periods", "threads"]) {
    await sql`create trigger ${sql.raw(`${table}_no_insert_when_published`)} before insert on ${sql.table(table)}
      for each row execute function sagline_refuse_insert_under_published()`.execute(db);
  }
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  for (const table of ["plan_allocations", "review_periods", "threads"]) {
    await sql`drop trigger ${sql.raw(`${table}_no_insert_when_published`)} on ${sql.table(table)}`.execute(db);
  }
  await sql`drop function sagline_refuse_insert_under_published()`.execute(db);
  await sql`alter table plans disable trigger plans_frozen_when_published`.execute(db);
  await db.schema.alterTable("plans").dropColumn("reach_lines").execute();
  await sql`alter table plans enable trigger plans_frozen_when_published`.execute(db);
  await sql`alter table plan_allocations disable trigger plan_allocations_frozen_when_published`.execute(db);
  await db.schema.alterTable("plan_allocations").dropColumn("facility_name").execute();
  await sql`alter table plan_allocations enable trigger plan_allocations_frozen_when_published`.execute(db);
}
