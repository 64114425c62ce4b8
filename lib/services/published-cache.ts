import { createHash } from "node:crypto";
import { LRUCache } from "lru-cache";
import type { Db } from "@/db/client";
import { findPublicationStamp } from "@/db/queries/plans";
import type { PlanDownload } from "@/lib/reports/download";

/**
 * Published plans are frozen (a database trigger refuses any change to them and their
 * rows), so what their public page and downloads are drawn from changes only with the
 * few things outside the plan that a lead may change — the basin's name, slug, units and
 * zone — and with a later version being published. Each request reads those in one row
 * (`findPublicationStamp`) and the rest comes from this process's cache under a key made
 * of them. Nothing is invalidated in memory: a change made by any process (another web
 * server, the worker, an operator in psql) gives the next request a different key, or
 * finds the plan no longer published and takes the ordinary path.
 */
export type PublicationStamp = NonNullable<Awaited<ReturnType<typeof findPublicationStamp>>>;

/** The plan's current stamp when it is published now; null otherwise (not the basin's, or not published). */
export async function publishedStamp(db: Db, basinId: string, planId: string): Promise<PublicationStamp | null> {
  const stamp = await findPublicationStamp(db, basinId, planId);
  return stamp?.status === "published" ? stamp : null;
}

/** The cache key of one rendering of a published plan: everything it is drawn from besides the frozen plan. */
export function publicationKey(stamp: PublicationStamp, what: string): string {
  return JSON.stringify([
    stamp.id,
    stamp.published_at?.toISOString() ?? null,
    stamp.basin_name,
    stamp.basin_slug,
    stamp.unit_system,
    stamp.time_zone,
    stamp.newer_published_id,
    what,
  ]);
}

/**
 * What a rendered public page records of the stamp it was drawn from (an attribute of its
 * HTML), so that the page cache (lib/cache/next-cache-handler.cjs) can tell a stored page
 * from a stale one by comparing it with the stamp read now.
 */
export function publicationTag(stamp: PublicationStamp): string {
  return createHash("sha256").update(publicationKey(stamp, "page")).digest("base64url");
}

/** The tag a page of this plan must carry to be served from the page cache now; null when it is not published. */
export async function currentPublicationTag(db: Db, basinId: string, planId: string): Promise<string | null> {
  const stamp = await publishedStamp(db, basinId, planId);
  return stamp ? publicationTag(stamp) : null;
}

/** A strong validator: the SHA-256 of the bytes sent. */
export function strongEtag(body: Uint8Array | string): string {
  return `"${createHash("sha256").update(body).digest("base64url")}"`;
}

/** Counts since the process started (or `resetPublishedCache`), for tests and the bench. */
export const publishedCacheStats = { fileHits: 0, fileMisses: 0, pageHits: 0, pageMisses: 0 };

type PublishedFile = PlanDownload & { etag: string };
const fileBytes = (f: PublishedFile) => Math.max(1, typeof f.body === "string" ? Buffer.byteLength(f.body) : f.body.byteLength);
// PDFs are a few hundred KB, CSVs and GeoJSON layers less: 64 MiB keeps every file of a few hundred plans
const files = new LRUCache<string, PublishedFile>({ maxSize: 64 * 1024 * 1024, sizeCalculation: fileBytes });
// a page's data holds the snapshot and the reach lines (up to a few MB on a large network): a count bound
const pages = new LRUCache<string, object>({ max: 48 });
// requests arriving together for a key not yet cached produce it once
const pending = new Map<string, Promise<unknown>>();

async function once<T>(key: string, produce: () => Promise<T>): Promise<T> {
  const running = pending.get(key) as Promise<T> | undefined;
  if (running) return running;
  const started = produce().finally(() => pending.delete(key));
  pending.set(key, started);
  return started;
}

/**
 * A published plan's file (with its ETag) from the cache, or produced and kept. `produce`
 * reads the plan through its ordinary path and says whether it found it published; a
 * plan that stopped being published between the stamp and that read is sent as produced
 * (no ETag: private, and audited by its path) and not kept.
 */
export async function cachedPublishedFile(key: string, produce: () => Promise<{ download: PlanDownload; published: boolean }>): Promise<PlanDownload> {
  const hit = files.get(key);
  if (hit) {
    publishedCacheStats.fileHits++;
    return hit;
  }
  publishedCacheStats.fileMisses++;
  return once(`file:${key}`, async () => {
    const made = await produce();
    if (!made.published) return made.download;
    const file: PublishedFile = { ...made.download, etag: strongEtag(made.download.body) };
    files.set(key, file);
    return file;
  });
}

/** A published plan's page data from the cache, or read and kept (null, a plan not published after all, is not kept). */
export async function cachedPublishedPage<T extends object>(key: string, read: () => Promise<T | null>): Promise<T | null> {
  const hit = pages.get(key) as T | undefined;
  if (hit) {
    publishedCacheStats.pageHits++;
    return hit;
  }
  publishedCacheStats.pageMisses++;
  return once(`page:${key}`, async () => {
    const found = await read();
    if (found) pages.set(key, found);
    return found;
  });
}

/** Empty both caches and zero the counts (tests). */
export function resetPublishedCache(): void {
  files.clear();
  pages.clear();
  Object.assign(publishedCacheStats, { fileHits: 0, fileMisses: 0, pageHits: 0, pageMisses: 0 });
}
