// @ts-check
/**
 * Sagline's cache for pages Next.js stores (next.config.mjs `cacheHandler`): Next's own
 * file-system cache, except that a stored published-plan page (/published/:basin/:plan) is
 * served only while it carries the plan's current publication tag. The page writes the tag
 * it was drawn from into its HTML (`data-publication` on <main>); the tag now is read from
 * the database on every request through the check that instrumentation.ts registers
 * (lib/cache/published-page-check.ts: one row read). A plan withdrawn, a later version
 * published, or the basin renamed — by this process, another web server, the worker or an
 * operator in psql — changes or removes the tag, so the next request renders the page
 * afresh instead of serving the stored one. Until the check is registered nothing stored
 * for those pages is served; a page without a tag (a plan not published) is not stored.
 *
 * Plain CommonJS: Next.js loads this file with require() at start-up, outside its bundler.
 */
// eslint-disable-next-line @typescript-eslint/no-require-imports -- CommonJS, loaded by Next outside the bundle
const FileSystemCache = require("next/dist/server/lib/incremental-cache/file-system-cache.js").default;

const PUBLISHED_PAGE = /(?:^|\$)\/published\/([^/]+)\/([^/]+)$/;
const TAG_IN_HTML = /data-publication="([^"]+)"/;
const CHECK = Symbol.for("sagline.publishedPageTag");

/** @param {unknown} value */
function storedTag(value) {
  const v = /** @type {{ kind?: string, html?: unknown } | null} */ (value);
  return v && v.kind === "APP_PAGE" && typeof v.html === "string" ? TAG_IN_HTML.exec(v.html)?.[1] : undefined;
}

module.exports = class SaglineCacheHandler extends FileSystemCache {
  /** @param {string} key @param {any} ctx */
  async get(key, ctx) {
    const entry = await super.get(key, ctx);
    const page = PUBLISHED_PAGE.exec(key);
    if (!entry || !page) return entry;
    /** @type {((basinId: string, planId: string) => Promise<string | null>) | undefined} */
    const check = /** @type {any} */ (globalThis)[CHECK];
    if (!check) return null;
    // a failed check (the database down) serves nothing stored: the page renders and says what failed
    const current = await check(decodeURIComponent(page[1]), decodeURIComponent(page[2])).catch(() => null);
    return current !== null && storedTag(entry.value) === current ? entry : null;
  }

  /** @param {string} key @param {any} data @param {any} ctx */
  async set(key, data, ctx) {
    // a page without a tag is a plan not published (a 404): not stored, so that made-up
    // addresses cannot fill the disk; only published plans' pages are kept
    if (PUBLISHED_PAGE.test(key) && !storedTag(data)) return;
    return super.set(key, data, ctx);
  }
};
