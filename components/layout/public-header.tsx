import Link from "next/link";
import { SiteHeader } from "@/components/layout/site-header";
import type { Actor } from "@/lib/auth/guard";

/**
 * The header of the pages anyone may read: home, published plans and plans under review
 * (those need an account), and a sign-in link — or, signed in, the person's name and a
 * link to their basins.
 */
export function PublicHeader({ actor }: { actor: Actor | null }) {
  return (
    <SiteHeader
      testId="public-header"
      homeHref="/"
      homeLabel="Sagline home"
      navLabel="Plans"
      links={[
        { href: "/", label: "Home" },
        { href: "/published", label: "Published plans" },
        { href: "/reviews", label: "Plans under review" },
      ]}
      account={
        actor ? (
          <>
            <span className="min-w-0 truncate text-ink-soft" data-testid="signed-in-as">
              {actor.name}
            </span>
            <Link href="/basins" className="shrink-0 whitespace-nowrap">
              Your basins
            </Link>
          </>
        ) : (
          <>
            <Link href="/signin" className="shrink-0 whitespace-nowrap font-medium">
              Sign in
            </Link>
            <Link href="/register" className="shrink-0 whitespace-nowrap text-ink-soft">
              Create an account
            </Link>
          </>
        )
      }
    />
  );
}
