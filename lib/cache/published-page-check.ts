import { getDb } from "@/db/client";
import { currentPublicationTag } from "@/lib/services/published-cache";

const CHECK = Symbol.for("sagline.publishedPageTag");

/**
 * Gives the page cache (lib/cache/next-cache-handler.cjs, loaded by Next.js outside the
 * bundle) the one thing it asks of the application: the publication tag a stored
 * published-plan page must carry to be served now (null: render it afresh). Called once
 * per server process from instrumentation.ts.
 */
export function registerPublishedPageCheck(): void {
  (globalThis as Record<symbol, unknown>)[CHECK] = (basinId: string, planId: string) => currentPublicationTag(getDb(), basinId, planId);
}
