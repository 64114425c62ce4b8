import { chromium, type Browser, type Page } from "playwright-core";

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
