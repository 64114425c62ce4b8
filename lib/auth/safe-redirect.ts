/** Where a browser goes after sign-in when no acceptable target was given. */
export const DEFAULT_AFTER_SIGN_IN = "/basins";

/**
 * A same-origin path for a requested post-sign-in target, or the default.
 * The target is resolved the way a browser would (WHATWG URL: backslashes
 * count as slashes, tabs and newlines are dropped), and anything landing on
 * another origin — "//evil", "/\\evil", "/\t/evil", "https://evil",
 * "javascript:" — is refused. The result is a path ("/…") that itself cannot
 * be read as protocol-relative.
 */
export function safeCallbackPath(target: string | null | undefined, origin: string): string {
  if (!target) return DEFAULT_AFTER_SIGN_IN;
  let base: URL;
  let url: URL;
  try {
    base = new URL(origin);
    url = new URL(target, base);
  } catch {
    return DEFAULT_AFTER_SIGN_IN;
  }
  if (url.origin !== base.origin) return DEFAULT_AFTER_SIGN_IN;
  const path = `${url.pathname}${url.search}${url.hash}`;
  // "/.//evil" resolves to the path "//evil", which a browser reads as another host
  if (!path.startsWith("/") || path.startsWith("//") || path.startsWith("/\\")) return DEFAULT_AFTER_SIGN_IN;
  return path;
}
