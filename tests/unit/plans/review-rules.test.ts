import { describe, expect, it } from "vitest";
import { planStage, reviewDateIssues, START_GRACE_MS } from "@/lib/plans/review-rules";

const DAY = 86_400_000;
const now = new Date("2026-12-02T12:00:00Z");
const at = (ms: number) => new Date(now.getTime() + ms);

describe("review dates", () => {
  it("a review in the past, an end before the start and a review shorter than the basin's minimum each name their field", () => {
    expect(reviewDateIssues({ startsAt: new Date("2026-11-01T09:00:00Z"), endsAt: new Date("2026-11-05T17:00:00Z"), minReviewDays: 0, now }).map((i) => i.path)).toEqual(["startsAt"]);
    expect(reviewDateIssues({ startsAt: at(DAY), endsAt: at(DAY), minReviewDays: 0, now }).map((i) => i.path)).toEqual(["endsAt"]);
    const short = reviewDateIssues({ startsAt: now, endsAt: at(29 * DAY), minReviewDays: 30, now }, "America/Chicago");
    // 30 days after 2 Dec 2026 12:00 UTC is 1 Jan 2027 12:00 UTC = 06:00 in Chicago (UTC−6 in winter)
    expect(short).toEqual([{ path: "endsAt", message: "The basin's shortest review is 30 days: close it on or after 1 Jan 2027, 06:00 CST (America/Chicago)" }]);
    expect(reviewDateIssues({ startsAt: now, endsAt: at(30 * DAY), minReviewDays: 30, now })).toEqual([]);
  });

  it("allows a start just inside the grace, not just outside it", () => {
    expect(reviewDateIssues({ startsAt: at(-START_GRACE_MS + 1000), endsAt: at(40 * DAY), minReviewDays: 30, now })).toEqual([]);
    expect(reviewDateIssues({ startsAt: at(-START_GRACE_MS - 1000), endsAt: at(40 * DAY), minReviewDays: 30, now })[0].path).toBe("startsAt");
  });
});

describe("plan stage", () => {
  const period = { startsAt: at(DAY), endsAt: at(31 * DAY), closedAt: null };
  it("follows the review period's dates while the status is 'review'", () => {
    expect(planStage("review", period, now)).toBe("scheduled");
    expect(planStage("review", period, at(DAY))).toBe("open");
    expect(planStage("review", period, at(31 * DAY - 1))).toBe("open");
    // the end has passed but the closing job has not run yet: closed, as the list and the badge both say
    expect(planStage("review", period, at(31 * DAY))).toBe("closed");
    expect(planStage("review", { ...period, closedAt: at(2 * DAY) }, at(2 * DAY))).toBe("closed");
  });
  it("is the status itself otherwise", () => {
    for (const s of ["draft", "closed", "published", "withdrawn"] as const) expect(planStage(s, period, now)).toBe(s);
  });
});
