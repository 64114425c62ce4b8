"use client";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { TimeZoneInput, ZoneNow } from "@/components/forms/time-zone-field";
import { formatDay, formatTime, isoToZoned, zonedToIso } from "@/lib/format/zoned-time";
import { isKnownTimeZone } from "@/lib/validation/time-zone";
import { reviewDateIssues } from "@/lib/plans/review-rules";
import { awaitsResponse } from "@/lib/results/responsiveness";
import { MIN_ACK_STATEMENT } from "@/lib/validation/plan";
import { usePublishPlanMutation, useWithdrawPlanMutation, type PlanDto } from "@/lib/queries/plans";
import { useExtendReviewMutation, useOpenReviewMutation } from "@/lib/queries/reviews";
import { FieldMessage, serverMessages } from "./plan-acts";
import type { PlanPermissions } from "./plan-view";

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
      = {formatTime(new Date(iso), "UTC")}
    </p>
  );
}

/**
 * A lead's actions on a plan: open its review (start, end and the time zone
 * they are read in), extend it with a reason, publish after it closes, withdraw.
 */
export function LeadActions({ basinId, plan, can }: { basinId: string; plan: PlanDto; can: PlanPermissions }) {
  const openReview = useOpenReviewMutation(basinId, plan.id);
  const extendReview = useExtendReviewMutation(basinId, plan.id);
  const withdraw = useWithdrawPlanMutation(basinId, plan.id);
  // the basin's zone when it has one; else the lead's own (the first review's zone becomes the basin's)
  const [timeZone, setTimeZone] = useState(() => {
    const browserZone = Intl.DateTimeFormat().resolvedOptions().timeZone;
    return plan.basinTimeZone ?? (isKnownTimeZone(browserZone) ? browserZone : "UTC");
  });
  const [zoneText, setZoneText] = useState(timeZone);
  // by default the review opens when the lead clicks, and runs the basin's shortest review (at least 30 days)
  const [opensNow, setOpensNow] = useState(true);
  const [startsAt, setStartsAt] = useState(() => fromNow(timeZone));
  const [endsAt, setEndsAt] = useState(() => fromNow(timeZone, Math.max(30, plan.minReviewDays)));
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
  // nothing is left to do on a published or withdrawn plan: no empty card
  if ((!can.manageReview && !can.publish) || plan.status === "published" || plan.status === "withdrawn") return null;
  const start = opensNow ? new Date().toISOString() : zonedToIso(startsAt, timeZone);
  const end = zonedToIso(endsAt, timeZone);
  const extended = zonedToIso(newEnd, periodZone);
  // the server's own rules, checked as the lead types (lib/plans/review-rules.ts)
  const ruleIssues =
    start && end ? reviewDateIssues({ startsAt: new Date(start), endsAt: new Date(end), minReviewDays: plan.minReviewDays, now: new Date() }, timeZone) : [];
  const rule = Object.fromEntries(ruleIssues.map((i) => [i.path, i.message]));
  const opened = serverMessages(openReview.error, ["startsAt", "endsAt", "timeZone"]);
  const extendedFailure = serverMessages(extendReview.error, ["endsAt", "reason"]);
  const decided = serverMessages(withdraw.error, []);
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
              <TimeZoneInput
                id="review-zone"
                className="field-input w-64"
                value={zoneText}
                onChange={(e) => {
                  setZoneText(e.target.value);
                  if (isKnownTimeZone(e.target.value.trim()) && e.target.value.trim() !== "") changeZone(e.target.value.trim());
                }}
              />
              <div className="mt-1">
                {zoneText.trim() !== timeZone ? (
                  <p className="field-error">Not a time zone; type part of a name (e.g. Chicago) and pick one. Using {timeZone}.</p>
                ) : (
                  <ZoneNow zone={timeZone} />
                )}
              </div>
            </div>
            <div>
              <span className="field-label">Review opens</span>
              <label className="flex items-center gap-2 text-sm">
                <input type="checkbox" checked={opensNow} onChange={(e) => setOpensNow(e.target.checked)} />
                Now, when I open it
              </label>
              {!opensNow && (
                <>
                  <label htmlFor="review-start" className="sr-only">
                    Review opens at
                  </label>
                  <input id="review-start" type="datetime-local" className="field-input mt-1 w-56" value={startsAt} onChange={(e) => setStartsAt(e.target.value)} />
                  <Instant local={startsAt} zone={timeZone} />
                </>
              )}
              <FieldMessage text={rule.startsAt ?? opened.field.startsAt} />
            </div>
            <div>
              <label htmlFor="review-end" className="field-label">
                Review closes
              </label>
              <input
                id="review-end"
                type="datetime-local"
                className="field-input w-56"
                value={endsAt}
                onChange={(e) => setEndsAt(e.target.value)}
                aria-describedby="review-rule"
              />
              <Instant local={endsAt} zone={timeZone} />
              <FieldMessage text={rule.endsAt ?? opened.field.endsAt} />
            </div>
          </div>
          <FieldMessage text={opened.field.timeZone ?? opened.general} />
          <Button
            disabled={!start || !end || ruleIssues.length > 0 || openReview.isPending}
            onClick={() => {
              // "now" is the moment of the click
              const from = opensNow ? new Date().toISOString() : start;
              if (from && end) openReview.mutate({ startsAt: from, endsAt: end, timeZone });
            }}
          >
            Open the review
          </Button>
          <p className="text-xs text-ink-faint" id="review-rule">
            {plan.minReviewDays > 0
              ? `This basin's shortest review is ${plan.minReviewDays} day${plan.minReviewDays === 1 ? "" : "s"} (a basin setting). `
              : "This basin sets no shortest review. "}
            A review cannot open in the past. Members and followers are e-mailed when it opens; it closes itself at its end.
          </p>
        </div>
      )}
      {/* the stage, not the stored status: a review whose end has passed is closed even before the closing job runs */}
      {(plan.stage === "open" || plan.stage === "scheduled") && can.manageReview && (
        <div className="flex flex-wrap items-start gap-3">
          <div>
            <label htmlFor="extend-end" className="field-label">
              New end ({periodZone})
            </label>
            <input id="extend-end" type="datetime-local" className="field-input w-56" value={newEnd} onChange={(e) => setNewEnd(e.target.value)} />
            <Instant local={newEnd} zone={periodZone} />
            <FieldMessage text={extendedFailure.field.endsAt} />
          </div>
          <div className="grow">
            <label htmlFor="extend-reason" className="field-label">
              Reason for the extension
            </label>
            <input id="extend-reason" className="field-input" value={reason} onChange={(e) => setReason(e.target.value)} />
            <FieldMessage text={extendedFailure.field.reason ?? extendedFailure.general} />
          </div>
          <Button
            variant="secondary"
            className="mt-6"
            disabled={reason.trim().length < 10 || !extended || extendReview.isPending}
            onClick={() => {
              if (!extended) return;
              extendReview.mutate(
                { endsAt: extended, reason },
                {
                  onSuccess: () => {
                    setReason("");
                    setNewEnd("");
                  },
                },
              );
            }}
          >
            Extend the review
          </Button>
        </div>
      )}
      {plan.stage === "closed" && can.publish && <PublishPanel basinId={basinId} plan={plan} />}
      <div className="flex flex-wrap gap-3">
        {(plan.status === "draft" || plan.status === "review" || plan.status === "closed") && can.manageReview && (
          <Button variant="danger" disabled={withdraw.isPending} onClick={() => window.confirm("Withdraw this plan?") && withdraw.mutate()}>
            Withdraw
          </Button>
        )}
      </div>
      <FieldMessage text={decided?.general} />
    </section>
  );
}

/**
 * Approve and publish: the lead confirms that the plan is frozen from then on and, when
 * threads have comments without a response, sees them listed and acknowledges them with
 * a statement (kept with the plan, printed in its responsiveness summary, audited).
 */
function PublishPanel({ basinId, plan }: { basinId: string; plan: PlanDto }) {
  const publish = usePublishPlanMutation(basinId, plan.id);
  const [approved, setApproved] = useState(false);
  const [acknowledged, setAcknowledged] = useState(false);
  const [statement, setStatement] = useState("");
  const unanswered = plan.threads.filter(awaitsResponse);
  const n = unanswered.length;
  const published = serverMessages(publish.error, ["acknowledgedThreadIds", "statement"]);
  const ready = approved && (n === 0 || (acknowledged && statement.trim().length >= MIN_ACK_STATEMENT));
  return (
    <div className="space-y-3 rounded-md border border-rule-strong p-3" data-testid="publish-panel">
      <h3 className="font-semibold">Approve and publish</h3>
      {n === 0 ? (
        <p className="text-sm text-ink-soft">Every comment received has its response.</p>
      ) : (
        <div className="space-y-2">
          <p className="text-sm font-semibold text-ochre-700" data-testid="unanswered-count">
            {n} thread{n === 1 ? " has" : "s have"} comments without a response:
          </p>
          <ul className="list-disc pl-5 text-sm" data-testid="unanswered-threads">
            {unanswered.map((t) => {
              const last = t.comments.reduce((m, c) => (c.at > m ? c.at : m), t.comments[0].at);
              return (
                <li key={t.id}>
                  <a href={`#thread-${t.id}`}>{t.facilityName ? `${t.facilityName} (${t.permitId})` : "The plan as a whole"}</a> — {t.comments.length} comment
                  {t.comments.length === 1 ? "" : "s"}, the last on{" "}
                  {formatDay(new Date(last), plan.basinTimeZone ?? plan.review?.timeZone ?? "UTC")}
                </li>
              );
            })}
          </ul>
          <label className="flex items-start gap-2 text-sm">
            <input type="checkbox" className="mt-1" checked={acknowledged} onChange={(e) => setAcknowledged(e.target.checked)} />
            <span>
              I have read {n === 1 ? "this thread" : `these ${n} threads`} and publish without a response to {n === 1 ? "it" : "them"}. This is recorded in the
              audit trail and printed in the responsiveness summary.
            </span>
          </label>
          <FieldMessage text={published.field.acknowledgedThreadIds} />
          <div>
            <label htmlFor="publish-statement" className="field-label">
              Why the plan is published without these responses
            </label>
            <textarea id="publish-statement" rows={2} className="field-input" value={statement} onChange={(e) => setStatement(e.target.value)} maxLength={2000} />
            <p className="text-xs text-ink-faint">At least {MIN_ACK_STATEMENT} characters; printed with the responsiveness summary.</p>
            <FieldMessage text={published.field.statement} />
          </div>
        </div>
      )}
      <label className="flex items-start gap-2 text-sm">
        <input type="checkbox" className="mt-1" checked={approved} onChange={(e) => setApproved(e.target.checked)} />
        <span>I approve this plan as it stands. Once published it is frozen: it cannot be edited or withdrawn.</span>
      </label>
      <Button
        disabled={!ready || publish.isPending}
        onClick={() => publish.mutate({ acknowledgedThreadIds: unanswered.map((t) => t.id), statement: n > 0 ? statement : "" })}
      >
        Approve and publish
      </Button>
      <FieldMessage text={published.general} />
    </div>
  );
}
