import Papa from "papaparse";
import { readFileSync } from "node:fs";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDb, type Db } from "@/db/client";
import { stopBoss } from "@/lib/jobs/queue";
import { addComment, closeDueReviews, publishPlan, respondToThread } from "@/lib/services/plans";
import { launchBrowser, signInAs } from "./support/browser";
import { inkPixels } from "./support/pixels";
import { planAt } from "../support/plan-fixture";
import { buildWorld, WORLD_PASSWORD, type World } from "../support/world";
import { scoped } from "../support/scoped";

const baseUrl = inject("baseUrl");
let browser: Browser;
let db: Db;
let url: string;
let draftUrl: string;
let w: World;

const COMMENT = "Please keep the lower Tamsel fishable through August.";
const UNANSWERED = "Why is the creamery held at today's load?";
const ACK = "Answered at the public meeting of 1 December; the minutes are on the basin page.";
const RESPONSE = "The allocation holds DO above 5.0 mg/L at the August design temperature; see the critical conditions.";

beforeAll(async () => {
  // a plan taken all the way to publication in the server's own database
  process.env.DATABASE_URL = inject("e2eDatabaseUrl");
  db = createDb(inject("e2eDatabaseUrl"), 2);
  w = await buildWorld(db);
  // a plan taken through a review with a comment and its response, and one comment left
  // unanswered that the lead acknowledged on publishing
  const { planId, planThreadId, threads } = await planAt(db, w, "review");
  await scoped(addComment)(db, w.users.stakeholder, w.basinId, planThreadId, COMMENT);
  await scoped(respondToThread)(db, w.users.planner, w.basinId, planThreadId, RESPONSE);
  const facilityThread = threads.find((t) => t.facility_id !== null)!.id;
  await scoped(addComment)(db, w.users.stakeholder, w.basinId, facilityThread, UNANSWERED);
  await closeDueReviews(db, new Date(Date.now() + 32 * 86_400_000));
  await scoped(publishPlan)(db, w.users.lead, w.basinId, planId, { acknowledgedThreadIds: [facilityThread], statement: ACK });
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
    // the allocation table's button is the plan's own CSV download: one file, one name
    const download = page.waitForEvent("download");
    await page.getByRole("link", { name: "Download allocations (CSV)" }).click();
    const fromTable = await download;
    const csv = readFileSync(await fromTable.path(), "utf8");
    const parsed = Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields?.slice(0, 2)).toEqual(["Permit id", "Facility name"]);
    expect(parsed.meta.fields?.at(-1)).toBe("Notes");
    expect(parsed.data[0].Notes).toMatch(/^Planning-level estimates/);
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
    const d = page.waitForEvent("download");
    await page.getByRole("link", { name: "Allocations (CSV)", exact: true }).click();
    const fromLinks = await d;
    expect(fromLinks.suggestedFilename()).toBe(fromTable.suggestedFilename());
    expect(readFileSync(await fromLinks.path(), "utf8")).toBe(csv);
    const geo = JSON.parse(await fileFrom("Reaches with results (GeoJSON)")) as { type: string; layer: string; caution: string[]; features: { properties: { kind: string } }[] };
    expect(geo.type).toBe("FeatureCollection");
    expect(geo.layer).toBe("reaches");
    expect(geo.caution.join(" ")).toMatch(/qualified \(licensed\) engineer/);
    expect(geo.features.length).toBeGreaterThan(10);
    expect(geo.features.every((f) => f.properties.kind === "reach")).toBe(true);
    const dischargers = JSON.parse(await fileFrom("Dischargers with allocations (GeoJSON)")) as { features: { properties: { kind: string; facility_name: string } }[] };
    expect(dischargers.features.every((f) => f.properties.kind === "discharger" && f.properties.facility_name)).toBe(true);
    await page.screenshot({ path: "test-results/screens/published-plan-signed-out.png", fullPage: true });
    await page.close();
  });

  it("carries what a TMDL documents: critical conditions, methods with MOS and reserve, the comments with their responses; and the header", async () => {
    for (const [width, name] of [
      [1440, "1440"],
      [390, "390"],
    ] as const) {
      const page = await browser.newPage({ viewport: { width, height: 900 } });
      await page.goto(url);
      await page.getByTestId("public-plan").waitFor();
      // critical conditions, with their flow and temperature and the governing one marked
      const conditions = page.getByTestId("critical-conditions");
      expect(await conditions.locator("tbody tr").count()).toBe(1);
      const row = (await conditions.locator("tbody tr").first().textContent()) ?? "";
      expect(row).toMatch(/7Q10/);
      expect(row).toMatch(/governing/);
      expect(row).toMatch(/network design low flow × 1/);
      expect(row).toMatch(/°C/);
      // the PDF's methods: kinetics and reaeration, the allocation's MOS and reserve
      const methods = page.getByTestId("plan-methods");
      const kinetics = (await methods.getByRole("region", { name: "Kinetics (rates at 20 °C)" }).textContent()) ?? "";
      expect(kinetics).toMatch(/Deoxygenation k_d0\.300 1\/d/);
      expect(kinetics).toMatch(/Reaeration methodChosen per reach by depth and velocity/);
      expect(kinetics).toMatch(/Reaeration formulas used.+\(\d+ reach/);
      const allocation = (await methods.getByRole("region", { name: "Allocation" }).textContent()) ?? "";
      expect(allocation).toMatch(/Margin of safety0\.00 mg\/L DO and 0\.0 % of the loading capacity/);
      expect(allocation).toMatch(/Reserve capacity0\.0 %/);
      // the comment and its response, with who and when (in the review's zone)
      const thread = page.getByTestId("responsiveness").getByRole("article", { name: "Comments on The plan as a whole" });
      const text = (await thread.textContent()) ?? "";
      expect(text).toContain(COMMENT);
      expect(text).toContain(RESPONSE);
      expect(text).toMatch(new RegExp(`${w.users.stakeholder.name} · Stakeholder · .+\\(America/Chicago\\)`));
      expect(text).toMatch(new RegExp(`Response by ${w.users.planner.name}`));
      // the comment published without a response, and the lead's acknowledgement of it
      const record = (await page.getByTestId("responsiveness").textContent()) ?? "";
      expect(record).toContain(UNANSWERED);
      expect(await page.getByTestId("publication-acknowledgement").textContent()).toContain(ACK);
      expect(await page.getByTestId("shown-condition").textContent()).toBe("Map and profile under 7Q10, the governing condition.");
      // header: home, published plans, plans under review, sign in
      const header = page.getByTestId("public-header");
      for (const [label, href] of [
        ["Home", "/"],
        ["Published plans", "/published"],
        ["Plans under review", "/reviews"],
        ["Sign in", "/signin"],
      ]) {
        expect(await header.getByRole("link", { name: label, exact: true }).getAttribute("href")).toBe(href);
      }
      await page.locator('[aria-label="Map of dissolved oxygen"] [data-ready="true"]').waitFor({ timeout: 30_000 });
      await page.screenshot({ path: `test-results/screens/published-plan-record-${name}.png`, fullPage: true });
      // the front page under the same header, and the list of published plans
      await page.goto(baseUrl);
      await page.getByTestId("published-plans").waitFor();
      await page.screenshot({ path: `test-results/screens/home-signed-out-${name}.png`, fullPage: true });
      await header.getByRole("link", { name: "Published plans" }).click();
      await page.getByTestId("published-list").first().waitFor();
      await page.screenshot({ path: `test-results/screens/published-list-${name}.png`, fullPage: true });
      await page.close();
    }
  });

  it("signed in, the header names the reader and links to their basins; the published list links the plan", async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signInAs(page, baseUrl, w.users.stakeholder.email, WORLD_PASSWORD);
    await page.goto(url);
    const header = page.getByTestId("public-header");
    expect(await header.getByTestId("signed-in-as").textContent()).toBe(w.users.stakeholder.name);
    expect(await header.getByRole("link", { name: "Your basins" }).getAttribute("href")).toBe("/basins");
    expect(await header.getByRole("link", { name: "Sign in" }).count()).toBe(0);
    await header.getByRole("link", { name: "Published plans" }).click();
    await page.waitForURL(`${baseUrl}/published`);
    expect(await page.getByTestId("published-list").getByRole("link").evaluateAll((links) => links.map((a) => a.getAttribute("href")))).toContain(new URL(url).pathname);
    await page.close();
  });

  it("a draft is not readable signed out", async () => {
    const page = await browser.newPage();
    expect((await page.goto(draftUrl))?.status()).toBe(404);
    expect((await page.goto(url.replace(/[0-9a-f-]{36}$/, "00000000-0000-4000-8000-000000000000")))?.status()).toBe(404);
    await page.close();
  });
});

describe("a published plan's page is stored once and served to every reader", () => {
  // its own basin, so that renaming it changes no other test's page
  let mine: World;
  let pageUrl: string;
  let planId: string;
  const get = async (cookie?: string) => {
    const res = await fetch(pageUrl, { headers: cookie ? { cookie } : {} });
    return { status: res.status, cache: res.headers.get("x-nextjs-cache"), control: res.headers.get("cache-control"), html: await res.text() };
  };
  const tag = (html: string) => /data-publication="([^"]+)"/.exec(html)?.[1];

  beforeAll(async () => {
    mine = await buildWorld(db);
    ({ planId } = await planAt(db, mine, "published"));
    pageUrl = `${baseUrl}/published/${mine.basinId}/${planId}`;
  });

  it("is rendered on its first request, then served from the store, the same HTML signed in or out, cacheable by a CDN", async () => {
    const first = await get();
    expect(first.status).toBe(200);
    expect(first.cache).toBe("MISS");
    const again = await get();
    expect(again.cache).toBe("HIT");
    expect(again.html).toBe(first.html);
    // a shared cache may keep it five minutes and no longer (no stale-while-revalidate allowance)
    expect(first.control).toBe("s-maxage=300");
    // signed in, the reader gets the very same page: the header learns their name in the browser
    const page = await browser.newPage();
    await signInAs(page, baseUrl, mine.users.stakeholder.email, WORLD_PASSWORD);
    const cookie = (await page.context().cookies()).map((c) => `${c.name}=${c.value}`).join("; ");
    const signedIn = await get(cookie);
    expect(signedIn.cache).toBe("HIT");
    expect(signedIn.html).toBe(first.html);
    expect(signedIn.html).not.toContain(mine.users.stakeholder.name);
    await page.goto(pageUrl);
    expect(await page.getByTestId("public-header").getByTestId("signed-in-as").textContent()).toBe(mine.users.stakeholder.name);
    await page.close();
  });

  it("is drawn afresh as soon as what it shows changes — the basin renamed, a later version published — however the change was made", async () => {
    await get();
    const before = await get();
    expect(before.cache).toBe("HIT");
    // changed in the database by this test process, not through the server: the server's next
    // request must see it all the same (as it would a change made by another server or the worker)
    const renamed = `Renamed basin ${Date.now()}`;
    await db.updateTable("basins").set({ name: renamed }).where("id", "=", mine.basinId).execute();
    const after = await get();
    expect(after.cache).not.toBe("HIT");
    expect(after.html).toContain(renamed);
    expect(tag(after.html)).not.toBe(tag(before.html));
    expect((await get()).cache).toBe("HIT");

    const later = await planAt(db, mine, "published", { revises: planId });
    const superseded = await get();
    expect(superseded.cache).not.toBe("HIT");
    expect(superseded.html).toContain("Superseded");
    expect(superseded.html).toContain(`/published/${mine.basinId}/${later.planId}`);
    const stored = await get();
    expect(stored.cache).toBe("HIT");
    expect(stored.html).toContain("Superseded");
  });
});
