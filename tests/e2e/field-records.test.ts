import { mkdirSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { demoUserPage, launchBrowser, noSidewaysScroll } from "./support/browser";

/**
 * Field records beyond flows and surveys, in the browser: a daily water-temperature record on
 * the Gauges tab and a condition's design temperature from it; a survey with measured flow,
 * velocity and depth fitting a reach's hydraulic geometry from the survey page.
 */
const baseUrl = inject("baseUrl");
const SHOTS = "test-results/screens";
let browser: Browser;
let basinId: string;
const dir = join(tmpdir(), `sagline-e2e-field-${process.pid}`);

const signedIn = (key: string, width: number): Promise<Page> => demoUserPage(browser, baseUrl, key, width);

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  mkdirSync(dir, { recursive: true });
  browser = await launchBrowser();
  const page = await signedIn("planner", 1440);
  const basins = (await (await page.request.get(`${baseUrl}/api/basins`)).json()) as { id: string; slug: string }[];
  basinId = basins.find((b) => b.slug === "tamsel-river")!.id;
  await page.context().close();
});
afterAll(async () => {
  await browser?.close();
});

/** 1 June – 30 September 2025, day i at 10 + i/10 °C: the 90th percentile (type 7) is 10 + 121·0.9/10 = 20.89 °C exactly. */
function summerCsv(): string {
  const rows = ["date,temperature"];
  const start = Date.UTC(2025, 5, 1);
  for (let i = 0; i < 122; i++) rows.push(`${new Date(start + i * 86_400_000).toISOString().slice(0, 10)},${(10 + i / 10).toFixed(1)}`);
  return rows.join("\n");
}

describe("a water-temperature record", () => {
  it("is uploaded on the Gauges tab, listed with its summer 90th percentile, and gives a condition its design temperature with the rule", async () => {
    const page = await signedIn("planner", 1440);
    await page.goto(`${baseUrl}/basins/${basinId}/gauges`);
    const file = join(dir, "quillford-temperature.csv");
    writeFileSync(file, summerCsv());
    const form = page.locator("form[aria-label='Upload a daily water-temperature record']");
    await form.getByLabel("Water-temperature file").setInputFiles(file);
    await form.getByLabel("Record name").fill("Quillford water temperature (test)");
    await form.getByRole("button", { name: "Upload the temperature record" }).click();
    await expect.poll(() => form.textContent()).toMatch(/Saved Quillford water temperature \(test\): 122 days\./);
    const table = page.getByTestId("temperature-table");
    await expect.poll(() => table.textContent()).toContain("Quillford water temperature (test)");
    // the demo basin shows SI: 20.89 °C to one decimal
    const row = table.locator("tr", { hasText: "Quillford water temperature (test)" });
    expect(await row.locator("td.num").textContent()).toBe("20.9");
    await page.screenshot({ path: `${SHOTS}/temperature-records-1440.png`, fullPage: true });

    // a new scenario takes its condition's temperature from the record at the 90th percentile
    await page.goto(`${baseUrl}/basins/${basinId}/scenarios`);
    await page.getByLabel("New scenario on the newest network").fill("Temperature from the record (test)");
    await page.getByRole("button", { name: "Create scenario" }).click();
    await page.waitForURL(/\/scenarios\/[0-9a-f-]{36}$/);
    const scenarioId = page.url().split("/").at(-1)!;
    const choice = page.getByLabel("or from a temperature record").first();
    await choice.waitFor();
    const label = (await choice.locator("option").allTextContents()).find((t) => t.startsWith("Quillford water temperature (test)"))!;
    expect(label).toMatch(/June–September 90th percentile 20\.9 °C/);
    await choice.selectOption({ label });
    await page.getByRole("button", { name: "Save changes" }).click();
    await page.getByText("Saved (version 2).").waitFor();
    await expect.poll(() => page.getByTestId("temperature-source-0").textContent()).toBe(
      "From Quillford water temperature (test): 90th percentile of June–September daily means, 122 days (2025-06-01 to 2025-09-30)",
    );
    const saved = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/scenarios/${scenarioId}`)).json()) as { inputs: { conditions: { temperatureC: number }[] } };
    expect(saved.inputs.conditions[0].temperatureC).toBe(20.89);
    await page.context().close();
  });
});

describe("hydraulic geometry from a survey's measurements", () => {
  it("is fitted on the survey page for a reach measured at several flows and written on the reach", async () => {
    const page = await signedIn("planner", 1440);
    await page.goto(`${baseUrl}/basins/${basinId}/surveys`);
    // U = 0.3·Q^0.4 and H = 0.5·Q^0.35 at three flows on TR-06, DO alongside
    const rows = [0.5, 1, 2].map((q, i) => `HG${i},TR-06,${0.4 + 0.8 * i},${q},${(0.3 * q ** 0.4).toPrecision(10)},${(0.5 * q ** 0.35).toPrecision(10)},6.${i}`);
    const file = join(dir, "gaugings.csv");
    writeFileSync(file, ["station,reach,km,flow,velocity,depth,do", ...rows].join("\n"));
    await page.getByLabel("Survey file").setInputFiles(file);
    await page.getByLabel("Survey name").fill("Current-meter gaugings on TR-06 (test)");
    await page.getByRole("button", { name: "Upload and place the stations" }).click();
    await page.waitForURL(/\/surveys\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    const fit = page.getByTestId("hydraulic-fit");
    await fit.getByRole("button", { name: "Fit and use on TR-06" }).click();
    await expect.poll(() => page.getByTestId("hydraulic-fit-TR-06").textContent()).toMatch(/^U = 0\.3000·Q\^0\.400 \(r² 1\.000\), H = 0\.5000·Q\^0\.350 \(r² 1\.000\) — saved on the reach$/);
    await page.screenshot({ path: `${SHOTS}/hydraulic-fit-1440.png`, fullPage: true });
    const network = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/networks/latest`)).json()) as { reaches: { id: string; attributes: Record<string, number> }[] };
    const tr06 = network.reaches.find((r) => r.id === "TR-06")!.attributes;
    expect(tr06.hgVelocityCoef).toBeCloseTo(0.3, 8);
    expect(tr06.hgDepthExp).toBeCloseTo(0.35, 8);
    await page.setViewportSize({ width: 390, height: 844 });
    await page.reload();
    expect(await noSidewaysScroll(page)).toBe(true);
    await page.screenshot({ path: `${SHOTS}/hydraulic-fit-390.png`, fullPage: true });
    // clear it again, so the demo network's other tests see TR-06 as it was
    const net = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/networks/latest`)).json()) as { id: string };
    const cleared = await page.request.patch(`${baseUrl}/api/basins/${basinId}/networks/${net.id}/reaches/TR-06`, {
      data: { hgVelocityCoef: null, hgVelocityExp: null, hgDepthCoef: null, hgDepthExp: null },
      headers: { origin: baseUrl },
    });
    expect(cleared.status()).toBe(204);
    await page.context().close();
  });
});
