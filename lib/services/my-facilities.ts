import { facilityIdsForUser, listFacilities as listFacilityRows } from "@/db/queries/facilities";
import { currentPeriod } from "@/db/queries/plans";
import type { BasinScope } from "@/lib/auth/scope";
import { notFound } from "@/lib/errors";
import type { PlanStage } from "@/lib/plans/review-rules";
import { getPlan, listPlans } from "./plans";

/** Plan states a discharger's view offers: the ones it can read (drafts and withdrawn plans are not proposals to it). */
const OFFERED = new Set(["review", "closed", "published"]);

/** What the governing-plan choice reads of a plan. */
export interface OfferedPlan {
  id: string;
  stage: PlanStage;
  createdAt: string;
  publishedAt: string | null;
}

const newestFirst = (at: (p: OfferedPlan) => string | null) => (a: OfferedPlan, b: OfferedPlan) => (at(b) ?? "").localeCompare(at(a) ?? "");

/**
 * The plan that governs a discharger's allocation: the newest published plan (the final
 * allocation stays in force while a later version is only proposed), else the one whose
 * review is open, else the newest offered. "Newest" is by publication, then proposal time,
 * never by version number (versions count per plan lineage). Null for an empty list.
 */
export function governingPlan<P extends OfferedPlan>(plans: readonly P[]): P | null {
  const published = plans.filter((p) => p.stage === "published").sort(newestFirst((p) => p.publishedAt));
  if (published.length) return published[0];
  const open = plans.filter((p) => p.stage === "open").sort(newestFirst((p) => p.createdAt));
  if (open.length) return open[0];
  return [...plans].sort(newestFirst((p) => p.createdAt))[0] ?? null;
}

/** "3 Dec 2026" in the named zone. */
const dayIn = (iso: string, timeZone: string) => new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone }).format(new Date(iso));

/**
 * How a version is named in the discharger's navigation, by its state and date: "Published
 * 3 Dec 2026 — version 1 (final)", "In review until 5 Jan 2027 — version 2", "Review closed
 * 4 Jan 2027 — version 2". Dates are days in the review's time zone (UTC without one).
 */
export function versionLabel(
  p: { version: number; stage: PlanStage; publishedAt: string | null; review: { startsAt: string; endsAt: string; closedAt: string | null; timeZone: string } | null },
  role: "final" | "superseded" | null,
): string {
  const zone = p.review?.timeZone ?? "UTC";
  const tail = `version ${p.version}${role ? ` (${role})` : ""}`;
  switch (p.stage) {
    case "published":
      return `Published${p.publishedAt ? ` ${dayIn(p.publishedAt, zone)}` : ""} — ${tail}`;
    case "open":
      return `In review${p.review ? ` until ${dayIn(p.review.endsAt, zone)}` : ""} — ${tail}`;
    case "scheduled":
      return `Review opens${p.review ? ` ${dayIn(p.review.startsAt, zone)}` : ""} — ${tail}`;
    case "closed":
      return `Review closed${p.review ? ` ${dayIn(p.review.closedAt ?? p.review.endsAt, zone)}` : ""} — ${tail}`;
    default:
      return `${p.stage} — ${tail}`;
  }
}

/**
 * A discharger's own view of a basin: the facilities it represents, the plans that propose
 * allocations to them (each labelled by state and date, newest first), the plan that governs
 * (see governingPlan), and one plan in full — the governing one unless `planId` names another.
 * Anyone who may read the basin gets an answer; it is empty for people who represent no facility.
 */
export async function getMyFacilities(scope: BasinScope, planId?: string) {
  scope.require("basin.read");
  const { db, actor, basin } = scope;
  const mine = new Set(await facilityIdsForUser(db, basin.id, actor.id));
  const facilities = (await listFacilityRows(db, basin.id))
    .filter((f) => mine.has(f.id))
    .map((f) => ({ id: f.id, name: f.name, permitId: f.permit_id }));
  const listed = facilities.length === 0 ? [] : (await listPlans(db, actor, basin.id)).filter((p) => OFFERED.has(p.status));
  const withReview = await Promise.all(
    listed.map(async (p) => {
      const period = await currentPeriod(db, p.id);
      const review = period
        ? { startsAt: period.starts_at.toISOString(), endsAt: period.ends_at.toISOString(), closedAt: period.closed_at?.toISOString() ?? null, timeZone: period.time_zone }
        : null;
      return { ...p, review };
    }),
  );
  const governing = governingPlan(withReview);
  const plans = withReview
    .sort(newestFirst((p) => p.createdAt))
    .map((p) => {
      const role = p.stage !== "published" ? null : p.id === governing?.id ? "final" : "superseded";
      return { ...p, governing: p.id === governing?.id, label: versionLabel(p, role) };
    });
  const chosen = planId ? plans.find((p) => p.id === planId) : plans.find((p) => p.governing);
  if (planId && !chosen) throw notFound("Plan");
  const plan = chosen ? await getPlan(db, actor, basin.id, chosen.id) : null;
  return { facilities, plans, governingId: governing?.id ?? null, plan };
}

