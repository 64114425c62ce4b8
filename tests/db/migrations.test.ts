import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createDb, type Db } from "@/db/client";
import { migrateDown, migrateToLatest, migrateToNothing } from "@/db/migrate";
import { migrations } from "@/migrations";
import { createThrowawayDatabase, dropDatabase } from "../support/test-db";

async function tables(db: Db): Promise<string[]> {
  const { rows } = await sql<{ table_name: string }>`
    select table_name from information_schema.tables
    where table_schema = 'public' and table_name not like 'kysely_%' order by table_name`.execute(db);
  return rows.map((r) => r.table_name);
}

describe("migrations", () => {
  let name: string;
  let db: Db;
  beforeAll(async () => {
    const created = await createThrowawayDatabase("sagline_migrations");
    name = created.name;
    db = createDb(created.url, 2);
  });
  afterAll(async () => {
    await db.destroy();
    await dropDatabase(name);
  });

  it("are listed in timestamp order", () => {
    const names = Object.keys(migrations);
    expect(names).toEqual([...names].sort());
    for (const n of names) expect(n).toMatch(/^\d{10}_[a-z0-9_]+$/);
  });

  it("go up to the latest, all the way down, and up again", async () => {
    const up = await migrateToLatest(db);
    expect(up).toHaveLength(Object.keys(migrations).length);
    expect(await tables(db)).toEqual(
      expect.arrayContaining(["users", "basins", "memberships", "facilities", "facility_users", "audit_events"]),
    );
    expect(await migrateToLatest(db)).toEqual([]);

    const down = await migrateToNothing(db);
    expect(down).toHaveLength(Object.keys(migrations).length);
    expect(await tables(db)).toEqual([]);

    await migrateToLatest(db);
    const last = await migrateDown(db);
    expect(last).toEqual([`Down ${Object.keys(migrations).at(-1)}`]);
    await migrateToLatest(db);
    expect(await tables(db)).toContain("basins");
  });

  it("enforce the basin constraints in the database itself", async () => {
    await migrateToLatest(db);
    const insert = (values: Record<string, unknown>) =>
      db
        .insertInto("basins")
        .values({ slug: "ok-slug", name: "B", ...values } as never)
        .execute();
    await expect(insert({ unit_system: "imperial" })).rejects.toThrow(/basins_unit_system/);
    await expect(insert({ do_criterion_mg_l: -1 })).rejects.toThrow(/basins_criterion_range/);
    await expect(insert({ slug: "Not A Slug" })).rejects.toThrow(/basins_slug_format/);
    await insert({ do_criterion_mg_l: 5.25 });
    const row = await db.selectFrom("basins").select("do_criterion_mg_l").where("slug", "=", "ok-slug").executeTakeFirstOrThrow();
    // NUMERIC is parsed to a JS number by db/client.ts
    expect(row.do_criterion_mg_l).toBe(5.25);
  });
});
