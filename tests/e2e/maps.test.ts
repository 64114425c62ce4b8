import { mkdirSync } from "node:fs";
import { PNG } from "pngjs";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { MAP_COLOURS } from "@/components/map/map-style";
import { createDb, type Db } from "@/db/client";
import { stopBoss } from "@/lib/jobs/queue";
import { launchBrowser, signInAs } from "./support/browser";
import { planAt } from "../support/plan-fixture";
import { buildWorld, WORLD_PASSWORD, type World } from "../support/world";

// Every map shows labels MapLibre placed (read from the frame's data-labels, written from
// queryRenderedFeatures after each render) and a key; screenshots at 1440 and 390 px.
const baseUrl = inject("baseUrl");
const SHOTS = "test-results/screens";
const WIDE = { width: 1440, height: 900 };
const NARROW = { width: 390, height: 844 };
let browser: Browser;
let db: Db;
let w: World;
let published: { planId: string; runId: string };
let review: { planId: string };

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  process.env.DATABASE_URL = inject("e2eDatabaseUrl");
  db = createDb(inject("e2eDatabaseUrl"), 2);
  w = await buildWorld(db);
  published = await planAt(db, w, "published");
  review = await planAt(db, w, "review");
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await stopBoss();
  await db?.destroy();
});

async function pageAs(viewport: { width: number; height: number }, who?: keyof World["users"]): Promise<Page> {
  const page = await browser.newPage({ viewport });
  if (who) await signInAs(page, baseUrl, w.users[who].email, WORLD_PASSWORD);
  return page;
}

/** The labels the map placed once it has settled (at least one). */
async function placedLabels(page: Page, frame: string): Promise<string[]> {
  const handle = await page.waitForFunction((sel) => (document.querySelector(sel) as HTMLElement | null)?.dataset.labels || null, frame, { timeout: 30_000 });
  return String(await handle.jsonValue()).split(" | ");
}

/** Pixels of an element's screenshot within `tolerance` (sum of channel differences) of a colour. */
async function pixelsNear(page: Page, selector: string, hex: string, tolerance = 36): Promise<number> {
  const png = PNG.sync.read(await page.locator(selector).screenshot());
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));
  let n = 0;
  for (let i = 0; i < png.data.length; i += 4) if (Math.abs(png.data[i] - r) + Math.abs(png.data[i + 1] - g) + Math.abs(png.data[i + 2] - b) < tolerance) n++;
  return n;
}

/** The selection halo as drawn: the selection colour at 60 % over the map's background. */
const haloOnBackground = (() => {
  const mix = (i: number) => Math.round(0.6 * parseInt(MAP_COLOURS.selection.slice(i, i + 2), 16) + 0.4 * parseInt(MAP_COLOURS.background.slice(i, i + 2), 16));
  return `#${[1, 3, 5].map((i) => mix(i).toString(16).padStart(2, "0")).join("")}`;
})();

const reachIds = (labels: string[]) => labels.filter((l) => /^[A-Z]{2}-\d\d/.test(l));

describe("maps have labels and a key", () => {
  it("network page: reach ids and facility names placed without overlap, the key, a selection halo nothing else uses", async () => {
    const page = await pageAs(WIDE, "planner");
    await page.goto(`${baseUrl}/basins/${w.basinId}/network`);
    const frame = '[data-testid="basin-map"]';
    await page.locator(`${frame}[data-ready="true"]`).waitFor({ timeout: 30_000 });
    const labels = await placedLabels(page, frame);
    expect(reachIds(labels).length).toBeGreaterThanOrEqual(5);
    expect(labels).toContain("Quillford Water Reclamation Plant");
    const key = await page.getByTestId("map-legend").innerText();
    for (const item of ["reach", "outfall", "basin outlet", "headwater", "selected"]) expect(key).toContain(item);
    expect(await pixelsNear(page, frame, haloOnBackground)).toBe(0);
    await page.getByTestId("reach-table").locator("tbody tr").first().getByRole("cell").first().click();
    await page.waitForTimeout(600);
    expect(await pixelsNear(page, frame, haloOnBackground)).toBeGreaterThan(150);
    await page.screenshot({ path: `${SHOTS}/maps-network-1440.png`, fullPage: true });
    await page.close();
    const narrow = await pageAs(NARROW, "planner");
    await narrow.goto(`${baseUrl}/basins/${w.basinId}/network`);
    await narrow.locator(`${frame}[data-ready="true"]`).waitFor({ timeout: 30_000 });
    expect((await placedLabels(narrow, frame)).length).toBeGreaterThan(0);
    await narrow.screenshot({ path: `${SHOTS}/maps-network-390.png`, fullPage: true });
    await narrow.close();
  });

  it("run page: the DO map's labels and its key (outlet, selection, what a ring means)", async () => {
    for (const [name, viewport] of [["1440", WIDE], ["390", NARROW]] as const) {
      const page = await pageAs(viewport, "planner");
      await page.goto(`${baseUrl}/basins/${w.basinId}/runs/${published.runId}`);
      const frame = '[data-testid="do-map"]';
      await page.locator(`${frame}[data-ready="true"]`).waitFor({ timeout: 30_000 });
      const labels = await placedLabels(page, frame);
      if (name === "1440") {
        expect(reachIds(labels).length).toBeGreaterThanOrEqual(5);
        expect(labels.some((l) => /Plant|Creamery|Mill|Works/i.test(l))).toBe(true);
        const key = await page.getByTestId("do-legend").innerText();
        for (const item of ["basin outlet", "selected reach", "lowest DO in the network", "discharger outfall"]) expect(key).toContain(item);
      }
      // the DO profile: its labels clear of each other and of the critical marks, its key under the plot
      const chart = page.getByTestId("profile-chart");
      await chart.locator("svg path").first().waitFor();
      await page.waitForTimeout(300);
      const boxes = await chart.evaluate((el) => {
        const r = (n: Element) => n.getBoundingClientRect();
        const svg = r(el.querySelector("svg.recharts-surface")!);
        return {
          labels: [...el.querySelectorAll("text[data-label]")].map((n) => ({ kind: n.getAttribute("data-label"), text: n.textContent, ...r(n).toJSON() })),
          marks: [...el.querySelectorAll(".recharts-scatter-symbol path, .recharts-scatter path")].map((n) => r(n).toJSON()),
          svgBottom: svg.bottom,
          keyTop: r(el.querySelector('[data-testid="profile-key"]')!).top,
        };
      });
      type B = { left: number; right: number; top: number; bottom: number };
      const meet = (a: B, b: B) => a.left < b.right && b.left < a.right && a.top < b.bottom && b.top < a.bottom;
      expect(boxes.labels.filter((l) => l.kind === "discharger").length).toBeGreaterThan(0);
      expect(boxes.labels.filter((l) => l.kind === "criterion")).toHaveLength(1);
      for (const [i, a] of boxes.labels.entries()) for (const b of boxes.labels.slice(i + 1)) expect(meet(a, b), `${a.text} on ${b.text} at ${name}`).toBe(false);
      const criterionLabel = boxes.labels.find((l) => l.kind === "criterion")!;
      for (const m of boxes.marks) expect(meet(criterionLabel, m), `criterion label on a mark at ${name}`).toBe(false);
      expect(boxes.keyTop).toBeGreaterThanOrEqual(boxes.svgBottom - 1);
      await chart.screenshot({ path: `${SHOTS}/maps-profile-${name}.png` });
      await page.screenshot({ path: `${SHOTS}/maps-run-${name}.png`, fullPage: true });
      await page.close();
    }
  });

  it("published plan page, signed out: DO map labels and key", async () => {
    for (const [name, viewport] of [["1440", WIDE], ["390", NARROW]] as const) {
      const page = await pageAs(viewport);
      await page.goto(`${baseUrl}/published/${w.basinId}/${published.planId}`);
      const frame = '[aria-label="Map of dissolved oxygen"] [data-testid="do-map"]';
      await page.locator(`${frame}[data-ready="true"]`).waitFor({ timeout: 30_000 });
      const labels = await placedLabels(page, frame);
      if (name === "1440") {
        expect(reachIds(labels).length).toBeGreaterThanOrEqual(5);
        // the outfalls are labelled too (by facility, or by permit id where the page has only the run's dischargers)
        expect(labels.some((l) => /^DP-\d{4}$|Plant|Creamery|Mill|Works|District/.test(l))).toBe(true);
      }
      expect(await page.getByTestId("do-legend").isVisible()).toBe(true);
      await page.screenshot({ path: `${SHOTS}/maps-published-${name}.png`, fullPage: true });
      await page.close();
    }
  });

  it("review page: the facilities map's labels and key", async () => {
    for (const [name, viewport] of [["1440", WIDE], ["390", NARROW]] as const) {
      const page = await pageAs(viewport, "outsider");
      await page.goto(`${baseUrl}/reviews/${w.basinId}/${review.planId}`);
      const frame = '[aria-label="Map of the facilities"] [data-testid="basin-map"]';
      await page.locator(`${frame}[data-ready="true"]`).waitFor({ timeout: 30_000 });
      const labels = await placedLabels(page, frame);
      if (name === "1440") expect(labels).toContain("Quillford Water Reclamation Plant");
      expect(await page.getByTestId("map-legend").innerText()).toContain("outfall");
      await page.screenshot({ path: `${SHOTS}/maps-review-${name}.png`, fullPage: true });
      await page.close();
    }
  });
});
