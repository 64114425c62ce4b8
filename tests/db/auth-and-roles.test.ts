import { beforeAll, describe, expect, it } from "vitest";
import * as basinRoute from "@/app/api/basins/[basinId]/route";
import * as basinsRoute from "@/app/api/basins/route";
import { seedDemo } from "@/db/seed/demo";
import { DEMO_BASINS, DEMO_USERS } from "@/db/seed/demo-data";
import { findBasinBySlug } from "@/db/queries/basins";
import { deleteMembership } from "@/db/queries/memberships";
import { hashPassword, verifyCredentials } from "@/lib/services/users";
import { fileDb } from "../support/file-db";
import { callRoute } from "../support/call-route";

const db = fileDb();
beforeAll(async () => {
  await seedDemo(db, hashPassword);
});

describe("demo data", () => {
  it("is re-runnable without duplicates", async () => {
    const again = await seedDemo(db, hashPassword);
    expect(again.created).toBe(0);
    const tamsel = await db.selectFrom("basins").select("id").where("slug", "=", "tamsel-river").execute();
    expect(tamsel).toHaveLength(1);
  });
});

describe("sign-in", () => {
  for (const u of DEMO_USERS) {
    it(`accepts the demo ${u.key} with the printed password`, async () => {
      const user = await verifyCredentials(db, u.email, u.password);
      expect(user).toMatchObject({ email: u.email, name: u.name, isAdmin: u.isAdmin });
      expect(user).not.toHaveProperty("password_hash");
      // e-mail matching ignores case and surrounding space
      expect(await verifyCredentials(db, `  ${u.email.toUpperCase()} `, u.password)).not.toBeNull();
    });
  }
  it("refuses a wrong password and an unknown e-mail alike", async () => {
    expect(await verifyCredentials(db, DEMO_USERS[1].email, "wrong-password")).toBeNull();
    expect(await verifyCredentials(db, "nobody@sagline.test", DEMO_USERS[1].password)).toBeNull();
  });
});

describe("roles come from the database at each request", () => {
  const id = (key: string) => DEMO_USERS.find((u) => u.key === key)!;
  async function userId(key: string) {
    const row = await db.selectFrom("users").select("id").where("email", "=", id(key).email).executeTakeFirstOrThrow();
    return row.id;
  }

  it("a discharger does not see a basin it is not a member of", async () => {
    const discharger = await userId("discharger");
    const list = await callRoute(basinsRoute.GET, "GET", { userId: discharger });
    expect(list.status).toBe(200);
    const slugs = (list.json as { slug: string }[]).map((b) => b.slug);
    const memberOf = DEMO_BASINS.filter((b) => b.members.some((m) => m.key === "discharger")).map((b) => b.slug);
    expect(slugs.sort()).toEqual(memberOf.sort());
    const orrin = await findBasinBySlug(db, "kestle-water");
    const res = await callRoute(basinRoute.GET, "GET", { userId: discharger, params: { basinId: orrin!.id } });
    expect(res.status).toBe(403);
    expect(res.json).toMatchObject({ error: { code: "forbidden" } });
  });

  it("removing a member takes effect on the very next request, with the same session", async () => {
    const stakeholder = await userId("stakeholder");
    const tamsel = await findBasinBySlug(db, "tamsel-river");
    const before = await callRoute(basinRoute.GET, "GET", { userId: stakeholder, params: { basinId: tamsel!.id } });
    expect(before.status).toBe(200);
    await deleteMembership(db, tamsel!.id, stakeholder);
    const after = await callRoute(basinRoute.GET, "GET", { userId: stakeholder, params: { basinId: tamsel!.id } });
    expect(after.status).toBe(403);
    await seedDemo(db, hashPassword); // put the demo membership back
  });

  it("a session whose account was deleted is treated as signed out", async () => {
    const ghost = "00000000-0000-4000-8000-000000000000";
    const res = await callRoute(basinsRoute.GET, "GET", { userId: ghost });
    expect(res.status).toBe(401);
  });
});
