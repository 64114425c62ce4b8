import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { callRoute } from "../support/call-route";
import { buildWorld } from "../support/world";
import { CALLERS, matrix, openMatrixDb, type Expect } from "./access/kit";
import { HTTP_METHODS, ROOT, TABLE, routeFiles } from "./access/table";

/** Every API route × every kind of caller → the expected status (the table is ./access/table.ts). */
openMatrixDb();

describe("API access matrix", () => {
  it("has an entry for every route file and every exported method", async () => {
    const files = routeFiles(join(ROOT, "app/api")).sort();
    expect(files).toEqual(Object.keys(TABLE).sort());
    for (const [file, entry] of Object.entries(TABLE)) {
      if (entry.skip) continue;
      const mod = await entry.load();
      const exported = HTTP_METHODS.filter((m) => typeof mod[m] === "function").sort();
      expect(exported, file).toEqual(Object.keys(entry.methods).sort());
    }
  });

  for (const [file, entry] of Object.entries(TABLE)) {
    for (const [method, c] of Object.entries(entry.methods)) {
      it(`${method} ${file.replace(/^app|\/route\.ts$/g, "")}`, { timeout: 90_000 }, async () => {
        const mod = await entry.load();
        const handler = mod[method] as Parameters<typeof callRoute>[0];
        const got: Partial<Expect> = {};
        for (const caller of CALLERS) {
          // a fresh world per caller: mutations by one caller never change what the next one sees
          const w = await buildWorld(matrix.db);
          const prepared = c.prepare ? await c.prepare(w) : {};
          const res = await callRoute(handler, method, {
            userId: caller === "anon" ? undefined : w.users[caller].id,
            params: c.params?.(w, prepared),
            body: c.body?.(w, prepared),
          });
          got[caller] = res.status;
          if (res.status >= 400) {
            expect(res.json, `${caller}: error body`).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
          }
        }
        expect(got).toEqual(c.expect);
      });
    }
  }
});
