"use client";
import { useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { isoToZoned, timeZoneNames, zonedToIso } from "@/lib/format/zoned-time";
import type { PlanDto } from "@/lib/queries/plans";
import type { Act, PlanPermissions } from "./plan-view";

const DAY = 86_400_000;

/** Now, to the minute, as wall-clock time in `zone`, moved by `days`. */
function fromNow(zone: string, days = 0): string {
  return isoToZoned(new Date(Math.floor(Date.now() / 60_000) * 60_000 + days * DAY).toISOString(), zone);
}

/** "= 4 Jan 2027, 15:00 UTC" under a wall-clock input, or why it cannot be used. */
function Instant({ local, zone }: { local: string; zone: string }) {
  const iso = zonedToIso(local, zone);
  if (!iso) return <p className="field-error">Not a time that exists in {zone}</p>;
  return (
    <p className="text-xs text-ink-faint">
      = {new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" })} UTC
    </p>
  );
}

/**
 * A lead's actions on a plan: open its review (start, end and the time zone
 * they are read in), extend it with a reason, publish after it closes, withdraw.
 */
export function LeadActions({ plan, can, act }: { plan: PlanDto; can: PlanPermissions; act: Act }) {
  const zones = useMemo(() => timeZoneNames(), []);
  const browserZone = Intl.DateTimeFormat().resolvedOptions().timeZone;
  const [timeZone, setTimeZone] = useState(zones.includes(browserZone) ? browserZone : "UTC");
  // by default the review opens now and runs 30 days
  const [startsAt, setStartsAt] = useState(() => fromNow(timeZone));
  const [endsAt, setEndsAt] = useState(() => fromNow(timeZone, 30));
  /** A new zone keeps the chosen instants and shows them as that zone's wall-clock times. */
  const changeZone = (zone: string) => {
    const shift = (local: string) => {
      const iso = zonedToIso(local, timeZone);
      return iso ? isoToZoned(iso, zone) : local;
    };
    setStartsAt(shift(startsAt));
    setEndsAt(shift(endsAt));
    setTimeZone(zone);
  };
  const periodZone = plan.review?.timeZone ?? "UTC";
  // the extension form starts at two weeks past the current end (read when the review exists)
  const [typedEnd, setNewEnd] = useState("");
  const newEnd = typedEnd || (plan.review ? isoToZoned(new Date(Date.parse(plan.review.endsAt) + 14 * DAY).toISOString(), periodZone) : "");
  const [reason, setReason] = useState("");
  if (!can.manageReview && !can.publish) return null;
  const p = `/plans/${plan.id}`;
  const start = zonedToIso(startsAt, timeZone);
  const end = zonedToIso(endsAt, timeZone);
  const extended = zonedToIso(newEnd, periodZone);
  return (
    <section className="card space-y-3" aria-label="Lead actions">
      <h2>Lead actions</h2>
      {plan.status === "draft" && can.manageReview && (
        <div className="space-y-2">
          <div className="flex flex-wrap items-start gap-3">
            <div>
              <label htmlFor="review-zone" className="field-label">
                Time zone
              </label>
              <select id="review-zone" className="field-input w-64" value={timeZone} onChange={(e) => changeZone(e.target.value)}>
                {zones.map((z) => (
                  <option key={z} value={z}>
                    {z}
                  </option>
                ))}
              </select>
            </div>
            <div>
              <label htmlFor="review-start" className="field-label">
                Review opens
              </label>
              <input id="review-start" type="datetime-local" className="field-input w-56" value={startsAt} onChange={(e) => setStartsAt(e.target.value)} />
              <Instant local={startsAt} zone={timeZone} />
            </div>
            <div>
              <label htmlFor="review-end" className="field-label">
                Review closes
              </label>
              <input id="review-end" type="datetime-local" className="field-input w-56" value={endsAt} onChange={(e) => setEndsAt(e.target.value)} />
              <Instant local={endsAt} zone={timeZone} />
            </div>

          </div>
          <Button disabled={!start || !end} onClick={() => start && end && act(`${p}/review`, { startsAt: start, endsAt: end, timeZone })}>
            Open the review
          </Button>
          <p className="text-xs text-ink-faint">Members and followers are e-mailed when it opens; the review closes itself at its end.</p>
        </div>
      )}
      {plan.status === "review" && can.manageReview && (
        <div className="flex flex-wrap items-start gap-3">
          <div>
            <label htmlFor="extend-end" className="field-label">
              New end ({periodZone})
            </label>
            <input id="extend-end" type="datetime-local" className="field-input w-56" value={newEnd} onChange={(e) => setNewEnd(e.target.value)} />
            <Instant local={newEnd} zone={periodZone} />
          </div>
          <div className="grow">
            <label htmlFor="extend-reason" className="field-label">
              Reason for the extension
            </label>
            <input id="extend-reason" className="field-input" value={reason} onChange={(e) => setReason(e.target.value)} />
          </div>
          <Button
            variant="secondary"
            className="mt-6"
            disabled={reason.trim().length < 10 || !extended}
            onClick={async () => {
              if (extended && (await act(`${p}/review`, { endsAt: extended, reason }, "PATCH"))) {
                setReason("");
                setNewEnd("");
              }
            }}
          >
            Extend the review
          </Button>
        </div>
      )}
      <div className="flex flex-wrap gap-3">
        {plan.status === "closed" && can.publish && <Button onClick={() => window.confirm("Publish this plan? It is frozen from then on.") && act(`${p}/publish`)}>Approve and publish</Button>}
        {(plan.status === "draft" || plan.status === "review" || plan.status === "closed") && can.manageReview && (
          <Button variant="danger" onClick={() => window.confirm("Withdraw this plan?") && act(`${p}/withdraw`)}>
            Withdraw
          </Button>
        )}
      </div>
    </section>
  );
}
