"use client";
import Link from "next/link";
import { SiteHeader } from "@/components/layout/site-header";
import { useSignedIn } from "@/lib/queries/account";

/**
 * The header of the pages anyone may read: home, published plans and plans under review
 * (those need an account), and a sign-in link — or, signed in, the person's name and a
 * link to their basins. Who is signed in is asked from the browser, so that these pages
 * are the same for every reader and a published plan's page can be stored and shared.
 */
export function PublicHeader() {
  const me = useSignedIn();
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
        !me.data ? (
          // not known yet (or not answered): hold the place so the header does not jump
          <span className="h-5 w-32" aria-hidden="true" data-testid="account-pending" />
        ) : me.data.signedIn ? (
          <>
            <span className="min-w-0 truncate text-ink-soft" data-testid="signed-in-as">
              {me.data.name}
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
