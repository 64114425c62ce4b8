import { mkdirSync } from "node:fs";
import { sql } from "kysely";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDb, type Db } from "@/db/client";
import { stopBoss } from "@/lib/jobs/queue";
import { closeDueReviews, openReview, proposePlan, publishPlan } from "@/lib/services/plans";
import { createRun, processRun } from "@/lib/services/runs";
import { createScenario } from "@/lib/services/scenarios";
import { scenarioCreateSchema } from "@/lib/validation/scenario";
import { readerBasin } from "../support/reader-plans";
import { buildWorld, WORLD_PASSWORD, type World, type WorldUserKey } from "../support/world";
import { launchBrowser, signInAs } from "./support/browser";
import { scoped } from "../support/scoped";

/**
 * The main pages on a phone (390 × 844), each in a role that reads it, signed out too:
 * none may be wider than the screen (document.documentElement.scrollWidth <= innerWidth).
 * A page that overflows names the elements whose right edge passes the screen's, so the
 * failure says where to look. Also: the not-found page and the loading skeleton.
 */
const baseUrl = inject("baseUrl");
const SHOTS = "test-results/screens";
const PHONE = { width: 390, height: 844 };
let browser: Browser;
let db: Db;
let w: World;
let inReview: { planId: string; runId: string; scenarioId: string };
let published: { planId: string };
let scenarioId: string;
const WIDE = { width: 1440, height: 900 };
const contexts = new Map<string, BrowserContext>();

async function phonePage(who: WorldUserKey | "signedOut", viewport = PHONE): Promise<Page> {
  let context = contexts.get(`${who}-${viewport.width}`);
  if (!context) {
    context = await browser.newContext({ viewport, deviceScaleFactor: 1 });
    contexts.set(`${who}-${viewport.width}`, context);
    if (who !== "signedOut") {
      const page = await context.newPage();
      await signInAs(page, baseUrl, w.users[who].email, WORLD_PASSWORD);
      await page.close();
    }
  }
  return context.newPage();
}

interface Overflow {
  scrollWidth: number;
  innerWidth: number;
  /** The outermost elements whose right edge is past the screen's, described by tag, test id and class. */
  culprits: string[];
}

async function measure(page: Page): Promise<Overflow> {
  return page.evaluate(() => {
    const innerWidth = window.innerWidth;
    const culprits: string[] = [];
    const describe = (el: Element) => {
      const id = el.getAttribute("data-testid");
      const cls = (el.getAttribute("class") ?? "").slice(0, 80);
      return `${el.tagName.toLowerCase()}${id ? `[data-testid=${id}]` : ""}${cls ? `.${cls}` : ""} → ${Math.round(el.getBoundingClientRect().right)}px`;
    };
    const walk = (el: Element) => {
      const style = getComputedStyle(el);
      const r = el.getBoundingClientRect();
      if (r.right > innerWidth + 0.5 && style.position !== "fixed") {
        // report the deepest element that overflows on its own (none of its children explain it)
        const kids = [...el.children].filter((c) => c.getBoundingClientRect().right > innerWidth + 0.5);
        if (kids.length === 0 && culprits.length < 8) culprits.push(describe(el));
      }
      // content scrolling inside its own box cannot widen the page
      if (style.overflowX === "auto" || style.overflowX === "scroll" || style.overflowX === "hidden" || style.overflowX === "clip") return;
      for (const c of el.children) walk(c);
    };
    walk(document.body);
    return { scrollWidth: document.documentElement.scrollWidth, innerWidth, culprits };
  });
}

async function expectNoSidewaysScroll(page: Page, name: string, prefix = "phone") {
  await page.waitForLoadState("networkidle").catch(() => undefined);
  await page.screenshot({ path: `${SHOTS}/${prefix}-${name}.png`, fullPage: true });
  const m = await measure(page);
  expect(m.scrollWidth <= m.innerWidth, `${name}: ${m.scrollWidth}px wide on a ${m.innerWidth}px screen; ${m.culprits.join("; ")}`).toBe(true);
}

/**
 * A plan of the demo allocation taken to review (and on to publication), as readerPlan
 * does it, but waiting for the run: the browser tests' worker may take the run first.
 */
async function planAt(stage: "open" | "published", title: string) {
  const scenario = await scoped(createScenario)(db, w.users.planner, w.basinId, scenarioCreateSchema.parse({ name: `Phone basis ${title}`, inputs: { conditions: [{ name: "7Q10" }] } }));
  const run = await scoped(createRun)(db, w.users.planner, w.basinId, scenario.id, "allocation");
  await processRun(db, run.id);
  for (let i = 0; i < 240; i++) {
    const { status } = await db.selectFrom("runs").select("status").where("id", "=", run.id).executeTakeFirstOrThrow();
    if (status === "done") break;
    if (status === "failed") throw new Error(`the fixture's allocation run failed`);
    await new Promise((r) => setTimeout(r, 250));
  }
  const plan = await scoped(proposePlan)(db, w.users.planner, w.basinId, { runId: run.id, title });
  const now = Date.now();
  await scoped(openReview)(db, w.users.lead, w.basinId, plan.id, {
    startsAt: new Date(now - 60_000).toISOString(),
    endsAt: new Date(now + 31 * 86_400_000).toISOString(),
    timeZone: "America/Chicago",
  });
  if (stage === "published") {
    await closeDueReviews(db, new Date(Date.now() + 32 * 86_400_000));
    await scoped(publishPlan)(db, w.users.lead, w.basinId, plan.id);
  }
  return { planId: plan.id, runId: run.id, scenarioId: scenario.id };
}

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  process.env.DATABASE_URL = inject("e2eDatabaseUrl");
  db = createDb(inject("e2eDatabaseUrl"), 2);
  w = await buildWorld(db);
  await readerBasin(db, w);
  published = await planAt("published", "Phone check: DO plan for the summer low-flow season");
  inReview = await planAt("open", "Phone check: DO plan, revised");
  scenarioId = inReview.scenarioId;
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await stopBoss();
  await db?.destroy();
});

const basin = () => `/basins/${w.basinId}`;

/** Each main page with the role that reads it. */
const PAGES: [string, WorldUserKey | "signedOut", () => string][] = [
  ["home-signed-out", "signedOut", () => "/"],
  ["published-signed-out", "signedOut", () => "/published"],
  ["published-plan-signed-out", "signedOut", () => `/published/${w.basinId}/${published.planId}`],
  ["basins-planner", "planner", () => "/basins"],
  ["overview-planner", "planner", () => basin()],
  ["network-planner", "planner", () => `${basin()}/network`],
  ["scenarios-planner", "planner", () => `${basin()}/scenarios`],
  ["scenario-planner", "planner", () => `${basin()}/scenarios/${scenarioId}`],
  ["run-planner", "planner", () => `${basin()}/runs/${inReview.runId}`],
  ["plans-planner", "planner", () => `${basin()}/plans`],
  ["plan-planner", "planner", () => `${basin()}/plans/${inReview.planId}`],
  ["overview-lead", "lead", () => basin()],
  ["members-lead", "lead", () => `${basin()}/members`],
  ["audit-lead", "lead", () => `${basin()}/audit`],
  ["settings-lead", "lead", () => `${basin()}/settings`],
  ["plan-lead", "lead", () => `${basin()}/plans/${published.planId}`],
  ["overview-discharger", "discharger", () => basin()],
  ["my-facilities-discharger", "discharger", () => `${basin()}/my-facilities`],
  ["plans-discharger", "discharger", () => `${basin()}/plans`],
  ["plan-discharger", "discharger", () => `${basin()}/plans/${inReview.planId}`],
  ["overview-stakeholder", "stakeholder", () => basin()],
  ["reviews-stakeholder", "stakeholder", () => "/reviews"],
  ["plan-stakeholder", "stakeholder", () => `${basin()}/plans/${inReview.planId}`],
  ["review-outsider", "outsider", () => `/reviews/${w.basinId}/${inReview.planId}`],
  ["published-outsider", "outsider", () => "/published"],
  ["users-admin", "admin", () => "/admin/users"],
  ["signin-signed-out", "signedOut", () => "/signin"],
];

describe("on a phone (390 px) no main page scrolls sideways", () => {
  for (const [name, who, url] of PAGES) {
    it(`${name}`, async () => {
      const page = await phonePage(who);
      try {
        const res = await page.goto(`${baseUrl}${url()}`);
        expect(res?.status(), `${name} answered ${res?.status()}`).toBeLessThan(400);
        await expectNoSidewaysScroll(page, name);
      } finally {
        await page.close();
      }
    });
  }

  it("the import wizard with its field mapping shown", async () => {
    const page = await phonePage("planner");
    try {
      await page.goto(`${baseUrl}${basin()}/network/import`);
      await page.getByLabel("Reach lines").setInputFiles("tests/fixtures/demo/tamsel-reaches.zip");
      await page.getByTestId("reach-lines-uploaded").waitFor();
      await page.getByLabel("Dischargers (optional)").setInputFiles("tests/fixtures/demo/tamsel-dischargers.csv");
      await page.getByTestId("dischargers-optional-uploaded").waitFor();
      await expectNoSidewaysScroll(page, "import-mapping-planner");
      await page.getByRole("button", { name: "Check the network" }).click();
      await page.getByTestId("validation-report").waitFor();
      await expectNoSidewaysScroll(page, "import-report-planner");
    } finally {
      await page.close();
    }
  });

  it("the header is two short rows on a phone: no link's words stacked, every link in view", async () => {
    const page = await phonePage("admin");
    try {
      await page.goto(`${baseUrl}/basins`);
      const header = page.locator("header").first();
      const box = (await header.boundingBox())!;
      // the name mark and the account on one row, the section links on the next (each ~40 px)
      expect(box.height).toBeLessThan(110);
      const links = header.getByRole("navigation", { name: "Workspace" }).getByRole("link");
      expect(await links.allTextContents()).toEqual(["Basins", "Plans under review", "Users"]);
      for (const link of await links.all()) {
        const lines = await link.evaluate((a) => a.getClientRects().length);
        expect(lines, `${await link.textContent()} wraps`).toBe(1);
        const b = (await link.boundingBox())!;
        expect(b.x + b.width).toBeLessThanOrEqual(PHONE.width);
      }
      await expectNoSidewaysScroll(page, "header-admin");
      await links.filter({ hasText: "Plans under review" }).click();
      await page.waitForURL(`${baseUrl}/reviews`);
    } finally {
      await page.close();
    }
  });

  it("a basin's tabs scroll inside their own strip on a phone, the current one in view", async () => {
    const page = await phonePage("lead");
    try {
      await page.goto(`${baseUrl}${basin()}/settings`);
      const strip = page.getByRole("navigation", { name: "Basin sections" });
      const { scrollWidth, clientWidth } = await strip.evaluate((n) => ({ scrollWidth: n.scrollWidth, clientWidth: n.clientWidth }));
      expect(scrollWidth).toBeGreaterThan(clientWidth);
      const current = (await strip.locator('[aria-current="page"]').boundingBox())!;
      expect(current.x).toBeGreaterThanOrEqual(0);
      expect(current.x + current.width).toBeLessThanOrEqual(PHONE.width);
      expect(await strip.getByRole("link").allTextContents()).toContain("Members & facilities");
      await expectNoSidewaysScroll(page, "tabs-lead");
    } finally {
      await page.close();
    }
  });
});

describe("the same pages at 1440 px", () => {
  it("keep the header on one row and fit the screen", async () => {
    for (const [name, who, url] of PAGES) {
      const page = await phonePage(who, WIDE);
      try {
        await page.goto(`${baseUrl}${url()}`);
        // the sign-in pages have the name mark alone, no header
        if (await page.locator("header").count()) {
          const header = (await page.locator("header").first().boundingBox())!;
          expect(header.height, `${name}: header ${header.height}px tall`).toBeLessThan(70);
        }
        await expectNoSidewaysScroll(page, name, "wide");
      } finally {
        await page.close();
      }
    }
  }, 240_000);
});

describe("pages that are not there, and pages on their way", () => {
  it("a run that does not exist gives the not-found page, with a way back, inside the workspace", async () => {
    const page = await phonePage("planner");
    try {
      // the run page streams (its loading skeleton goes first), so the status is already sent when
      // the run turns out missing: Next then marks the page noindex and shows the not-found page
      await page.goto(`${baseUrl}${basin()}/runs/00000000-0000-4000-8000-000000000000`);
      await page.getByRole("heading", { name: "Nothing at this address" }).waitFor();
      expect(await page.locator('meta[name="robots"][content*="noindex"]').count()).toBeGreaterThan(0);
      expect(await page.getByRole("navigation", { name: "Basin sections" }).count()).toBe(0);
      expect(await page.getByTestId("signed-in-as").textContent()).toBe(w.users.planner.name);
      await expectNoSidewaysScroll(page, "not-found-planner");
      await page.getByRole("link", { name: "Your basins" }).last().click();
      await page.waitForURL(`${baseUrl}/basins`);
    } finally {
      await page.close();
    }
  });

  it("an address outside every section gives the not-found page to a signed-out visitor", async () => {
    const page = await phonePage("signedOut");
    try {
      const res = await page.goto(`${baseUrl}/no-such-page-here`);
      expect(res?.status()).toBe(404);
      await page.getByRole("heading", { name: "Nothing at this address" }).waitFor();
      expect(await page.getByRole("link", { name: "Published plans" }).count()).toBeGreaterThan(0);
      await expectNoSidewaysScroll(page, "not-found-signed-out");
    } finally {
      await page.close();
    }
  });

  it("a basin section that fails on the server shows its error boundary: a sentence, a reference, Try again — and recovers", async () => {
    const page = await phonePage("lead");
    // a real fault, no test-only code path: the table the audit page reads goes missing for a moment
    await sql`ALTER TABLE audit_events RENAME TO audit_events_away`.execute(db);
    let renamed = true;
    try {
      await page.goto(`${baseUrl}${basin()}/audit`);
      const notice = page.getByTestId("error-notice");
      await notice.waitFor();
      expect(await notice.getByRole("heading").textContent()).toBe("This part of the basin could not be shown");
      expect(await notice.getByTestId("error-reference").textContent()).toMatch(/^\w+$/);
      // the basin's name and tabs stay; nothing of the server's error reaches the page
      expect(await page.getByRole("navigation", { name: "Basin sections" }).count()).toBe(1);
      const text = (await page.locator("body").textContent()) ?? "";
      expect(text).not.toMatch(/audit_events|relation|does not exist|at \w+ \(|\.ts:\d+/);
      await expectNoSidewaysScroll(page, "error-boundary-lead");
      await sql`ALTER TABLE audit_events_away RENAME TO audit_events`.execute(db);
      renamed = false;
      await notice.getByRole("button", { name: "Try again" }).click();
      await page.getByTestId("audit-table").waitFor();
      expect(await page.getByTestId("error-notice").count()).toBe(0);
    } finally {
      if (renamed) await sql`ALTER TABLE audit_events_away RENAME TO audit_events`.execute(db);
      await page.close();
    }
  });

  it("a basin page streams its loading skeleton first: the real frame with placeholders, then the page", async () => {
    const page = await phonePage("planner");
    try {
      await page.goto(`${baseUrl}${basin()}/runs/${inReview.runId}`);
      await page.getByRole("heading", { level: 2 }).first().waitFor();
      expect(await page.getByTestId("loading-skeleton").count()).toBe(0);
      // without scripts the streamed page is never swapped in, so what the server sent first stays on screen
      const cookies = await page.context().cookies();
      for (const viewport of [PHONE, WIDE]) {
        const still = await browser.newContext({ viewport, javaScriptEnabled: false });
        await still.addCookies(cookies);
        const frozen = await still.newPage();
        await frozen.goto(`${baseUrl}${basin()}/runs/${inReview.runId}`);
        const skeleton = frozen.getByTestId("loading-skeleton").filter({ visible: true });
        expect(await skeleton.count()).toBe(1);
        // inside the basin's own frame (its name and tabs), with the run page's card headings
        expect(await frozen.getByRole("navigation", { name: "Basin sections" }).isVisible()).toBe(true);
        expect(await skeleton.locator("h2", { hasText: "Reaches" }).count()).toBe(1);
        await frozen.screenshot({ path: `${SHOTS}/${viewport === PHONE ? "phone" : "wide"}-loading-run-planner.png`, fullPage: true });
        await still.close();
      }
    } finally {
      await page.close();
    }
  });
});
