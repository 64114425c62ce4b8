import { formatDay } from "@/lib/format/zoned-time";
import type { Metadata } from "next";
import Link from "next/link";
import { getDb } from "@/db/client";
import { listPublishedPlans } from "@/lib/services/plans";

export const metadata: Metadata = { title: "Published plans" };
export const dynamic = "force-dynamic";


/** Every published plan, basin by basin: readable by anyone, without signing in. */
export default async function PublishedPlansPage() {
  const published = await listPublishedPlans(getDb());
  const basins = [...new Set(published.map((p) => p.basinId))].map((id) => ({
    id,
    name: published.find((p) => p.basinId === id)!.basinName,
    plans: published.filter((p) => p.basinId === id),
  }));
  return (
    <main className="mx-auto max-w-3xl space-y-6 px-6 py-10">
      <div>
        <h1>Published plans</h1>
        <p className="text-sm text-ink-soft">
          Waste-load allocations adopted by each basin&apos;s lead after a public review, with their critical conditions, methods, margin of safety and the
          comments received with their responses. Plans still open for comment are under <Link href="/reviews">Plans under review</Link> (for signed-in
          readers).
        </p>
      </div>
      {basins.length === 0 ? (
        <p className="text-sm text-ink-soft">No plan has been published yet.</p>
      ) : (
        basins.map((b) => (
          <section key={b.id} aria-label={b.name} className="card">
            <h2 className="mb-2">{b.name}</h2>
            <ul className="space-y-1" data-testid="published-list">
              {b.plans.map((p) => (
                <li key={p.id}>
                  <Link href={`/published/${p.basinId}/${p.id}`}>{p.title}</Link>{" "}
                  <span className="text-sm text-ink-faint">
                    version {p.version}
                    {p.publishedAt ? `, published ${formatDay(new Date(p.publishedAt), p.timeZone)}` : ""}
                    {p.superseded ? " — superseded by a later version" : ""}
                  </span>
                </li>
              ))}
            </ul>
          </section>
        ))
      )}
    </main>
  );
}
