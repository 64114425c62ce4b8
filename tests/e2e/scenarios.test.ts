import Papa from "papaparse";
import { mkdirSync, readFileSync } from "node:fs";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { DEMO_USERS } from "@/db/seed/demo-data";
import { inkPixels } from "./support/pixels";
import { launchBrowser, signInAs } from "./support/browser";

const baseUrl = inject("baseUrl");
const SHOTS = "test-results/screens";
let browser: Browser;
let page: Page;
let basinId: string;

const user = (key: string) => DEMO_USERS.find((u) => u.key === key)!;

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
  await signInAs(page, baseUrl, user("planner").email, user("planner").password);
  const basins = (await (await page.request.get(`${baseUrl}/api/basins`)).json()) as { id: string; slug: string }[];
  basinId = basins.find((b) => b.slug === "tamsel-river")!.id;
});
afterAll(async () => {
  await browser?.close();
});

async function runAndOpen(kind: "model" | "allocation"): Promise<void> {
  await page.getByRole("button", { name: kind === "model" ? "Run the model on today's loads" : "Run the allocation" }).click();
  await page.locator('[data-testid="run-progress"][data-status="done"]').waitFor({ timeout: 60_000 });
  await page.getByRole("link", { name: "see the results" }).click();
  await page.getByTestId("run-results").waitFor();
  await page.locator('[data-testid="run-results"] [data-ready="true"]').waitFor({ timeout: 30_000 });
  await page.waitForTimeout(700);
}

describe("scenarios, runs and results in the browser", () => {
  let scenarioUrl: string;

  it("creates a scenario and edits a critical condition (saved with a new version)", async () => {
    await page.goto(`${baseUrl}/basins/${basinId}/scenarios`);
    await page.getByLabel("New scenario on the newest network").fill("Hot August low flow");
    await page.getByRole("button", { name: "Create scenario" }).click();
    await page.waitForURL(/\/scenarios\/[0-9a-f-]{36}$/);
    scenarioUrl = page.url();
    await page.getByLabel("Design temperature (°C)").first().fill("28");
    await page.getByLabel("Flow scale (× design flow)").first().fill("0.6");
    await page.getByRole("button", { name: /Show per-reach design flows and rates/ }).click();
    await page.getByTestId("reach-inputs").getByLabel("k_d of TR-03").fill("0.4");
    await page.getByRole("button", { name: "Save changes" }).click();
    await page.getByText("Saved (version 2).").waitFor();
    const saved = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/scenarios/${scenarioUrl.split("/").at(-1)}`)).json()) as {
      inputs: { reachOverrides: Record<string, { kd20PerDay?: number | null }>; conditions: { temperatureC: number | null; flowScale: number }[] };
    };
    expect(saved.inputs.reachOverrides["TR-03"].kd20PerDay).toBe(0.4);
    expect(saved.inputs.conditions[0]).toMatchObject({ temperatureC: 28, flowScale: 0.6 });
    await page.screenshot({ path: `${SHOTS}/scenario-editor.png`, fullPage: true });
  });

  it("runs the model: the map and the DO profile are drawn, with the caution", async () => {
    await runAndOpen("model");
    expect(await page.getByTestId("planning-caution").textContent()).toMatch(/qualified \(licensed\) engineer/);
    expect(await inkPixels(page, '[data-testid="run-results"] [data-ready="true"]')).toBeGreaterThan(2000);
    const chart = page.getByTestId("profile-chart");
    await chart.locator("svg path").first().waitFor();
    expect(await inkPixels(page, '[data-testid="profile-chart"]')).toBeGreaterThan(1500);
    await page.screenshot({ path: `${SHOTS}/run-model-results.png`, fullPage: true });
  });

  it("runs the allocation: facility table, TMDL and a CSV that carries the caution", async () => {
    await page.goto(scenarioUrl);
    await runAndOpen("allocation");
    const table = page.locator("section", { has: page.getByRole("heading", { name: /^Allocation/ }) });
    expect(await table.locator("tbody tr").count()).toBe(5);
    await page.getByRole("heading", { name: "TMDL" }).waitFor();
    const download = page.waitForEvent("download");
    await table.getByRole("button", { name: "Download CSV" }).click();
    const csv = readFileSync(await (await download).path(), "utf8");
    // one header row; the caution first in the last column, Notes (docs/exports.md)
    const parsed = Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields?.[0]).toBe("Permit id");
    expect(parsed.data[0].Notes).toMatch(/^Planning-level estimates/);
    expect(csv).toMatch(/DP-1001/);
    await page.screenshot({ path: `${SHOTS}/run-allocation-results.png`, fullPage: true });
  });

  it("compares the two runs side by side", async () => {
    await page.goto(`${baseUrl}/basins/${basinId}/scenarios`);
    const boxes = page.getByTestId("run-table").getByRole("checkbox", { name: /Hot August low flow/ });
    await boxes.nth(0).check();
    await boxes.nth(1).check();
    await page.getByRole("button", { name: /Compare 2 runs/ }).click();
    await page.waitForURL(/\/compare\?runs=/);
    await page.getByTestId("planning-caution").waitFor();
    const text = await page.locator("main").textContent();
    expect(text).toMatch(/Hot August low flow · model/);
    expect(text).toMatch(/Hot August low flow · allocation/);
    await page.screenshot({ path: `${SHOTS}/compare-runs.png`, fullPage: true });
  });

  it("shows the same results in US customary units when the basin uses them", async () => {
    const lead = await browser.newPage();
    await signInAs(lead, baseUrl, user("lead").email, user("lead").password);
    const set = (unitSystem: "US" | "SI") => lead.request.patch(`${baseUrl}/api/basins/${basinId}`, { data: { unitSystem } });
    expect((await set("US")).status()).toBe(200);
    try {
      await page.goBack();
      await page.goto(page.url().includes("/runs/") ? page.url() : `${baseUrl}/basins/${basinId}/scenarios`);
      const runs = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/runs`)).json()) as { id: string; kind: string; status: string }[];
      const allocation = runs.find((r) => r.kind === "allocation" && r.status === "done")!;
      await page.goto(`${baseUrl}/basins/${basinId}/runs/${allocation.id}`);
      await page.getByTestId("run-results").waitFor();
      const text = await page.getByTestId("run-results").textContent();
      expect(text).toMatch(/lb\/d/);
      expect(text).toMatch(/\(mi\)/);
      await page.screenshot({ path: `${SHOTS}/run-allocation-results-us.png`, fullPage: true });
    } finally {
      expect((await set("SI")).status()).toBe(200);
      await lead.close();
    }
  });
});
