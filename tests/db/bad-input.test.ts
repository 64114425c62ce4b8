import { beforeAll, describe, expect, it } from "vitest";
import * as basinRoute from "@/app/api/basins/[basinId]/route";
import * as basinsRoute from "@/app/api/basins/route";
import * as memberRoute from "@/app/api/basins/[basinId]/members/[userId]/route";
import * as membersRoute from "@/app/api/basins/[basinId]/members/route";
import * as facilitiesRoute from "@/app/api/basins/[basinId]/facilities/route";
import * as linkRoute from "@/app/api/basins/[basinId]/facilities/[facilityId]/users/route";
import * as usersRoute from "@/app/api/users/route";
import { fileDb } from "../support/file-db";
import { callRoute } from "../support/call-route";
import { err } from "../support/errors";
import { buildWorld, type World } from "../support/world";

const db = fileDb();
let w: World;
beforeAll(async () => {
  w = await buildWorld(db);
});

const validBasin = { name: "Fresh basin", slug: "fresh-basin", description: "", doCriterionMgL: 5, unitSystem: "SI" };

describe("bad input", () => {
  it("malformed JSON → 400 naming the body", async () => {
    const res = await callRoute(basinsRoute.POST, "POST", { userId: w.users.admin.id, body: "{not json" });
    expect(res.status).toBe(400);
    expect(err(res.json)).toMatchObject({ code: "bad_request", message: expect.stringMatching(/body.*JSON/) });
  });

  it("empty body → 400", async () => {
    const res = await callRoute(basinsRoute.POST, "POST", { userId: w.users.admin.id, body: "" });
    expect(res.status).toBe(400);
  });

  it("invalid fields → 422 naming each field", async () => {
    const res = await callRoute(basinsRoute.POST, "POST", {
      userId: w.users.admin.id,
      body: { ...validBasin, slug: "Has Spaces", doCriterionMgL: 25, unitSystem: "metric" },
    });
    expect(res.status).toBe(422);
    const e = err(res.json);
    expect(e.code).toBe("invalid");
    expect(e.details!.map((d) => d.path).sort()).toEqual(["doCriterionMgL", "slug", "unitSystem"]);
    expect(e.message).toMatch(/slug|doCriterionMgL|unitSystem/);
  });

  it("a JSON array instead of an object → 422 on the body", async () => {
    const res = await callRoute(basinsRoute.POST, "POST", { userId: w.users.admin.id, body: [1, 2] });
    expect(res.status).toBe(422);
    expect(err(res.json).details![0].path).toBe("body");
  });

  it("PATCH with nothing to change → 422", async () => {
    const res = await callRoute(basinRoute.PATCH, "PATCH", { userId: w.users.lead.id, params: { basinId: w.basinId }, body: {} });
    expect(res.status).toBe(422);
  });

  it("a malformed id in the path → 404 naming the parameter", async () => {
    const res = await callRoute(basinRoute.GET, "GET", { userId: w.users.lead.id, params: { basinId: "not-a-uuid" } });
    expect(res.status).toBe(404);
    expect(err(res.json).message).toMatch(/basinId/);
  });

  it("an unknown basin → 404", async () => {
    const res = await callRoute(basinRoute.GET, "GET", {
      userId: w.users.lead.id,
      params: { basinId: "11111111-1111-4111-8111-111111111111" },
    });
    expect(res.status).toBe(404);
  });

  it("a taken short name → 409 on slug, and nothing is written", async () => {
    const first = await callRoute(basinsRoute.POST, "POST", { userId: w.users.admin.id, body: { ...validBasin, slug: "dup-slug" } });
    expect(first.status).toBe(201);
    const count = async () =>
      Number((await db.selectFrom("basins").select((e) => e.fn.countAll<string>().as("n")).executeTakeFirstOrThrow()).n);
    const before = await count();
    const second = await callRoute(basinsRoute.POST, "POST", { userId: w.users.admin.id, body: { ...validBasin, slug: "dup-slug" } });
    expect(second.status).toBe(409);
    expect(err(second.json).details).toEqual([{ path: "slug", message: "Already in use" }]);
    expect(await count()).toBe(before);
  });

  it("adding an e-mail with no account → 422 on email; adding a member twice → 409", async () => {
    const none = await callRoute(membersRoute.POST, "POST", {
      userId: w.users.lead.id,
      params: { basinId: w.basinId },
      body: { email: "no-such-person@world.test", role: "planner" },
    });
    expect(none.status).toBe(422);
    expect(err(none.json).details![0].path).toBe("email");
    const twice = await callRoute(membersRoute.POST, "POST", {
      userId: w.users.lead.id,
      params: { basinId: w.basinId },
      body: { email: w.users.planner.email, role: "planner" },
    });
    expect(twice.status).toBe(409);
  });

  it("an unknown role → 422 on role", async () => {
    const res = await callRoute(memberRoute.PATCH, "PATCH", {
      userId: w.users.lead.id,
      params: { basinId: w.basinId, userId: w.users.target.id },
      body: { role: "owner" },
    });
    expect(res.status).toBe(422);
    expect(err(res.json).details![0].path).toBe("role");
  });

  it("the only lead cannot be removed or demoted → 409", async () => {
    const demote = await callRoute(memberRoute.PATCH, "PATCH", {
      userId: w.users.lead.id,
      params: { basinId: w.basinId, userId: w.users.lead.id },
      body: { role: "planner" },
    });
    expect(demote.status).toBe(409);
    const remove = await callRoute(memberRoute.DELETE, "DELETE", {
      userId: w.users.admin.id,
      params: { basinId: w.basinId, userId: w.users.lead.id },
    });
    expect(remove.status).toBe(409);
    expect(err(remove.json).message).toMatch(/only lead/);
  });

  it("only discharger members can be linked to a facility → 422 on userId", async () => {
    const res = await callRoute(linkRoute.POST, "POST", {
      userId: w.users.lead.id,
      params: { basinId: w.basinId, facilityId: w.facilityId },
      body: { userId: w.users.planner.id },
    });
    expect(res.status).toBe(422);
    expect(err(res.json).details![0]).toMatchObject({ path: "userId" });
  });

  it("a duplicate permit id → 409 on permitId", async () => {
    const body = { name: "Twin plant", permitId: "DUP-1" };
    const ok = await callRoute(facilitiesRoute.POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId }, body });
    expect(ok.status).toBe(201);
    const dup = await callRoute(facilitiesRoute.POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId }, body });
    expect(dup.status).toBe(409);
    expect(err(dup.json).details![0].path).toBe("permitId");
  });

  it("a short password or taken e-mail for a new user → 422 / 409", async () => {
    const short = await callRoute(usersRoute.POST, "POST", {
      userId: w.users.admin.id,
      body: { name: "Pat", email: "pat@world.test", password: "short", isAdmin: false },
    });
    expect(short.status).toBe(422);
    expect(err(short.json).details![0].path).toBe("password");
    const taken = await callRoute(usersRoute.POST, "POST", {
      userId: w.users.admin.id,
      body: { name: "Pat", email: w.users.planner.email, password: "long-enough-pw", isAdmin: false },
    });
    expect(taken.status).toBe(409);
  });

  it("no stack trace leaves the server", async () => {
    const res = await callRoute(basinsRoute.POST, "POST", { userId: w.users.admin.id, body: "{" });
    expect(JSON.stringify(res.json)).not.toMatch(/at .*\.(ts|js):\d+/);
  });
});

describe("changes are recorded", () => {
  it("settings changes and member changes write audit events", async () => {
    await callRoute(basinRoute.PATCH, "PATCH", {
      userId: w.users.lead.id,
      params: { basinId: w.basinId },
      body: { doCriterionMgL: 6 },
    });
    const events = await db.selectFrom("audit_events").selectAll().where("basin_id", "=", w.basinId).execute();
    const changed = events.find((e) => e.action === "basin.updated");
    expect(changed?.actor_id).toBe(w.users.lead.id);
    expect(changed?.details).toMatchObject({ after: { do_criterion_mg_l: 6 } });
  });
});
