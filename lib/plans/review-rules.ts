import type { FieldIssue } from "@/lib/errors";
import { formatWhen } from "@/lib/format/zoned-time";

/** How far in the past a review may be said to open (the time to click, a clock a little off). */
export const START_GRACE_MS = 5 * 60_000;
const DAY_MS = 86_400_000;

export interface ReviewDates {
  startsAt: Date;
  endsAt: Date;
  /** The basin's shortest review, days (0: no minimum). */
  minReviewDays: number;
  now: Date;
}

/**
 * What is wrong with the dates of a review being opened, field by field: it may not open in
 * the past (that would skip the comment period), must end after it opens, and must run at
 * least the basin's shortest review. The server refuses with these issues and the lead's
 * form shows the same ones before it is sent.
 */
export function reviewDateIssues({ startsAt, endsAt, minReviewDays, now }: ReviewDates, timeZone = "UTC"): FieldIssue[] {
  const issues: FieldIssue[] = [];
  if (startsAt.getTime() < now.getTime() - START_GRACE_MS) {
    issues.push({ path: "startsAt", message: "The review cannot open in the past: that would skip the comment period. Open it now or later" });
  }
  if (endsAt.getTime() <= startsAt.getTime()) {
    issues.push({ path: "endsAt", message: "The review must close after it opens" });
  } else if (endsAt.getTime() - startsAt.getTime() < minReviewDays * DAY_MS) {
    const earliest = new Date(startsAt.getTime() + minReviewDays * DAY_MS);
    issues.push({
      path: "endsAt",
      message: `The basin's shortest review is ${minReviewDays} day${minReviewDays === 1 ? "" : "s"}: close it on or after ${formatWhen(earliest, timeZone)}`,
    });
  }
  return issues;
}

export type PlanStatus = "draft" | "review" | "closed" | "published" | "withdrawn";

/**
 * Where a plan stands, from its status and its review period at `now`: the one answer the
 * badge, the plan lists, the review list and the API all give. A plan whose review has been
 * opened for a later start is "scheduled"; one whose end has passed is "closed" at once,
 * before the scheduled job records it.
 */
export type PlanStage = "draft" | "scheduled" | "open" | "closed" | "published" | "withdrawn";

export function planStage(
  status: PlanStatus,
  period: { startsAt: Date; endsAt: Date; closedAt: Date | null } | null | undefined,
  now: Date,
): PlanStage {
  if (status !== "review") return status;
  if (!period) return "open";
  if (period.closedAt !== null || now.getTime() >= period.endsAt.getTime()) return "closed";
  return now.getTime() < period.startsAt.getTime() ? "scheduled" : "open";
}

export const PLAN_STAGE_TEXT: Record<PlanStage, string> = {
  draft: "draft (planners and leads only)",
  scheduled: "review scheduled",
  open: "in review",
  closed: "review closed",
  published: "published",
  withdrawn: "withdrawn",
};
