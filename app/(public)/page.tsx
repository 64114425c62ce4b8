import { formatDay } from "@/lib/format/zoned-time";
import Link from "next/link";
import { getDb } from "@/db/client";
import { currentActor } from "@/lib/auth/session";
import { listPublishedPlans } from "@/lib/services/plans";

export const dynamic = "force-dynamic";

export default async function HomePage() {
  const actor = await currentActor();
  const published = await listPublishedPlans(getDb());
  return (
    <main className="mx-auto max-w-3xl px-6 py-16">
      <h1 className="mb-4 text-3xl">Keep every reach above its dissolved-oxygen criterion — and show your work.</h1>
      <p className="mb-4 text-ink-soft">
        Sagline is a shared workspace for river-basin planners. Import the reach network and the outfalls of the plants
        that discharge oxygen-demanding waste, run a chained Streeter–Phelps model of dissolved oxygen along the network
        at critical low-flow conditions, and let a linear program find each discharger&apos;s waste-load allocation so
        that DO stays above the criterion. Then take the plan through review: dischargers see their proposed allocation
        and why, stakeholders comment during a formal review period, and the agency lead publishes the final plan.
      </p>
      <p className="mb-8 text-sm text-ink-faint">
        Allocations are planning estimates: they must be confirmed with a calibrated model and by a qualified engineer,
        and the jurisdiction&apos;s water-quality standards and permitting rules take precedence.
      </p>
      {actor ? (
        <div className="flex flex-wrap items-center gap-4">
          <Link href="/basins" className="rounded-md bg-tarn-600 px-4 py-2 font-medium text-white no-underline hover:bg-tarn-700 hover:no-underline">
            Go to your basins
          </Link>
          <Link href="/reviews">Plans under review</Link>
        </div>
      ) : (
        <div className="flex flex-wrap items-center gap-4">
          <Link href="/signin" className="rounded-md bg-tarn-600 px-4 py-2 font-medium text-white no-underline hover:bg-tarn-700 hover:no-underline">
            Sign in
          </Link>
          <span className="text-sm text-ink-soft">
            No account? <Link href="/register">Create one</Link> to read plans under review and comment on them.
          </span>
        </div>
      )}
      <section className="mt-12" aria-label="Published plans">
        <h2 className="mb-3">Published plans</h2>
        {published.length === 0 ? (
          <p className="text-sm text-ink-soft">No plan has been published yet.</p>
        ) : (
          <ul className="space-y-2" data-testid="published-plans">
            {published.map((p) => (
              <li key={p.id}>
                <Link href={`/published/${p.basinId}/${p.id}`}>{p.title}</Link>{" "}
                <span className="text-sm text-ink-faint">
                  — {p.basinName}, version {p.version}
                  {p.publishedAt ? `, ${formatDay(new Date(p.publishedAt), p.timeZone)}` : ""}
                  {p.superseded ? " — superseded by a later version" : ""}
                </span>
              </li>
            ))}
          </ul>
        )}
      </section>
    </main>
  );
}
