import { PNG } from "pngjs";
import type { Page } from "playwright-core";

/** Count of non-background pixels in an element's screenshot (proof something was drawn). */
export async function inkPixels(page: Page, selector: string): Promise<number> {
  const png = PNG.sync.read(await page.locator(selector).first().screenshot());
  let n = 0;
  for (let i = 0; i < png.data.length; i += 4) {
    const [r, g, b] = [png.data[i], png.data[i + 1], png.data[i + 2]];
    if (Math.max(r, g, b) - Math.min(r, g, b) > 40 || r + g + b < 300) n++;
  }
  return n;
}
