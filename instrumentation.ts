/** Runs once when a Next.js server process starts, before it answers any request. */
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { registerPublishedPageCheck } = await import("@/lib/cache/published-page-check");
  registerPublishedPageCheck();
}
