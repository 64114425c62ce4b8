import { sql, type Kysely } from "kysely";

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("plans")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("basin_id", "uuid", (c) => c.notNull().references("basins.id").onDelete("cascade"))
    .addColumn("version", "integer", (c) => c.notNull())
    .addColumn("title", "text", (c) => c.notNull())
    .addColumn("run_id", "uuid", (c) => c.notNull().references("runs.id"))
    .addColumn("status", "text", (c) => c.notNull().defaultTo("draft"))
    // what was proposed, copied from the run and its scenario so later edits cannot change it
    .addColumn("snapshot", "jsonb", (c) => c.notNull())
    .addColumn("created_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("published_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("published_at", "timestamptz")
    .addUniqueConstraint("plans_basin_version_key", ["basin_id", "version"])
    .addCheckConstraint("plans_status", sql`status in ('draft', 'review', 'closed', 'published', 'withdrawn')`)
    .execute();

  await db.schema
    .createTable("plan_allocations")
    .addColumn("plan_id", "uuid", (c) => c.notNull().references("plans.id"))
    .addColumn("facility_id", "uuid", (c) => c.notNull().references("facilities.id"))
    .addColumn("permit_id", "text", (c) => c.notNull())
    .addColumn("cbodu_kg_day", "double precision", (c) => c.notNull())
    .addColumn("bod5_kg_day", "double precision", (c) => c.notNull())
    .addColumn("bod5_mg_l", "double precision", (c) => c.notNull())
    .addColumn("today_cbodu_kg_day", "double precision", (c) => c.notNull())
    .addColumn("reduction_pct", "double precision")
    .addColumn("terms", "jsonb", (c) => c.notNull())
    .addPrimaryKeyConstraint("plan_allocations_pkey", ["plan_id", "facility_id"])
    .execute();

  await db.schema
    .createTable("review_periods")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("plan_id", "uuid", (c) => c.notNull().references("plans.id"))
    .addColumn("starts_at", "timestamptz", (c) => c.notNull())
    .addColumn("ends_at", "timestamptz", (c) => c.notNull())
    .addColumn("time_zone", "text", (c) => c.notNull())
    .addColumn("opened_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("closed_at", "timestamptz")
    .addColumn("extensions", "jsonb", (c) => c.notNull().defaultTo(sql`'[]'::jsonb`))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint("review_periods_order", sql`ends_at > starts_at`)
    .execute();

  await db.schema
    .createTable("threads")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("plan_id", "uuid", (c) => c.notNull().references("plans.id"))
    // null: the thread about the plan as a whole
    .addColumn("facility_id", "uuid", (c) => c.references("facilities.id"))
    .addColumn("status", "text", (c) => c.notNull().defaultTo("open"))
    .addColumn("response", "text")
    .addColumn("responded_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("responded_at", "timestamptz")
    .addCheckConstraint("threads_status", sql`status in ('open', 'addressed')`)
    .execute();
  await sql`create unique index threads_plan_facility_key on threads (plan_id, coalesce(facility_id, '00000000-0000-0000-0000-000000000000'::uuid))`.execute(db);

  await db.schema
    .createTable("comments")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("thread_id", "uuid", (c) => c.notNull().references("threads.id"))
    .addColumn("author_id", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("author_name", "text", (c) => c.notNull())
    .addColumn("author_role", "text", (c) => c.notNull())
    .addColumn("body", "text", (c) => c.notNull())
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint("comments_body_length", sql`char_length(body) between 1 and 10000`)
    .execute();
  await db.schema.createIndex("comments_thread_idx").on("comments").columns(["thread_id", "created_at"]).execute();

  // A published plan is frozen: no UPDATE or DELETE of the plan, its allocations,
  // its review periods, threads or comments gets through, whatever the caller.
  await sql`
    create function sagline_refuse_published_change() returns trigger language plpgsql as $$
    declare
      target uuid;
      plan_status text;
    begin
      if tg_table_name = 'plans' then
        target := old.id;
      elsif tg_table_name = 'comments' then
        select t.plan_id into target from threads t where t.id = old.thread_id;
      else
        target := old.plan_id;
      end if;
      select status into plan_status from plans where id = target;
      if plan_status = 'published' then
        raise exception 'plan % is published and frozen; % on % is not allowed', target, tg_op, tg_table_name
          using errcode = 'P0001';
      end if;
      if tg_op = 'DELETE' then return old; end if;
      return new;
    end $$`.execute(db);
  for (const table of ["plans", "plan_allocations", "review_periods", "threads", "comments"]) {
    await sql`create trigger ${sql.raw(`${table}_frozen_when_published`)} before update or delete on ${sql.table(table)}
      for each row execute function sagline_refuse_published_change()`.execute(db);
  }
  // new comments on a published plan's threads are refused too
  await sql`
    create function sagline_refuse_comment_on_published() returns trigger language plpgsql as $$
    begin
      if exists (select 1 from threads t join plans p on p.id = t.plan_id where t.id = new.thread_id and p.status = 'published') then
        raise exception 'plan is published and frozen; no new comments' using errcode = 'P0001';
      end if;
      return new;
    end $$`.execute(db);
  await sql`create trigger comments_not_on_published before insert on comments for each row execute function sagline_refuse_comment_on_published()`.execute(db);
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  for (const table of ["comments", "threads", "review_periods", "plan_allocations", "plans"]) {
    await db.schema.dropTable(table).execute();
  }
  await sql`drop function sagline_refuse_comment_on_published()`.execute(db);
  await sql`drop function sagline_refuse_published_change()`.execute(db);
}
