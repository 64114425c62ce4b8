import { existsSync } from "node:fs";
import { join } from "node:path";
import { Font } from "@react-pdf/renderer";

/** The family the report is set in, then fallbacks for letters outside Latin-1. */
export const REPORT_FONTS = ["Sagline Sans", "Sagline Sans Ext", "Sagline Sans Greek"];

const FILES = join(process.cwd(), "node_modules", "@fontsource", "source-sans-3", "files");
const file = (subset: string, weight: number, style = "normal") => {
  const path = join(FILES, `source-sans-3-${subset}-${weight}-${style}.woff`);
  if (!existsSync(path)) throw new Error(`Report font missing: ${path} (npm package @fontsource/source-sans-3)`);
  return path;
};

let registered = false;

/**
 * Register Source Sans 3 (SIL Open Font License, the app's own typeface) with react-pdf,
 * from the npm package's WOFF files — react-pdf reads TTF and WOFF, not WOFF2. The
 * package splits the font by script; the Latin-extended and Greek parts are fallbacks so
 * names like "Łódź" or a θ in a comment still print. Idempotent.
 */
export function registerReportFonts(): void {
  if (registered) return;
  const weights = [400, 600, 700];
  Font.register({
    family: REPORT_FONTS[0],
    fonts: [...weights.map((w) => ({ src: file("latin", w), fontWeight: w })), { src: file("latin", 400, "italic"), fontWeight: 400, fontStyle: "italic" }],
  });
  Font.register({ family: REPORT_FONTS[1], fonts: weights.map((w) => ({ src: file("latin-ext", w), fontWeight: w })) });
  Font.register({ family: REPORT_FONTS[2], fonts: weights.map((w) => ({ src: file("greek", w), fontWeight: w })) });
  // Long words (ids, hashes) may break anywhere rather than with inserted hyphens.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}
