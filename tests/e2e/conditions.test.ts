import { mkdirSync } from "node:fs";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { DEMO_USERS } from "@/db/seed/demo-data";
import { launchBrowser, signInAs } from "./support/browser";

const baseUrl = inject("baseUrl");
const SHOTS = "test-results/screens";
let browser: Browser;
let page: Page;
let basinId: string;
const runIds: Record<"model" | "allocation" | "other", string> = { model: "", allocation: "", other: "" };

const planner = DEMO_USERS.find((u) => u.key === "planner")!;

/** Two design conditions on the demo network's stressed loads (invented, for the test only). */
const SCENARIO = {
  name: "Two critical conditions",
  inputs: {
    conditions: [
      { name: "Design low flow", flowScale: 1, temperatureC: 25 },
      { name: "Hot, dry 7Q10", flowScale: 0.75, temperatureC: 27.5 },
    ],
    dischargers: { "DP-1003": { designFlowM3s: 0.6, bod5MgL: 45 }, "DP-1004": { designFlowM3s: 0.2, bod5MgL: 120 } },
  },
};

type RunRead = { status: string; result: { conditions: { name: string; run: { minimum: { do_mg_l: number } } }[] } | null };

async function runToEnd(scenarioId: string, kind: "model" | "allocation"): Promise<string> {
  const res = await page.request.post(`${baseUrl}/api/basins/${basinId}/scenarios/${scenarioId}/runs`, { data: { kind } });
  expect(res.status()).toBeLessThan(300);
  const { id } = (await res.json()) as { id: string };
  const deadline = Date.now() + 60_000;
  for (;;) {
    const s = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/runs/${id}/status`)).json()) as { status: string };
    if (s.status === "done") return id;
    if (s.status === "failed" || Date.now() > deadline) throw new Error(`run ${id} ended ${s.status}`);
    await page.waitForTimeout(300);
  }
}

const lowest = async (id: string) => {
  const run = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/runs/${id}`)).json()) as RunRead;
  return run.result!.conditions.map((c) => ({ name: c.name, do: c.run.minimum.do_mg_l }));
};

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
  await signInAs(page, baseUrl, planner.email, planner.password);
  const basins = (await (await page.request.get(`${baseUrl}/api/basins`)).json()) as { id: string; slug: string }[];
  basinId = basins.find((b) => b.slug === "tamsel-river")!.id;
  // the seeded network (version 1): other browser tests import and edit later versions of the demo basin's network
  const versions = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/networks`)).json()) as { id: string; version: number }[];
  const networkId = versions.find((v) => v.version === 1)!.id;
  const created = await page.request.post(`${baseUrl}/api/basins/${basinId}/scenarios`, { data: { ...SCENARIO, networkId } });
  expect(created.status()).toBe(201);
  const { id } = (await created.json()) as { id: string };
  runIds.model = await runToEnd(id, "model");
  runIds.allocation = await runToEnd(id, "allocation");
  // the same river under another rule, for the inputs that differ
  const other = await page.request.post(`${baseUrl}/api/basins/${basinId}/scenarios`, {
    data: { name: "Two conditions, equal cuts", networkId, inputs: { ...SCENARIO.inputs, allocation: { objective: "equal-percent", mosDoMgL: 0.2 } } },
  });
  expect(other.status()).toBe(201);
  runIds.other = await runToEnd(((await other.json()) as { id: string }).id, "allocation");
}, 200_000);
afterAll(async () => {
  await browser?.close();
});

describe("a scenario with two critical conditions", () => {
  it("stores DO under both conditions for the allocation too, and the hot, dry one is lower", async () => {
    for (const id of [runIds.model, runIds.allocation]) {
      const c = await lowest(id);
      expect(c.map((x) => x.name)).toEqual(["Design low flow", "Hot, dry 7Q10"]);
      expect(c[1].do).toBeLessThan(c[0].do);
    }
  });

  it("headlines the run with the governing condition, named, and shows it on the map and profile first", async () => {
    const [, hot] = await lowest(runIds.model);
    await page.goto(`${baseUrl}/basins/${basinId}/runs/${runIds.model}`);
    await page.getByTestId("run-results").waitFor();
    const headline = await page.getByTestId("run-headline").textContent();
    expect(headline).toBe(`Lowest DO ${hot.do.toFixed(2)} mg/L under “Hot, dry 7Q10” (governing)`);
    const rows = page.getByTestId("condition-summary").locator("tbody tr");
    expect(await rows.count()).toBe(2);
    expect(await rows.nth(0).textContent()).toMatch(/Design low flow.*meets/);
    // 4.78 mg/L under a 5.0 criterion: fails
    expect(await rows.nth(1).textContent()).toMatch(/Hot, dry 7Q10.*governing.*fails/);
    expect(await page.getByLabel("Condition on the map and profile").inputValue()).toBe("1");
    await page.getByRole("heading", { name: "DO along the river under “Hot, dry 7Q10”" }).waitFor();
    await page.locator('[data-testid="run-results"] [data-ready="true"]').waitFor({ timeout: 30_000 });
    // choosing the other condition redraws the profile under it
    await page.getByLabel("Condition on the map and profile").selectOption("0");
    await page.getByRole("heading", { name: "DO along the river under “Design low flow”" }).waitFor();
    await page.getByLabel("Condition on the map and profile").selectOption("1");
    await page.waitForTimeout(500);
    await page.screenshot({ path: `${SHOTS}/run-two-conditions-1440.png`, fullPage: true });
    await page.setViewportSize({ width: 390, height: 844 });
    await page.waitForTimeout(500);
    await page.screenshot({ path: `${SHOTS}/run-two-conditions-390.png`, fullPage: true });
    await page.setViewportSize({ width: 1440, height: 900 });
  });

  it("names the conditions in the binding table of the allocation run", async () => {
    await page.goto(`${baseUrl}/basins/${basinId}/runs/${runIds.allocation}`);
    await page.getByTestId("run-results").waitFor();
    expect(await page.getByTestId("run-headline").textContent()).toMatch(/under “Hot, dry 7Q10” \(governing\)$/);
    const binding = await page.getByTestId("binding-table").textContent();
    expect(binding).toMatch(/Hot, dry 7Q10/);
    expect(binding).not.toMatch(/\bbase\b/);
    await page.screenshot({ path: `${SHOTS}/run-two-conditions-allocation-1440.png`, fullPage: true });
  });

  it("compares the two runs: governing condition, a row per condition with meets/fails, inputs, names and the overlaid profiles", async () => {
    await page.goto(`${baseUrl}/basins/${basinId}/compare?runs=${runIds.model},${runIds.allocation},${runIds.other}`);
    const table = page.getByTestId("comparison-table");
    await table.waitFor();
    const cells = await table.getByTestId("governing-cell").allTextContents();
    expect(cells).toHaveLength(3);
    for (const c of cells) expect(c).toMatch(/under “Hot, dry 7Q10”/);
    const hotRow = table.locator("tr", { hasText: "Lowest DO under “Hot, dry 7Q10”" });
    // the third run's MOS asks for more than equal cuts can give: no allocation, so DO at today's loads, failing
    const other = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/runs/${runIds.other}`)).json()) as { result: { allocation: { feasible: boolean } } };
    expect(await hotRow.textContent()).toMatch(other.result.allocation.feasible ? /fails.*meets.*meets/ : /fails.*meets.*fails/);
    // the inputs that differ: the second allocation's rule and margin
    expect(await table.locator("tr", { hasText: /^Objective\s*—\s*Most total load\s*Equal percent removal$/ }).count()).toBe(1);
    expect(await table.locator("tr", { hasText: /^Margin of safety \(DO\)\s*—\s*0 mg\/L\s*0\.2 mg\/L$/ }).count()).toBe(1);
    const text = (await table.textContent()) ?? "";
    expect(text).not.toMatch(/-0\.0|0\.000 %|max-total/);
    expect(text).toMatch(/Most total load/);
    // facility names beside permit ids
    expect(text).toMatch(/DP-1003/);
    expect(await table.locator("td", { hasText: /DP-1003/ }).first().textContent()).not.toBe("DP-1003");
    const overlay = page.getByTestId("profile-overlay");
    await overlay.locator("svg path").first().waitFor();
    expect(await overlay.locator(".recharts-line").count()).toBe(3);
    await page.waitForTimeout(500);
    await page.screenshot({ path: `${SHOTS}/compare-two-conditions-1440.png`, fullPage: true });
    await page.setViewportSize({ width: 390, height: 844 });
    await page.waitForTimeout(500);
    await page.screenshot({ path: `${SHOTS}/compare-two-conditions-390.png`, fullPage: true });
    await page.setViewportSize({ width: 1440, height: 900 });
  });
});
