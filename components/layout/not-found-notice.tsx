import Link from "next/link";

/**
 * The page for an address that leads nowhere (or to something the reader may not know
 * exists): a plain heading, what may have happened, and the ways back that fit the reader.
 */
export function NotFoundNotice({ signedIn }: { signedIn: boolean }) {
  return (
    <section className="mx-auto max-w-xl py-12 text-center sm:py-20" data-testid="not-found">
      <h1 className="mb-2">Nothing at this address</h1>
      <p className="mb-6 text-ink-soft">
        The page may have been removed, the link may be mistyped, or it may belong to a basin you are not a member of.
      </p>
      <nav aria-label="Ways back" className="flex flex-wrap justify-center gap-x-6 gap-y-2">
        {signedIn && <Link href="/basins">Your basins</Link>}
        {signedIn && <Link href="/reviews">Plans under review</Link>}
        <Link href="/published">Published plans</Link>
        {!signedIn && <Link href="/signin">Sign in</Link>}
        <Link href="/">Home</Link>
      </nav>
    </section>
  );
}
