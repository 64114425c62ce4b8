/**
 * The Cache-Control of a published plan's download: any cache (a CDN too) may keep it
 * for five minutes and must then ask again with the ETag; the origin checks the plan's
 * state on every request, so a 304 costs it one row read.
 */
export const PUBLISHED_CACHE_CONTROL = "public, max-age=300, must-revalidate";

/** A file to send: bytes or text, its media type and the name to save it under. */
export interface PlanDownload {
  body: Uint8Array | string;
  contentType: string;
  fileName: string;
  /**
   * Set only for a published plan's file (lib/services/published-cache.ts): its strong
   * validator. The response is then public and cacheable; without it, private and never stored.
   */
  etag?: string;
}

/** True when an If-None-Match header names `etag` (or is "*"); weak comparison, as RFC 9110 §13.1.2 asks. */
export function etagMatches(ifNoneMatch: string | null | undefined, etag: string): boolean {
  if (!ifNoneMatch) return false;
  const bare = (t: string) => t.trim().replace(/^W\//, "");
  return ifNoneMatch.split(",").some((t) => t.trim() === "*" || bare(t) === bare(etag));
}

/**
 * A download as an HTTP response, an attachment. A published plan's file carries its ETag
 * and Cache-Control that any cache may honour, and a request naming that ETag gets 304
 * with no body; any other file is `private, no-store`.
 */
export function downloadResponse(d: PlanDownload, ifNoneMatch?: string | null): Response {
  if (d.etag) {
    const validators = { etag: d.etag, "cache-control": PUBLISHED_CACHE_CONTROL };
    if (etagMatches(ifNoneMatch, d.etag)) return new Response(null, { status: 304, headers: validators });
    return new Response(d.body as BodyInit, {
      headers: {
        "content-type": d.contentType,
        "content-disposition": `attachment; filename="${d.fileName.replace(/[^\w.-]+/g, "-")}"`,
        ...validators,
      },
    });
  }
  return new Response(d.body as BodyInit, {
    headers: {
      "content-type": d.contentType,
      "content-disposition": `attachment; filename="${d.fileName.replace(/[^\w.-]+/g, "-")}"`,
      "cache-control": "private, no-store",
    },
  });
}
