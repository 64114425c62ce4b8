import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { createRequire } from "node:module";
import { afterAll, afterEach, describe, expect, it } from "vitest";

/**
 * The page cache's one rule of its own (lib/cache/next-cache-handler.cjs): a stored
 * published-plan page is served only while it carries the tag the check gives now, and a
 * page without a tag is never stored. Everything else is Next.js's file-system cache,
 * used here as Next uses it (on disk, no memory layer).
 */
const require = createRequire(import.meta.url);
const Handler = require("../../../lib/cache/next-cache-handler.cjs");
const { nodeFs } = require("next/dist/server/lib/node-fs-methods.js");
const CHECK = Symbol.for("sagline.publishedPageTag");
const g = globalThis as Record<symbol, unknown>;

const dir = mkdtempSync(path.join(tmpdir(), "sagline-page-cache-"));
const handler = new Handler({ fs: nodeFs, dev: false, flushToDisk: true, serverDistDir: dir, revalidatedTags: [], maxMemoryCacheSize: 0, _requestHeaders: {} });
const KEY = "/route-cache/APP_PAGE/abc/$/published/11111111-1111-4111-8111-111111111111/22222222-2222-4222-8222-222222222222";
const OTHER = "/route-cache/APP_PAGE/def/$/register";
const page = (html: string) => ({ kind: "APP_PAGE", html, rscData: Buffer.from("rsc"), headers: {}, postponed: undefined, status: 200, segmentData: new Map() });
const setCtx = { cacheControl: { revalidate: 300, expire: 300 }, isRoutePPREnabled: false, isFallback: false, tags: [] };
const getCtx = { kind: "APP_PAGE", isRoutePPREnabled: false, isFallback: false };
const checks: string[] = [];
const checkGives = (tag: string | null | Error) => {
  g[CHECK] = async (basinId: string, planId: string) => {
    checks.push(`${basinId}/${planId}`);
    if (tag instanceof Error) throw tag;
    return tag;
  };
};

afterEach(() => {
  delete g[CHECK];
  checks.length = 0;
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("the published-page cache", () => {
  it("serves a stored page while its tag is the plan's tag now, and nothing stored otherwise", async () => {
    await handler.set(KEY, page('<main data-publication="tag-1">plan</main>'), setCtx);
    checkGives("tag-1");
    expect((await handler.get(KEY, getCtx))?.value.html).toContain("plan");
    expect(checks).toEqual(["11111111-1111-4111-8111-111111111111/22222222-2222-4222-8222-222222222222"]);
    checkGives("tag-2"); // renamed basin, a later version published
    expect(await handler.get(KEY, getCtx)).toBeNull();
    checkGives(null); // no longer published
    expect(await handler.get(KEY, getCtx)).toBeNull();
    checkGives(new Error("database down"));
    expect(await handler.get(KEY, getCtx)).toBeNull();
    delete g[CHECK]; // the check not registered yet
    expect(await handler.get(KEY, getCtx)).toBeNull();
  });

  it("does not store a page without a tag (a 404 for a plan not published)", async () => {
    const KEY404 = KEY.replace(/2222$/, "3333");
    await handler.set(KEY404, page("<main>Nothing at this address</main>"), setCtx);
    checkGives("anything");
    expect(await handler.get(KEY404, getCtx)).toBeNull();
    // underneath, nothing was written either
    expect(await Object.getPrototypeOf(Handler.prototype).get.call(handler, KEY404, getCtx)).toBeNull();
  });

  it("leaves every other page to Next's cache, asking nothing of the database", async () => {
    await handler.set(OTHER, page("<main>register</main>"), setCtx);
    checkGives("tag-1");
    expect((await handler.get(OTHER, getCtx))?.value.html).toContain("register");
    expect(checks).toEqual([]);
  });
});
