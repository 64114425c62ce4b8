import { chromium, type Browser, type Page } from "playwright-core";
import { DEMO_USERS } from "@/db/seed/demo-data";

/** Debian's Chromium, headless, with nothing reaching outside the machine. */
export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--use-angle=swiftshader",
      "--enable-unsafe-swiftshader",
    ],
  });
}

/** Sign in through the real sign-in page and wait for the basin list. */
export async function signInAs(page: Page, baseUrl: string, email: string, password: string): Promise<void> {
  await page.goto(`${baseUrl}/signin`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${baseUrl}/basins`);
}

/** A fresh browser context at `width` (a phone's 844 px height below 500 px wide), signed in as the demo user `key`. */
export async function demoUserPage(browser: Browser, baseUrl: string, key: string, width: number): Promise<Page> {
  const user = DEMO_USERS.find((u) => u.key === key);
  if (!user) throw new Error(`no demo user "${key}"`);
  const context = await browser.newContext({ viewport: { width, height: width > 500 ? 900 : 844 } });
  const page = await context.newPage();
  await signInAs(page, baseUrl, user.email, user.password);
  return page;
}

/** Nothing on the page is wider than the window (no sideways scrolling). */
export const noSidewaysScroll = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);
