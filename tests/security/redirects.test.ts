import { describe, expect, it } from "vitest";
import { authOptions } from "@/lib/auth/options";
import { safeCallbackPath } from "@/lib/auth/safe-redirect";

const ORIGIN = "http://127.0.0.1:3000";

// Each as the sign-in page receives it (already percent-decoded by Next.js) and as sent raw.
const HOSTILE = [
  "/\\evil.example/pwn",
  "/%5Cevil.example/pwn",
  "/%5cevil.example/pwn",
  "/\t/evil.example/pwn",
  "/%09/evil.example/pwn",
  "/\n/evil.example",
  "//evil.example/pwn",
  "///evil.example",
  "\\\\evil.example",
  "/.//evil.example",
  "https://evil.example/pwn",
  "HTTPS://EVIL.EXAMPLE/",
  "hTtP://127.0.0.1:3001/basins",
  "http://127.0.0.1.evil.example/",
  "javascript:alert(1)",
  "JavaScript:alert(1)",
  " javascript:alert(1)",
  "data:text/html,<script>alert(1)</script>",
  "https:evil.example",
  "//127.0.0.1@evil.example",
];

describe("post-sign-in targets", () => {
  it.each(HOSTILE)("refuses %j", (target) => {
    const path = safeCallbackPath(decodeURIComponentSafe(target), ORIGIN);
    expect(path).toBe("/basins");
    expect(safeCallbackPath(target, ORIGIN)).toSatisfy((p: string) => p === "/basins" || sameOrigin(p));
  });

  it("keeps same-origin paths with their query and fragment", () => {
    expect(safeCallbackPath("/basins/abc/plans?tab=review#t1", ORIGIN)).toBe("/basins/abc/plans?tab=review#t1");
    expect(safeCallbackPath(`${ORIGIN}/reviews`, ORIGIN)).toBe("/reviews");
    expect(safeCallbackPath("reviews", ORIGIN)).toBe("/reviews");
    // same scheme without slashes is a relative path to a browser too: it stays here
    expect(safeCallbackPath("http:evil.example", ORIGIN)).toBe("/evil.example");
    expect(safeCallbackPath(undefined, ORIGIN)).toBe("/basins");
    expect(safeCallbackPath("", ORIGIN)).toBe("/basins");
  });

  it("next-auth's redirect callback sends nothing off-site", async () => {
    const redirect = authOptions.callbacks!.redirect!;
    for (const url of HOSTILE) {
      const out = await redirect({ url, baseUrl: ORIGIN });
      expect(new URL(out).origin, url).toBe(ORIGIN);
      expect(new URL(out).pathname.startsWith("//"), url).toBe(false);
    }
    expect(await redirect({ url: "/basins/x", baseUrl: ORIGIN })).toBe(`${ORIGIN}/basins/x`);
  });
});

/** Every result is a path a browser resolves on the app's own origin. */
function sameOrigin(path: string): boolean {
  return path.startsWith("/") && !path.startsWith("//") && new URL(path, ORIGIN).origin === ORIGIN;
}

function decodeURIComponentSafe(s: string): string {
  try {
    return decodeURIComponent(s);
  } catch {
    return s;
  }
}
