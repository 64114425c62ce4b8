import { sql } from "kysely";
import { describe, expect, it } from "vitest";
import type { Db } from "@/db/client";
import { matrix, openMatrixDb, type Case } from "../db/access/kit";
import { TABLE } from "../db/access/table";
import { callRoute } from "../support/call-route";
import { buildWorld, type World } from "../support/world";

/**
 * An id from another basin, on every route that takes one. Each case of the
 * access matrix (tests/db/access/table.ts) is prepared in basin B, then sent
 * under basin A's path by A's lead, A's planner and a site admin — people
 * who may do that thing in A (or, for a site admin, may be refused it by
 * role), so the basin check passes and only the lookup of the child id can
 * stop it. Every such request must answer 404 (or 403 where the caller's role
 * is refused first), and nothing in basin B may change.
 * A route whose id comes in the body (a run, an upload) is covered the same way.
 * A new route in the table is covered without editing this file.
 */

/** Every value that names something in world B: its prepared ids and its own rows. */
function idsOf(w: World, prepared: Record<string, string>): Set<string> {
  return new Set([w.facilityId, w.otherBasinId, ...Object.values(w.users).map((u) => u.id), ...Object.values(prepared)]);
}

/** The strings anywhere in a params object or body (nested objects and arrays too). */
function stringsIn(value: unknown, out: string[] = []): string[] {
  if (typeof value === "string") out.push(value);
  else if (Array.isArray(value)) for (const v of value) stringsIn(v, out);
  else if (value && typeof value === "object" && !(value instanceof FormData)) for (const v of Object.values(value)) stringsIn(v, out);
  else if (value instanceof FormData) for (const [, v] of value.entries()) if (typeof v === "string") out.push(v);
  return out;
}

/**
 * A digest of everything basin B holds: its own rows and the rows that hang
 * off them (reaches, outfalls, allocations, review periods, threads, comments).
 */
async function fingerprint(db: Db, basinId: string): Promise<string> {
  const { rows } = await sql<{ digest: string | null }>`
    select md5(string_agg(r, '|' order by r)) as digest from (
      select to_jsonb(t)::text as r from memberships t where basin_id = ${basinId}
      union all select to_jsonb(t)::text from facilities t where basin_id = ${basinId}
      union all select to_jsonb(fu)::text from facility_users fu join facilities f on f.id = fu.facility_id where f.basin_id = ${basinId}
      union all select to_jsonb(t)::text from audit_events t where basin_id = ${basinId}
      union all select to_jsonb(t)::text from imports t where basin_id = ${basinId}
      union all select to_jsonb(t)::text from field_mappings t where basin_id = ${basinId}
      union all select to_jsonb(t)::text from networks t where basin_id = ${basinId}
      union all select to_jsonb(x)::text from reaches x join networks n on n.id = x.network_id where n.basin_id = ${basinId}
      union all select to_jsonb(x)::text from outfalls x join networks n on n.id = x.network_id where n.basin_id = ${basinId}
      union all select to_jsonb(t)::text from scenarios t where basin_id = ${basinId}
      union all select to_jsonb(t)::text from runs t where basin_id = ${basinId}
      union all select to_jsonb(t)::text from plans t where basin_id = ${basinId}
      union all select to_jsonb(x)::text from plan_allocations x join plans p on p.id = x.plan_id where p.basin_id = ${basinId}
      union all select to_jsonb(x)::text from review_periods x join plans p on p.id = x.plan_id where p.basin_id = ${basinId}
      union all select to_jsonb(x)::text from threads x join plans p on p.id = x.plan_id where p.basin_id = ${basinId}
      union all select to_jsonb(c)::text from comments c join threads x on x.id = c.thread_id join plans p on p.id = x.plan_id where p.basin_id = ${basinId}
    ) s`.execute(db);
  return rows[0]?.digest ?? "";
}

interface CrossCase {
  name: string;
  method: string;
  handler: Parameters<typeof callRoute>[0];
  c: Case;
}

/** The cases that carry an id of B's beyond the basin: in the path, or in the body. */
async function crossCases(): Promise<CrossCase[]> {
  const out: CrossCase[] = [];
  for (const [file, entry] of Object.entries(TABLE)) {
    // routes outside a basin (accounts, invitations) hold ids that are not any basin's
    if (entry.skip || !file.includes("[basinId]")) continue;
    const mod = await entry.load();
    for (const [method, c] of Object.entries(entry.methods)) {
      out.push({ name: `${method} ${file.replace(/^app|\/route\.ts$/g, "")}`, method, handler: mod[method] as CrossCase["handler"], c });
    }
  }
  return out;
}

const CALLERS = ["lead", "planner", "admin"] as const;

openMatrixDb();

describe("an id from another basin", async () => {
  const cases = await crossCases();

  it("is tried on at least every route with a child id in its path", () => {
    const withChildId = Object.keys(TABLE).filter((f) => /\[(?!basinId\])[a-zA-Z]+Id\]/.test(f) && !TABLE[f].skip);
    for (const f of withChildId) {
      expect(
        cases.some((k) => k.name.endsWith(f.replace(/^app|\/route\.ts$/g, ""))),
        f,
      ).toBe(true);
    }
  });

  for (const k of cases) {
    it(k.name, { timeout: 120_000 }, async (ctx) => {
      const a = await buildWorld(matrix.db);
      const b = await buildWorld(matrix.db);
      const prepared = k.c.prepare ? await k.c.prepare(b) : {};
      const ids = idsOf(b, prepared);
      const bParams = k.c.params?.(b, prepared) ?? {};
      const { basinId: _bBasin, ...childParams } = bParams;
      const body = k.c.body?.(b, prepared);
      const carried = stringsIn([childParams, body]).filter((s) => ids.has(s));
      // a case that names nothing of B's but the basin is the matrix's outsider case: reported as skipped
      if (carried.length === 0) return ctx.skip();
      const params = "basinId" in bParams ? { ...childParams, basinId: a.basinId } : childParams;

      const before = await fingerprint(matrix.db, b.basinId);
      const got: Record<string, number> = {};
      for (const caller of CALLERS) {
        const res = await callRoute(k.handler, k.method, { userId: a.users[caller].id, params, body: k.c.body?.(b, prepared) });
        got[caller] = res.status;
        if (res.status >= 400) {
          expect(res.json, `${caller}: error body`).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
        }
      }
      const inPath = stringsIn(childParams).some((s) => ids.has(s));
      // The lead may do every one of these things in A, so only the lookup of B's id can refuse it:
      // 404 when the id is in the path; when it comes in the body (an upload, a run) 404 or the
      // input error that says A has no such thing (409/422).
      expect(inPath ? [404] : [404, 409, 422], `lead got ${got.lead}`).toContain(got.lead);
      for (const caller of CALLERS) {
        // 403 where the caller's role in A may not do this at all (a site admin is not a modeller)
        expect([403, ...(inPath ? [404] : [404, 409, 422])], `${caller} got ${got[caller]}`).toContain(got[caller]);
      }
      expect(await fingerprint(matrix.db, b.basinId), "basin B is unchanged").toBe(before);
    });
  }
});
