"use client";
import { useMemo, useState } from "react";
import { PlanningCaution } from "@/components/results/planning-caution";
import { ProfileSection } from "@/components/results/profile-section";
import { CsvButton, downloadCsv } from "@/components/tables/sortable-table";
import { RESPONSIVENESS_COLUMNS, acknowledgementSummary, awaitsResponse, responsivenessPreface, responsivenessRows } from "@/lib/results/responsiveness";
import { Button } from "@/components/ui/button";
import { BasinZoneProvider, When } from "@/components/layout/basin-zone";
import { Notice } from "@/components/ui/notice";
import { formatTime } from "@/lib/format/zoned-time";
import type { UnitSystem } from "@/db/schema";
import { nameOf, ROLE_NAMES, THREAD_STATUS_NAMES } from "@/lib/format/labels";
import { formatIn, formatNumber, formatPercent, unitLabel } from "@/lib/format/quantities";
import { governingCondition, headwaterReaches, type StoredRunResult } from "@/lib/results";
import { usePlanQuery, type PlanDto } from "@/lib/queries/plans";
import { useAddCommentMutation, useRespondMutation } from "@/lib/queries/comments";
import { FieldMessage, serverMessages } from "./plan-acts";
import { LeadActions } from "./lead-actions";
import { PlanDownloads } from "./plan-downloads";
import { PLAN_STAGE_TEXT } from "@/lib/plans/review-rules";

export interface PlanPermissions {
  signedIn: boolean;
  manageReview: boolean;
  publish: boolean;
  answer: boolean;
  /** Facilities the viewer represents (highlighted). */
  myFacilityIds: string[];
}

/** "closes in 3 days" / "closes in 5 hours" / "closes within the hour", from now. */
function closesIn(endsAt: string): string {
  const left = Date.parse(endsAt) - Date.now();
  const hours = left / 3_600_000;
  if (hours >= 48) return `closes in ${Math.floor(hours / 24)} days`;
  if (hours >= 1) return `closes in ${Math.floor(hours)} hour${Math.floor(hours) === 1 ? "" : "s"}`;
  return "closes within the hour";
}

/** A plan: its allocations, its review period, and one comment thread per facility plus one for the whole plan. */
export function PlanView({ basinId, initial, unitSystem, can }: { basinId: string; initial: PlanDto; unitSystem: UnitSystem; can: PlanPermissions }) {
  const { data } = usePlanQuery(basinId, initial.id, initial);
  const plan = data ?? initial;
  const load = unitLabel("load", unitSystem);
  const open = plan.review?.open === true;
  const [onlyWaiting, setOnlyWaiting] = useState(false);
  const waiting = plan.threads.filter(awaitsResponse);
  const commentCount = plan.threads.reduce((n, t) => n + t.comments.length, 0);
  return (
    <BasinZoneProvider zone={plan.basinTimeZone ?? plan.review?.timeZone ?? null}>
    <div className="space-y-6" data-testid="plan-view">
      <PlanningCaution />
      <div className="flex flex-wrap items-center gap-3">
        <span className="rounded-full bg-tarn-100 px-3 py-1 text-sm font-semibold text-tarn-900" data-testid="plan-status">
          {PLAN_STAGE_TEXT[plan.stage]}
        </span>
        <span className="text-sm text-ink-soft">
          Version {plan.version}, proposed <When at={plan.createdAt} day />
          {plan.createdBy ? ` by ${plan.createdBy}` : ""}
          {plan.publishedAt && (
            <>
              ; published <When at={plan.publishedAt} />
            </>
          )}
        </span>
      </div>

      {plan.review && (
        <Notice tone={open ? "info" : "warning"} title={open ? "Review period open" : "Review period"}>
          <span data-testid="review-period">
            {formatTime(new Date(plan.review.startsAt), plan.review.timeZone)} to {formatTime(new Date(plan.review.endsAt), plan.review.timeZone)} ({plan.review.timeZone})
          </span>
          {open && (
            <span suppressHydrationWarning className="font-semibold">
              {" "}
              — {closesIn(plan.review.endsAt)}
            </span>
          )}
          {plan.review.extensions.length > 0 && (
            <ul className="mt-1 list-disc pl-5">
              {plan.review.extensions.map((x, i) => (
                <li key={i}>
                  Extended by {x.by} on <When at={x.at} zone={plan.review!.timeZone} />: {x.reason}
                </li>
              ))}
            </ul>
          )}
        </Notice>
      )}
      <LeadActions basinId={basinId} plan={plan} can={can} />

      <section className="card">
        <h2 className="mb-3">Allocations</h2>
        <div className="overflow-x-auto">
        <table className="data-table" data-testid="plan-allocations">
          <thead>
            <tr>
              <th>Facility</th>
              <th>Permit id</th>
              <th className="num">Allocated CBODu ({load})</th>
              <th className="num">Allocated BOD5 ({load})</th>
              <th className="num">Effluent BOD5 (mg/L)</th>
              <th className="num">Today ({load} CBODu)</th>
              <th className="num">Reduction (%)</th>
            </tr>
          </thead>
          <tbody>
            {plan.allocations.map((a) => (
              <tr key={a.facilityId} className={can.myFacilityIds.includes(a.facilityId) ? "!bg-ochre-100 font-semibold" : undefined}>
                <td>{a.facilityName}</td>
                <td className="whitespace-nowrap font-mono text-xs">{a.permitId}</td>
                <td className="num">{formatIn("load", a.cboduKgDay, unitSystem)}</td>
                <td className="num">{formatIn("load", a.bod5KgDay, unitSystem)}</td>
                <td className="num">{formatNumber("concentration", a.bod5MgL)}</td>
                <td className="num">{formatIn("load", a.todayCboduKgDay, unitSystem)}</td>
                <td className="num">{formatPercent(a.reductionPct)}</td>
              </tr>
            ))}
          </tbody>
        </table>
        </div>
      </section>

      <PlanProfile plan={plan} unitSystem={unitSystem} />
      <PlanDownloads basinId={basinId} planId={plan.id} published={plan.status === "published"} />

      <section className="space-y-4">
        <div className="flex items-center justify-between">
          <h2>Comments</h2>
          <CsvButton
            label="Download the responsiveness summary (CSV)"
            onClick={() =>
              downloadCsv(
                `plan-v${plan.version}-responsiveness.csv`,
                responsivenessRows(plan.threads, plan.publicationAcknowledgement),
                RESPONSIVENESS_COLUMNS,
                responsivenessPreface(plan.title, plan.version),
              )
            }
          />
        </div>
        {!open && <p className="text-sm text-ink-soft">Comments are accepted only while a review period is open.</p>}
        {plan.publicationAcknowledgement && (
          <Notice tone="warning" title="Published with threads unanswered">
            <span data-testid="publication-acknowledgement">{acknowledgementSummary(plan.publicationAcknowledgement, plan.review?.timeZone ?? "UTC")}</span>
          </Notice>
        )}
        <div className="flex flex-wrap items-center gap-4 text-sm" data-testid="comment-counts">
          <span>
            {commentCount} comment{commentCount === 1 ? "" : "s"} in {plan.threads.filter((t) => t.comments.length > 0).length} of {plan.threads.length} threads;{" "}
            <strong>{waiting.length}</strong> awaiting a response
          </span>
          <label className="flex items-center gap-2">
            <input type="checkbox" checked={onlyWaiting} onChange={(e) => setOnlyWaiting(e.target.checked)} />
            Show only threads awaiting a response
          </label>
        </div>
        {(onlyWaiting ? waiting : plan.threads).map((t) => (
          <Thread key={t.id} thread={t} canComment={open && can.signedIn} canAnswer={can.answer && plan.status !== "published"} basinId={basinId} planId={plan.id} mine={!!t.facilityId && can.myFacilityIds.includes(t.facilityId)} />
        ))}
      </section>
    </div>
    </BasinZoneProvider>
  );
}

/** DO along the river with every discharger at its proposed allocation: why the allocations are what they are. */
function PlanProfile({ plan, unitSystem }: { plan: PlanDto; unitSystem: UnitSystem }) {
  const snapshot = plan.snapshot;
  const model = snapshot.run.modelFiles[0].file;
  const heads = useMemo(() => headwaterReaches(model), [model]);
  const [from, setFrom] = useState(heads[0]);
  return (
    <ProfileSection
      run={governingCondition(snapshot.run.result as unknown as StoredRunResult).run}
      model={model}
      unitSystem={unitSystem}
      from={from}
      onFrom={setFrom}
      title="Dissolved oxygen with the proposed loads"
    />
  );
}

export function Thread({
  basinId,
  planId,
  thread,
  canComment,
  canAnswer,
  mine,
}: {
  basinId: string;
  planId: string;
  thread: PlanDto["threads"][number];
  canComment: boolean;
  canAnswer: boolean;
  mine: boolean;
}) {
  const comment = useAddCommentMutation(basinId, planId, thread.id);
  const respond = useRespondMutation(basinId, planId, thread.id);
  const commentFailure = serverMessages(comment.error, ["body"]);
  const responseFailure = serverMessages(respond.error, ["response"]);
  const [text, setText] = useState("");
  const [response, setResponse] = useState("");
  // the box is open on one's own facility and on the plan as a whole; elsewhere one click away
  const [writing, setWriting] = useState(mine || thread.facilityId === null);
  const title = thread.facilityName ? `${thread.facilityName} (${thread.permitId})` : "The plan as a whole";
  return (
    <article id={`thread-${thread.id}`} className={`card scroll-mt-4 space-y-3 ${mine ? "ring-2 ring-ochre-500" : ""}`} aria-label={`Thread: ${title}`} data-testid="thread">
      <div className="flex items-center justify-between">
        <h3 className="font-semibold">{title}</h3>
        {awaitsResponse(thread) ? (
          <span className="text-xs font-semibold text-ochre-700">{thread.response ? "addressed; new comments since" : "awaiting a response"}</span>
        ) : (
          <span className={`text-xs font-semibold ${thread.status === "addressed" ? "text-reed-700" : "text-ink-faint"}`}>{thread.comments.length === 0 ? "no comments" : nameOf(THREAD_STATUS_NAMES, thread.status)}</span>
        )}
      </div>
      {thread.comments.length === 0 && <p className="text-sm text-ink-faint">No comments.</p>}
      <ul className="space-y-2">
        {thread.comments.map((c) => (
          <li key={c.id} className="rounded-md bg-paper px-3 py-2">
            <p className="text-xs text-ink-faint">
              {c.author} · {nameOf(ROLE_NAMES, c.role)} · <When at={c.at} />
            </p>
            <p className="whitespace-pre-wrap text-sm">{c.body}</p>
          </li>
        ))}
      </ul>
      {thread.response && (
        <div className="rounded-md border-l-4 border-reed-500 bg-reed-100 px-3 py-2 text-sm">
          <p className="text-xs font-semibold text-reed-700">
            Response{thread.responder ? ` by ${thread.responder}` : ""}
            {thread.respondedAt && (
              <>
                {" · "}
                <When at={thread.respondedAt} />
              </>
            )}
          </p>
          <p className="whitespace-pre-wrap">{thread.response}</p>
        </div>
      )}
      {canComment && !writing && (
        <Button variant="quiet" className="px-2 py-1" onClick={() => setWriting(true)}>
          {thread.facilityId ? "Comment on this allocation" : "Comment on the plan"}
        </Button>
      )}
      {canComment && writing && (
        <div className="space-y-2">
          <label className="sr-only" htmlFor={`comment-${thread.id}`}>
            Comment on {title}
          </label>
          <textarea id={`comment-${thread.id}`} rows={3} className="field-input" value={text} onChange={(e) => setText(e.target.value)} />
          <FieldMessage text={commentFailure.field.body ?? commentFailure.general} />
          <Button variant="secondary" disabled={!text.trim() || comment.isPending} onClick={() => comment.mutate({ body: text }, { onSuccess: () => setText("") })}>
            Add comment
          </Button>
        </div>
      )}
      {canAnswer && thread.comments.length > 0 && (
        <div className="space-y-2 border-t border-rule pt-2">
          <label className="field-label" htmlFor={`response-${thread.id}`}>
            Response (marks the thread addressed)
          </label>
          <textarea id={`response-${thread.id}`} rows={2} className="field-input" value={response} onChange={(e) => setResponse(e.target.value)} />
          <FieldMessage text={responseFailure.field.response ?? responseFailure.general} />
          <Button variant="secondary" disabled={!response.trim() || respond.isPending} onClick={() => respond.mutate({ response }, { onSuccess: () => setResponse("") })}>
            Respond
          </Button>
        </div>
      )}
    </article>
  );
}
