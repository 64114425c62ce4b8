import { mkdirSync, readFileSync } from "node:fs";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { DEMO_USERS } from "@/db/seed/demo-data";
import { launchBrowser, signInAs } from "./support/browser";

const baseUrl = inject("baseUrl");
const SHOTS = "test-results/screens";
let browser: Browser;
let basinId: string;
let planUrl: string;

const user = (key: string) => DEMO_USERS.find((u) => u.key === key)!;
async function pageAs(key: string): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  await signInAs(page, baseUrl, user(key).email, user(key).password);
  return page;
}

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("a plan under review in the browser", () => {
  it("the planner proposes a plan from a finished allocation run", async () => {
    const page = await pageAs("planner");
    const api = (path: string, data?: unknown) =>
      data === undefined ? page.request.get(`${baseUrl}/api${path}`) : page.request.post(`${baseUrl}/api${path}`, { data });
    const basins = (await (await api("/basins")).json()) as { id: string; slug: string }[];
    basinId = basins.find((b) => b.slug === "tamsel-river")!.id;
    const scenario = (await (await api(`/basins/${basinId}/scenarios`, { name: "Plan basis", inputs: { conditions: [{ name: "7Q10" }] } })).json()) as { id: string };
    const run = (await (await api(`/basins/${basinId}/scenarios/${scenario.id}/runs`, { kind: "allocation" })).json()) as { id: string };
    await page.goto(`${baseUrl}/basins/${basinId}/runs/${run.id}`);
    await page.getByTestId("run-results").waitFor({ timeout: 60_000 });
    await page.getByRole("button", { name: "Propose plan" }).click();
    await page.waitForURL(/\/plans\/[0-9a-f-]{36}$/);
    planUrl = page.url();
    expect(await page.getByTestId("plan-status").textContent()).toMatch(/draft/);
    expect(await page.getByTestId("plan-allocations").locator("tbody tr").count()).toBe(5);
    await page.close();
  });

  it("a stakeholder cannot see the draft", async () => {
    const page = await pageAs("stakeholder");
    await page.goto(planUrl);
    await page.getByRole("heading", { name: "Not available to you" }).waitFor();
    await page.close();
  });

  it("the lead opens the review; the discharger and a stakeholder comment; the planner responds", async () => {
    const lead = await pageAs("lead");
    await lead.goto(planUrl);
    await lead.getByLabel("Time zone").fill("America/Chicago");
    await lead.getByRole("button", { name: "Open the review" }).click();
    await lead.getByTestId("plan-status").filter({ hasText: "in review" }).waitFor();
    await lead.close();

    const discharger = await pageAs("discharger");
    await discharger.goto(planUrl);
    const own = discharger.getByRole("article", { name: /Quillford Water Reclamation Plant/ });
    await own.getByLabel(/Comment on/).fill("We need until 2028 to upgrade.\n<b>Not bold</b>");
    await own.getByRole("button", { name: "Add comment" }).click();
    await own.getByText("Not bold", { exact: false }).waitFor();
    expect(await own.locator("b").count()).toBe(0);
    await discharger.screenshot({ path: `${SHOTS}/plan-review-discharger.png`, fullPage: true });
    await discharger.close();

    const stakeholder = await pageAs("stakeholder");
    await stakeholder.goto(planUrl);
    const whole = stakeholder.getByRole("article", { name: "Thread: The plan as a whole" });
    await whole.getByLabel(/Comment on/).fill("Please keep the river fishable in August.");
    await whole.getByRole("button", { name: "Add comment" }).click();
    await whole.getByText("stakeholder ·", { exact: false }).waitFor();
    await stakeholder.close();

    const planner = await pageAs("planner");
    await planner.goto(planUrl);
    const thread = planner.getByRole("article", { name: /Quillford Water Reclamation Plant/ });
    await thread.getByLabel(/Response/).fill("A compliance schedule to 2028 is proposed.");
    await thread.getByRole("button", { name: "Respond" }).click();
    await thread.getByText("addressed", { exact: true }).waitFor();
    const download = planner.waitForEvent("download");
    await planner.getByRole("button", { name: "Download the responsiveness summary (CSV)" }).click();
    const csv = readFileSync(await (await download).path(), "utf8");
    expect(csv.split(/\r?\n/)[0]).toMatch(/^# Planning-level estimates/);
    expect(csv).toMatch(/We need until 2028 to upgrade/);
    expect(csv).toMatch(/A compliance schedule to 2028 is proposed/);
    await planner.screenshot({ path: `${SHOTS}/plan-review-planner.png`, fullPage: true });
    await planner.close();
  });
});
