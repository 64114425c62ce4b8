import { after } from "next/server";

const inFlight = new Set<Promise<void>>();

/**
 * Runs `work` after the response has been handed back, so the response takes
 * the same time whatever the work finds (a password-reset request for an
 * address with an account or without one). Inside a Next.js request, `after`
 * keeps the request alive until the work ends; outside one (scripts, tests)
 * the promise runs on its own. Failures are logged: the caller has already
 * answered.
 */
export function afterResponse(label: string, work: () => Promise<void>): void {
  const run: Promise<void> = new Promise<void>((resolve) => setImmediate(resolve))
    .then(work)
    .catch((error) => console.error(`[after-response] ${label} failed`, error))
    .finally(() => inFlight.delete(run));
  inFlight.add(run);
  try {
    after(() => run);
  } catch {
    // not inside a request scope: nothing to extend
  }
}

/** Waits for every deferred piece of work started so far (tests, graceful shutdown). */
export async function drainAfterResponse(): Promise<void> {
  while (inFlight.size > 0) await Promise.all([...inFlight]);
}
