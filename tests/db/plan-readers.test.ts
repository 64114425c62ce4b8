import { randomBytes } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { findUserByEmail } from "@/db/queries/users";
import type { Actor } from "@/lib/auth/guard";
import { register } from "@/lib/services/accounts";
import { followBasin } from "@/lib/services/follows";
import { getPlanForReaderWithMap, readerHome } from "@/lib/services/plan-readers";
import { createUser } from "@/lib/services/users";
import { fileDb } from "../support/file-db";
import { readerBasin, readerPlan } from "../support/reader-plans";
import { buildWorld, type World } from "../support/world";

const db = fileDb();

const asActor = (u: { id: string; email: string; name: string; is_admin: boolean }): Actor => ({ id: u.id, email: u.email, name: u.name, isAdmin: u.is_admin });

describe("where a signed-in person outside every basin lands", () => {
  let w: World;
  let review: string;
  let published: string;
  let registered: Actor;
  let staff: Actor;
  beforeAll(async () => {
    w = await buildWorld(db);
    await readerBasin(db, w);
    ({ planId: published } = await readerPlan(db, w, { stage: "published" }));
    ({ planId: review } = await readerPlan(db, w, { stage: "open", title: "Revision under review" }));
    const tag = randomBytes(4).toString("hex");
    // a member of the public registers themselves; an administrator makes an account for staff
    await register(db, { name: "Rosa Fenwick", email: `rosa-${tag}@example.test`, password: "kingfisher-bank-9", confirmPassword: "kingfisher-bank-9" });
    registered = asActor((await findUserByEmail(db, `rosa-${tag}@example.test`))!);
    const made = await createUser(db, w.users.admin, { name: "New Planner", email: `staff-${tag}@example.test`, password: "long-enough-pass", isAdmin: false });
    staff = { id: made.id, email: made.email, name: made.name, isAdmin: made.isAdmin };
  });

  it("a self-registered account is public: it is offered plans under review, published plans and basins to follow", async () => {
    const home = await readerHome(db, registered);
    expect(home.kind).toBe("public");
    expect(home.reviews.map((r) => r.id)).toContain(review);
    expect(home.reviews.map((r) => r.id)).not.toContain(published);
    expect(home.published.map((p) => p.id)).toContain(published);
    expect(home.follows.find((f) => f.basinId === w.basinId)).toMatchObject({ followed: false });
    await followBasin(db, registered, w.basinId);
    expect((await readerHome(db, registered)).follows.find((f) => f.basinId === w.basinId)).toMatchObject({ followed: true });
  });

  it("an account an administrator made, not yet in a basin, is staff awaiting membership (and reads the same plans)", async () => {
    const home = await readerHome(db, staff);
    expect(home.kind).toBe("staff");
    expect(home.published.map((p) => p.id)).toContain(published);
  });

  it("a member and a site admin land on their basins", async () => {
    expect((await readerHome(db, w.users.discharger)).kind).toBe("member");
    expect((await readerHome(db, w.users.admin)).kind).toBe("member");
    await expect(readerHome(db, null)).rejects.toMatchObject({ status: 401 });
  });
});

describe("the review page's map", () => {
  let w: World;
  let review: string;
  beforeAll(async () => {
    w = await buildWorld(db);
    await readerBasin(db, w);
    ({ planId: review } = await readerPlan(db, w, { stage: "open" }));
  });

  it("carries the reach lines the plan's run used and the outfalls of the facilities it allocates to, for anyone signed in", async () => {
    const found = await getPlanForReaderWithMap(db, w.users.outsider, w.basinId, review);
    expect(found.plan.id).toBe(review);
    const kinds = (k: string) => found.network.features.filter((f) => f.properties?.kind === k);
    expect(kinds("reach").length).toBeGreaterThan(10);
    expect(kinds("reach").every((f) => f.geometry.type === "LineString")).toBe(true);
    // one outfall per allocated facility, on the reach the model file places it, named as the plan names it
    const outfalls = kinds("outfall");
    expect(outfalls.map((f) => f.properties!.id).sort()).toEqual(found.plan.allocations.map((a) => a.permitId).sort());
    const model = (found.plan.snapshot as { run: { modelFiles: { file: { dischargers: { id: string; reach: string }[] } }[] } }).run.modelFiles[0].file;
    for (const o of outfalls) {
      expect(o.geometry.type).toBe("Point");
      expect(o.properties!.reachId).toBe(model.dischargers.find((d) => d.id === o.properties!.id)!.reach);
      expect(o.properties!.name).toBe(found.plan.allocations.find((a) => a.permitId === o.properties!.id)!.facilityName);
    }
  });

  it("follows the plan's own rules: nothing signed out, no drafts outside the basin", async () => {
    await expect(getPlanForReaderWithMap(db, null, w.basinId, review)).rejects.toMatchObject({ status: 401 });
    const { planId: draft } = await readerPlan(db, w, { stage: "draft" });
    await expect(getPlanForReaderWithMap(db, w.users.outsider, w.basinId, draft)).rejects.toMatchObject({ status: 403 });
  });
});
