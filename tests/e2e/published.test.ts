import { readFileSync } from "node:fs";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDb, type Db } from "@/db/client";
import { stopBoss } from "@/lib/jobs/queue";
import { launchBrowser } from "./support/browser";
import { inkPixels } from "./support/pixels";
import { planAt } from "../support/plan-fixture";
import { buildWorld } from "../support/world";

const baseUrl = inject("baseUrl");
let browser: Browser;
let db: Db;
let url: string;
let draftUrl: string;

beforeAll(async () => {
  // a plan taken all the way to publication in the server's own database
  process.env.DATABASE_URL = inject("e2eDatabaseUrl");
  db = createDb(inject("e2eDatabaseUrl"), 2);
  const w = await buildWorld(db);
  const { planId } = await planAt(db, w, "published");
  url = `${baseUrl}/published/${w.basinId}/${planId}`;
  const other = await buildWorld(db);
  const draft = await planAt(db, other, "draft");
  draftUrl = `${baseUrl}/published/${other.basinId}/${draft.planId}`;
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await stopBoss();
  await db?.destroy();
});

describe("a published plan", () => {
  it("is listed on the front page and readable signed out, with the caution, tables, profile and CSV", async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await page.goto(baseUrl);
    await page.getByTestId("published-plans").getByRole("link").first().waitFor();
    await page.goto(url);
    await page.getByTestId("public-plan").waitFor();
    expect(await page.getByTestId("planning-caution").textContent()).toMatch(/qualified \(licensed\) engineer/);
    await page.getByTestId("profile-chart").locator("svg path").first().waitFor();
    await page.getByRole("heading", { name: "TMDL" }).waitFor();
    const download = page.waitForEvent("download");
    await page.getByRole("button", { name: "Download CSV" }).first().click();
    const csv = readFileSync(await (await download).path(), "utf8");
    expect(csv.split(/\r?\n/)[0]).toMatch(/^# Planning-level estimates/);
    // the map of DO along the plan's reaches is drawn
    const map = '[aria-label="Map of dissolved oxygen"] [data-ready="true"]';
    await page.locator(map).waitFor({ timeout: 30_000 });
    expect(await inkPixels(page, map)).toBeGreaterThan(2000);
    // the plain download links work signed out
    const fileFrom = async (name: string) => {
      const d = page.waitForEvent("download");
      await page.getByRole("link", { name }).click();
      return readFileSync(await (await d).path(), "utf8");
    };
    expect((await fileFrom("Allocations (CSV)")).split(/\r?\n/)[0]).toMatch(/^# Planning-level estimates/);
    const geo = JSON.parse(await fileFrom("Reaches with results (GeoJSON)")) as { type: string; caution: string[]; features: unknown[] };
    expect(geo.type).toBe("FeatureCollection");
    expect(geo.caution.join(" ")).toMatch(/qualified \(licensed\) engineer/);
    expect(geo.features.length).toBeGreaterThan(10);
    await page.screenshot({ path: "test-results/screens/published-plan-signed-out.png", fullPage: true });
    await page.close();
  });

  it("a draft is not readable signed out", async () => {
    const page = await browser.newPage();
    expect((await page.goto(draftUrl))?.status()).toBe(404);
    expect((await page.goto(url.replace(/[0-9a-f-]{36}$/, "00000000-0000-4000-8000-000000000000")))?.status()).toBe(404);
    await page.close();
  });
});
