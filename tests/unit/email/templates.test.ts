import { passwordResetEmail } from "@/lib/email/account-templates";
import { describe, expect, it } from "vitest";
import {
  escapeHtml,
  planPublishedEmail,
  PLANNING_CAUTION,
  reviewClosingEmail,
  reviewOpenedEmail,
  threadReplyEmail,
} from "@/lib/email/templates";
import { retryDelayMs } from "@/lib/email/sender";
import { formatWhen } from "@/lib/format/zoned-time";

const plan = {
  recipientName: "Mira Tallow",
  basinName: "Alder Creek",
  planTitle: "Summer low-flow plan",
  planVersion: 2,
  url: "https://sagline.example.test/basins/alder/plans/7",
};
const hostile = `<script>alert("x")</script> & 'quoted'`;

describe("escapeHtml", () => {
  it("escapes the five HTML-significant characters", () => {
    expect(escapeHtml(`<a href="x">'&'</a>`)).toBe("&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;");
  });
});

describe("notices about plans", () => {
  const all = [
    reviewOpenedEmail({ ...plan, startsAt: new Date("2027-01-04T09:00:00Z"), endsAt: new Date("2027-02-04T17:00:00Z"), timeZone: "America/Chicago" }),
    reviewClosingEmail({ ...plan, endsAt: new Date("2027-02-04T17:00:00Z"), timeZone: "UTC" }),
    threadReplyEmail({ ...plan, threadTitle: "Mill Road outfall", authorName: "Ola Brand", authorRole: "discharger", body: "Line one\nLine two" }),
    planPublishedEmail({
      ...plan,
      publishedAt: new Date("2027-03-01T12:00:00Z"),
      timeZone: "UTC",
      allocations: [{ facilityName: "Mill Road works", todayCbodUKgDay: 400, allocatedCbodUKgDay: 250, bod5KgDay: 170.5, bod5MgL: 18.2, reductionPct: 37.5 }],
    }),
  ];

  it("every one carries the planning caution in text and HTML", () => {
    for (const email of all) {
      expect(email.text).toContain(PLANNING_CAUTION);
      expect(email.html).toContain(escapeHtml(PLANNING_CAUTION));
      expect(email.text).toContain(plan.url);
    }
    expect(PLANNING_CAUTION).toMatch(/calibrated model/);
    expect(PLANNING_CAUTION).toMatch(/qualified \(licensed\) engineer/);
    expect(PLANNING_CAUTION).toMatch(/standards and permitting rules of the jurisdiction take precedence/);
  });

  it("account notices do not talk about allocations, and say how long their link works", () => {
    const email = passwordResetEmail({ name: "Mira <b>", url: "http://127.0.0.1:3000/reset-password?token=abc", expiresAt: new Date("2027-01-04T10:00:00Z") });
    expect(email.text).not.toContain(PLANNING_CAUTION);
    expect(email.subject).toBe("Choose a new Sagline password");
    expect(email.text).toContain("The link works once, until 4 Jan 2027, 10:00 UTC.");
    expect(email.html).toContain("Mira &lt;b&gt;");
    expect(email.html).not.toContain("<b>");
  });

  it("states times with their time zone", () => {
    expect(all[0].text).toContain(formatWhen(new Date("2027-01-04T09:00:00Z"), "America/Chicago"));
    expect(formatWhen(new Date("2027-01-04T09:00:00Z"), "America/Chicago")).toBe("4 Jan 2027, 03:00 CST (America/Chicago)");
    expect(all[1].text).toContain("4 Feb 2027, 17:00 UTC");
  });

  it("escapes everything user-written in the HTML and keeps comment line breaks", () => {
    const email = threadReplyEmail({
      ...plan,
      planTitle: hostile,
      threadTitle: hostile,
      authorName: hostile,
      authorRole: "stakeholder",
      body: `${hostile}\nsecond line`,
    });
    expect(email.html).not.toContain("<script>");
    expect(email.html).toContain("&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &#39;quoted&#39;");
    expect(email.html).toContain("<br>\nsecond line");
    // the plain text keeps the words as written, quoted
    expect(email.text).toContain(`> ${hostile}\n> second line`);
    const published = planPublishedEmail({
      ...plan,
      basinName: hostile,
      publishedAt: new Date(),
      timeZone: "UTC",
      allocations: [{ facilityName: hostile, todayCbodUKgDay: 0, allocatedCbodUKgDay: 10, bod5KgDay: 6, bod5MgL: 20, reductionPct: null }],
    });
    expect(published.html).not.toContain("<script>");
    expect(published.text).toContain("not applicable (no load today)");
  });

  it("gives each discharger its final allocation with today's load and the permit terms", () => {
    const email = all[3];
    expect(email.text).toContain("Mill Road works");
    expect(email.text).toContain("Final allocation (CBODu): 250 kg/d (551.2 lb/d)");
    expect(email.text).toContain("Load today (CBODu): 400 kg/d (881.8 lb/d)");
    expect(email.text).toContain("170.5 kg/d (375.9 lb/d), 18.2 mg/L at design flow");
    expect(email.text).toContain("Reduction from today: 37.5 %");
    expect(email.html).toContain("<th align=\"left\">Final allocation (CBODu)</th><td>250 kg/d (551.2 lb/d)</td>");
  });

  it("refuses a link that is not http(s)", () => {
    expect(() => reviewClosingEmail({ ...plan, url: "javascript:alert(1)", endsAt: new Date(), timeZone: "UTC" })).toThrow(/http/);
  });
});

describe("retry back-off", () => {
  it("doubles per attempt up to the cap", () => {
    expect([1, 2, 3, 4, 5, 6, 7, 8].map((n) => retryDelayMs(n, 30_000, 3_600_000))).toEqual([
      30_000, 60_000, 120_000, 240_000, 480_000, 960_000, 1_920_000, 3_600_000,
    ]);
  });
});
