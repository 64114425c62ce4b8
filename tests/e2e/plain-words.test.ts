import { mkdirSync, readFileSync } from "node:fs";
import Papa from "papaparse";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDb, type Db } from "@/db/client";
import { stopBoss } from "@/lib/jobs/queue";
import { addComment, respondToThread } from "@/lib/services/plans";
import { planAt } from "../support/plan-fixture";
import { buildWorld, WORLD_PASSWORD, type World } from "../support/world";
import { launchBrowser, signInAs } from "./support/browser";
import { scoped } from "../support/scoped";

/**
 * Plain words and sensible numbers in the browser: the audit trail reads as sentences and
 * links a comment to its thread, a run's reach table names its reaeration formulas and
 * rounds k_a, the binding checkpoints state DO gained per 1000 kg/d, and a discharger
 * refused the network page reads who may open it. Screenshots at 1440 and 390 px.
 */
const baseUrl = inject("baseUrl");
const SHOTS = "test-results/screens";
const SIZES = [
  { width: 1440, height: 900 },
  { width: 390, height: 844 },
] as const;
let browser: Browser;
let db: Db;
let w: World;
let plan: Awaited<ReturnType<typeof planAt>>;

const CODES = /\b(comment\.added|thread\.addressed|plan\.proposed|review\.opened|oconnor-dobbins|owens-gibbs|tsivoglou-neal|depth-velocity|max-total|scenario\.read)\b/;

async function pageAs(email: string, viewport: (typeof SIZES)[number]): Promise<Page> {
  const page = await browser.newPage({ viewport });
  await signInAs(page, baseUrl, email, WORLD_PASSWORD);
  return page;
}

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  process.env.DATABASE_URL = inject("e2eDatabaseUrl");
  db = createDb(inject("e2eDatabaseUrl"), 2);
  w = await buildWorld(db);
  plan = await planAt(db, w, "review");
  await scoped(addComment)(db, w.users.stakeholder, w.basinId, plan.planThreadId, "Will the August survey be used?");
  await scoped(respondToThread)(db, w.users.planner, w.basinId, plan.planThreadId, "Yes, for calibration.");
  browser = await launchBrowser();
}, 120_000);
afterAll(async () => {
  await browser?.close();
  await stopBoss();
  await db?.destroy();
});

describe("plain words and numbers", () => {
  it("the audit trail says what happened in words and links the comment to its thread", async () => {
    for (const size of SIZES) {
      const page = await pageAs(w.users.lead.email, size);
      await page.goto(`${baseUrl}/basins/${w.basinId}/audit?area=plans`);
      const table = page.getByTestId("audit-table");
      const text = (await table.textContent()) ?? "";
      expect(text).toContain("Commented in a thread");
      expect(text).toContain("Answered a thread");
      expect(text).toContain("Proposed a plan");
      expect(text).not.toMatch(CODES);
      await table.screenshot({ path: `${SHOTS}/audit-trail-${size.width}.png` });
      const link = table.getByRole("link", { name: "thread" }).locator("visible=true").first();
      expect(await link.getAttribute("href")).toBe(`/basins/${w.basinId}/plans/${plan.planId}#thread-${plan.planThreadId}`);
      if (size.width === 1440) {
        await link.click();
        await page.waitForURL(`${baseUrl}/basins/${w.basinId}/plans/${plan.planId}#thread-${plan.planThreadId}`);
        await page.locator(`#thread-${plan.planThreadId}`).waitFor();
      }
      await page.close();
    }
  });

  it("a run's reach table names the reaeration formulas and gives k_a to 3 significant figures; binding checkpoints per 1000 kg/d", async () => {
    for (const size of SIZES) {
      const page = await pageAs(w.users.planner.email, size);
      await page.goto(`${baseUrl}/basins/${w.basinId}/runs/${plan.runId}`);
      const reaches = page.getByTestId("reach-results-table");
      await reaches.waitFor({ timeout: 30_000 });
      const text = (await reaches.textContent()) ?? "";
      expect(text).toMatch(/O'Connor–Dobbins|Churchill–Elmore–Buckingham|Owens–Edwards–Gibbs|Tsivoglou–Neal|Given rate coefficient/);
      expect(text).not.toMatch(CODES);
      expect(text).not.toMatch(/k_a from/i);
      // the k_a column: every figure has at most 3 significant digits
      const header = await reaches.locator("thead th").allTextContents();
      const ka = header.findIndex((h) => /k_a \(1\/d\)/.test(h));
      for (const cell of await reaches.locator(`tbody tr td:nth-child(${ka + 1})`).allTextContents())
        for (const figure of cell.split("–")) expect(figure.replace(/^0\.0*/, "").replace(".", "").length, cell).toBeLessThanOrEqual(3);
      await reaches.screenshot({ path: `${SHOTS}/run-reach-table-${size.width}.png` });
      const binding = page.getByTestId("binding-table");
      if (await binding.count()) {
        expect(await binding.textContent()).toMatch(/per 1000 (kg|lb)\/d given up/);
        await binding.screenshot({ path: `${SHOTS}/run-binding-table-${size.width}.png` });
      }
      expect(await page.locator("main").textContent()).not.toMatch(/CONDITION: base|\bbase\b.*\(governing\)/);
      await page.close();
    }
  });

  it("the plan's downloads: the allocation CSV opens in papaparse with one header row and the caution in Notes; each GeoJSON layer is one kind of feature", async () => {
    for (const size of SIZES) {
      const page = await pageAs(w.users.planner.email, size);
      await page.goto(`${baseUrl}/basins/${w.basinId}/plans/${plan.planId}`);
      const card = page.getByTestId("plan-downloads");
      await card.waitFor();
      await card.screenshot({ path: `${SHOTS}/plan-downloads-${size.width}.png` });
      if (size.width === 1440) {
        const file = async (name: string) => {
          const d = page.waitForEvent("download");
          await card.getByRole("link", { name, exact: true }).click();
          const got = await d;
          return { name: got.suggestedFilename(), text: readFileSync(await got.path(), "utf8") };
        };
        const csv = await file("Allocations (CSV)");
        expect(csv.name).toMatch(/-plan-v1-draft-allocations\.csv$|-plan-v1-allocations\.csv$/);
        const parsed = Papa.parse<Record<string, string>>(csv.text, { header: true, skipEmptyLines: true });
        expect(parsed.errors).toEqual([]);
        expect(parsed.meta.fields?.[0]).toBe("Permit id");
        expect(parsed.meta.fields?.at(-1)).toBe("Notes");
        expect(parsed.data[0].Notes).toMatch(/^Planning-level estimates only/);
        expect(parsed.data.map((r) => r.Notes).join(" ")).toMatch(/DRAFT — not published \(in review\)/);
        for (const [name, kind] of [
          ["Reaches with results (GeoJSON)", "reach"],
          ["Dischargers with allocations (GeoJSON)", "discharger"],
          ["DO along each reach, in pieces (GeoJSON)", "piece"],
        ] as const) {
          const g = JSON.parse((await file(name)).text) as { features: { properties: { kind: string } }[] };
          expect(g.features.length).toBeGreaterThan(0);
          expect(new Set(g.features.map((f) => f.properties.kind))).toEqual(new Set([kind]));
        }
      }
      await page.close();
    }
  });

  it("a discharger refused the network page reads, in a sentence, who may open it", async () => {
    const page = await pageAs(w.users.discharger.email, SIZES[1]);
    await page.goto(`${baseUrl}/basins/${w.basinId}/network`);
    const main = page.locator("main");
    await main.getByText("Only the basin's planners and lead can see the network, scenarios and runs").waitFor();
    expect(await main.textContent()).not.toMatch(/does not allow|scenario\.read/);
    await page.screenshot({ path: `${SHOTS}/refusal-network-390.png` });
    await page.close();
  });
});
