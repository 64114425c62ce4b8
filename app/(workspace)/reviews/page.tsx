import type { Metadata } from "next";
import Link from "next/link";
import { getDb } from "@/db/client";
import { currentActor } from "@/lib/auth/session";
import { listReviews } from "@/lib/services/plans";

export const metadata: Metadata = { title: "Plans under review" };

const when = (iso: string, timeZone: string) =>
  new Intl.DateTimeFormat("en-CA", { year: "numeric", month: "short", day: "numeric", hour: "2-digit", minute: "2-digit", timeZone, timeZoneName: "short" }).format(new Date(iso));

/** Every plan under review, in any basin: anyone signed in may read it and comment while its review is open. */
export default async function ReviewsPage() {
  const reviews = await listReviews(getDb(), await currentActor());
  return (
    <div className="space-y-4">
      <div>
        <h1>Plans under review</h1>
        <p className="text-sm text-ink-soft">
          Proposed waste-load allocations open for public comment. You may read each one and comment on any facility&apos;s allocation, or on the plan as a whole,
          while its review period is open. Adopted plans are under <Link href="/published">Published plans</Link>.
        </p>
      </div>
      {reviews.length === 0 ? (
        <p className="text-sm text-ink-soft">No plan is under review at the moment.</p>
      ) : (
        <div className="overflow-x-auto">
        <table className="data-table" data-testid="reviews-table">
          <thead>
            <tr>
              <th>Basin</th>
              <th>Plan</th>
              <th>Review</th>
            </tr>
          </thead>
          <tbody>
            {reviews.map((r) => (
              <tr key={r.id}>
                <td>{r.basinName}</td>
                <td>
                  <Link href={`/reviews/${r.basinId}/${r.id}`}>{r.title}</Link> <span className="text-ink-soft">version {r.version}</span>
                </td>
                <td className="text-sm">
                  {r.stage === "open" && r.endsAt ? (
                    <span>open until {when(r.endsAt, r.timeZone)}</span>
                  ) : r.stage === "closed" ? (
                    <span className="text-ink-soft">closed; awaiting the lead&apos;s decision</span>
                  ) : r.stage === "scheduled" && r.startsAt ? (
                    <span>opens {when(r.startsAt, r.timeZone)}</span>
                  ) : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        </div>
      )}
    </div>
  );
}
