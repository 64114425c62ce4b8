"use client";
import Link from "next/link";
import { FollowButton } from "@/components/basins/follow-button";
import { Notice } from "@/components/ui/notice";
import { RoleBadge } from "@/components/ui/role-badge";
import { UNIT_SYSTEM_NAMES } from "@/lib/domain";
import { formatDay, formatWhen } from "@/lib/format/zoned-time";
import { PLAN_STAGE_TEXT } from "@/lib/plans/review-rules";
import { useBasinsQuery } from "@/lib/queries/basins";
import type { ReaderHome } from "@/lib/services/plan-readers";

export function BasinList() {
  const { data, error, isPending } = useBasinsQuery();
  if (isPending) return <p className="text-ink-faint">Loading basins…</p>;
  if (error) return <Notice tone="error">{error.message}</Notice>;
  if (data.length === 0) {
    return <div className="card text-ink-soft">You are not a member of any basin any more. A basin&apos;s lead can add you again.</div>;
  }
  return (
    <ul className="grid gap-4 sm:grid-cols-2" data-testid="basin-list">
      {data.map((b) => (
        <li key={b.id} className="card">
          <div className="mb-1 flex items-start justify-between gap-3">
            <Link href={`/basins/${b.id}`} className="text-lg font-semibold">
              {b.name}
            </Link>
            {b.myRole && <RoleBadge role={b.myRole} />}
          </div>
          <p className="mb-3 line-clamp-2 text-sm text-ink-soft">{b.description || "No description yet."}</p>
          <dl className="flex gap-6 text-xs text-ink-faint">
            <div>
              <dt className="inline">DO criterion </dt>
              <dd className="inline font-semibold text-ink-soft">{b.doCriterionMgL.toFixed(1)} mg/L</dd>
            </div>
            <div>
              <dt className="inline">Units </dt>
              <dd className="inline font-semibold text-ink-soft">{UNIT_SYSTEM_NAMES[b.unitSystem]}</dd>
            </div>
            <div>
              <dt className="inline">Members </dt>
              <dd className="inline font-semibold text-ink-soft">{b.memberCount ?? "—"}</dd>
            </div>
          </dl>
        </li>
      ))}
    </ul>
  );
}


/**
 * What a signed-in person outside every basin can do: read the plans under review (and
 * comment while a review is open), read the published plans, and follow a basin to be
 * e-mailed when a review opens or closes soon and when a plan is published.
 */
export function ReaderLanding({ home }: { home: Pick<ReaderHome, "reviews" | "published" | "follows"> }) {
  return (
    <div className="space-y-6" data-testid="reader-landing">
      <section className="card space-y-2" aria-label="Plans under review">
        <h2>Plans under review</h2>
        {home.reviews.length === 0 ? (
          <p className="text-sm text-ink-soft">No plan is under review at the moment. Follow a basin below to hear when one opens.</p>
        ) : (
          <ul className="space-y-1 text-sm" data-testid="reader-reviews">
            {home.reviews.map((r) => (
              <li key={r.id}>
                <Link href={`/reviews/${r.basinId}/${r.id}`}>{r.title}</Link> <span className="text-ink-soft">— {r.basinName}, version {r.version}: </span>
                <span>
                  {r.stage === "open" && r.endsAt
                    ? `open for comment until ${formatWhen(new Date(r.endsAt), r.timeZone)}`
                    : r.stage === "scheduled" && r.startsAt
                      ? `opens ${formatWhen(new Date(r.startsAt), r.timeZone)}`
                      : PLAN_STAGE_TEXT[r.stage]}
                </span>
              </li>
            ))}
          </ul>
        )}
        <p className="text-xs text-ink-faint">
          While a review is open you may comment on any facility&apos;s allocation or on the plan as a whole; your comment shows your name.{" "}
          <Link href="/reviews">Every plan under review, with its dates</Link>
        </p>
      </section>
      <section className="card space-y-2" aria-label="Published plans">
        <h2>Published plans</h2>
        {home.published.length === 0 ? (
          <p className="text-sm text-ink-soft">No plan has been published yet.</p>
        ) : (
          <ul className="space-y-1 text-sm" data-testid="reader-published">
            {home.published.map((p) => (
              <li key={p.id}>
                <Link href={`/published/${p.basinId}/${p.id}`}>{p.title}</Link>{" "}
                <span className="text-ink-soft">
                  — {p.basinName}, version {p.version}
                  {p.publishedAt ? `, published ${formatDay(new Date(p.publishedAt), p.timeZone)}` : ""}
                  {p.superseded ? " — superseded by a later version" : ""}
                </span>
              </li>
            ))}
          </ul>
        )}
        <p className="text-xs text-ink-faint">
          Published plans are readable by anyone, signed in or not: <Link href="/published">all published plans</Link>.
        </p>
      </section>
      <section className="card space-y-3" aria-label="Follow a basin">
        <h2>Follow a basin</h2>
        <p className="text-sm text-ink-soft">
          Following a basin asks for its e-mails: when a review opens, when it is about to close, and when a plan is published. It gives no other access.
        </p>
        {home.follows.length === 0 ? (
          <p className="text-sm text-ink-soft">No basin has a plan under review or published yet.</p>
        ) : (
          <ul className="grid gap-4 sm:grid-cols-2" data-testid="reader-follows">
            {home.follows.map((f) => (
              <li key={f.basinId} className="rounded-md border border-rule p-3" aria-label={`Follow ${f.basinName}`}>
                <h3 className="mb-2 font-semibold">{f.basinName}</h3>
                <FollowButton basinId={f.basinId} followed={f.followed} />
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
