import Link from "next/link";
import { NameMark } from "@/components/brand/name-mark";
import type { Actor } from "@/lib/auth/guard";

/**
 * The header of the pages anyone may read: home, published plans and plans under review
 * (those need an account), and a sign-in link — or, signed in, the person's name and a
 * link to their basins.
 */
export function PublicHeader({ actor }: { actor: Actor | null }) {
  return (
    <header className="border-b border-rule bg-paper-raised" data-testid="public-header">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-6 py-3">
        <Link href="/" className="no-underline hover:no-underline" aria-label="Sagline home">
          <NameMark />
        </Link>
        <nav aria-label="Plans" className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
          <Link href="/">Home</Link>
          <Link href="/published">Published plans</Link>
          <Link href="/reviews">Plans under review</Link>
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          {actor ? (
            <>
              <span className="text-ink-soft" data-testid="signed-in-as">
                {actor.name}
              </span>
              <Link href="/basins">Your basins</Link>
            </>
          ) : (
            <>
              <Link href="/signin" className="font-medium">
                Sign in
              </Link>
              <Link href="/register" className="text-ink-soft">
                Create an account
              </Link>
            </>
          )}
        </div>
      </div>
    </header>
  );
}
