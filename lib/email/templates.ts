/**
 * Plain-text and simple HTML bodies for Sagline's notices. Everything a user
 * wrote (names, titles, comments) is escaped in the HTML; comment line breaks
 * become <br>. Every notice about a plan carries the planning caution.
 */

import { formatWhen } from "@/lib/format/zoned-time";
import { PLANNING_CAUTION as CAUTION_LINES } from "@/lib/results/caution";

export interface RenderedEmail {
  subject: string;
  text: string;
  html: string;
}

/** The one planning caution (lib/results/caution.ts), as a paragraph. */
export const PLANNING_CAUTION = CAUTION_LINES.join(" ");

const KG_TO_LB = 2.20462262185;

export function escapeHtml(value: string): string {
  return value
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&#39;");
}

/** Escaped, with line breaks kept. */
function multiline(value: string): string {
  return escapeHtml(value.replace(/\r\n?/g, "\n")).replace(/\n/g, "<br>\n");
}

/** Links only to http(s) addresses; anything else is refused outright. */
function safeUrl(url: string): string {
  const parsed = new URL(url);
  if (parsed.protocol !== "http:" && parsed.protocol !== "https:") throw new Error(`e-mail link must be http(s): ${url}`);
  return parsed.toString();
}

function fmt(value: number, digits = 1): string {
  return value.toLocaleString("en-US", { maximumFractionDigits: digits, minimumFractionDigits: 0 });
}

export interface Layout {
  greeting: string;
  paragraphs: string[];
  /** Already-escaped HTML blocks shown after the paragraphs. */
  htmlExtra?: string;
  textExtra?: string;
  action: { label: string; url: string };
  caution: boolean;
  /** Small print after the action (e.g. how long a link works). */
  footnote?: string;
}

/** One e-mail in Sagline's plain layout: greeting, paragraphs, one link, then the caution or small print. */
export function render(subject: string, l: Layout): RenderedEmail {
  const url = safeUrl(l.action.url);
  const text = [
    l.greeting,
    "",
    ...l.paragraphs.flatMap((p) => [p, ""]),
    ...(l.textExtra ? [l.textExtra, ""] : []),
    `${l.action.label}: ${url}`,
    ...(l.caution ? ["", PLANNING_CAUTION] : []),
    ...(l.footnote ? ["", l.footnote] : []),
    "",
    "-- ",
    "Sagline",
  ].join("\n");
  const html = [
    `<!doctype html><html><body style="font-family: sans-serif; color: #1f2933; line-height: 1.5">`,
    `<p>${escapeHtml(l.greeting)}</p>`,
    ...l.paragraphs.map((p) => `<p>${multiline(p)}</p>`),
    l.htmlExtra ?? "",
    `<p><a href="${escapeHtml(url)}">${escapeHtml(l.action.label)}</a></p>`,
    l.caution ? `<p style="font-size: 0.9em; color: #52606d"><em>${escapeHtml(PLANNING_CAUTION)}</em></p>` : "",
    l.footnote ? `<p style="font-size: 0.9em; color: #52606d">${escapeHtml(l.footnote)}</p>` : "",
    `<p style="font-size: 0.8em; color: #7b8794">Sagline</p>`,
    `</body></html>`,
  ].join("\n");
  return { subject, text, html };
}

export interface PlanRef {
  recipientName: string;
  basinName: string;
  planTitle: string;
  planVersion: number;
  /** Link to the plan page. */
  url: string;
}

export function reviewOpenedEmail(p: PlanRef & { startsAt: Date; endsAt: Date; timeZone: string }): RenderedEmail {
  return render(`Review open: ${p.planTitle} (version ${p.planVersion}), ${p.basinName}`, {
    greeting: `Hello ${p.recipientName},`,
    paragraphs: [
      `The proposed plan "${p.planTitle}" (version ${p.planVersion}) for ${p.basinName} is open for review ` +
        `from ${formatWhen(p.startsAt, p.timeZone)} to ${formatWhen(p.endsAt, p.timeZone)}.`,
      "You can read the proposed allocations and comment on each one, or on the plan as a whole, until the review closes.",
    ],
    action: { label: "Read the plan and comment", url: p.url },
    caution: true,
  });
}

export function reviewClosingEmail(p: PlanRef & { endsAt: Date; timeZone: string }): RenderedEmail {
  return render(`Review closing soon: ${p.planTitle} (version ${p.planVersion}), ${p.basinName}`, {
    greeting: `Hello ${p.recipientName},`,
    paragraphs: [
      `The review of "${p.planTitle}" (version ${p.planVersion}) for ${p.basinName} closes at ${formatWhen(p.endsAt, p.timeZone)}.`,
      "Comments are accepted only while the review is open.",
    ],
    action: { label: "Comment before the review closes", url: p.url },
    caution: true,
  });
}

export function threadReplyEmail(
  p: PlanRef & { threadTitle: string; authorName: string; authorRole: string; body: string },
): RenderedEmail {
  const quoted = p.body.replace(/\r\n?/g, "\n");
  return render(`New reply: ${p.threadTitle} (${p.planTitle})`, {
    greeting: `Hello ${p.recipientName},`,
    paragraphs: [
      `${p.authorName} (${p.authorRole}) replied in "${p.threadTitle}", a thread you take part in on the plan ` +
        `"${p.planTitle}" (version ${p.planVersion}) for ${p.basinName}:`,
    ],
    textExtra: quoted
      .split("\n")
      .map((line) => `> ${line}`)
      .join("\n"),
    htmlExtra: `<blockquote style="border-left: 3px solid #cbd2d9; margin: 0 0 1em; padding-left: 1em">${multiline(quoted)}</blockquote>`,
    action: { label: "Open the thread", url: p.url },
    caution: true,
  });
}

/** A discharger's final allocation (CBODu and the BOD5 permit terms derived from it). */
export interface FacilityAllocationNotice {
  facilityName: string;
  todayCbodUKgDay: number;
  allocatedCbodUKgDay: number;
  bod5KgDay: number;
  bod5MgL: number;
  /** Reduction from today's load, %; null when today's load is zero. */
  reductionPct: number | null;
}

function loadText(kgDay: number): string {
  return `${fmt(kgDay)} kg/d (${fmt(kgDay * KG_TO_LB)} lb/d)`;
}

/** The lowest DO of a plan's run under its governing condition (the one with the lowest DO). */
export interface GoverningFigure {
  condition: string;
  /** How many design conditions the run has. */
  conditions: number;
  lowestDoMgL: number;
  reach: string;
  criterionMgL: number;
}

function governingSentence(g: GoverningFigure): string {
  const where = g.conditions > 1 ? `under "${g.condition}", the governing one of its ${g.conditions} design conditions` : `under "${g.condition}"`;
  const value = g.lowestDoMgL < 0 ? "anoxic" : `${g.lowestDoMgL.toFixed(2)} mg/L`;
  return `With the allocated loads the lowest dissolved oxygen is ${value} (in reach ${g.reach}) ${where}, against a criterion of ${g.criterionMgL.toFixed(1)} mg/L.`;
}

export function planPublishedEmail(
  p: PlanRef & { publishedAt: Date; timeZone: string; allocations: FacilityAllocationNotice[]; governing?: GoverningFigure | null },
): RenderedEmail {
  const lines = p.allocations.map((a) => ({
    facility: a.facilityName,
    rows: [
      ["Load today (CBODu)", loadText(a.todayCbodUKgDay)],
      ["Final allocation (CBODu)", loadText(a.allocatedCbodUKgDay)],
      ["Permit terms (BOD5)", `${loadText(a.bod5KgDay)}, ${fmt(a.bod5MgL)} mg/L at design flow`],
      ["Reduction from today", a.reductionPct === null ? "not applicable (no load today)" : `${fmt(a.reductionPct)} %`],
    ],
  }));
  const textExtra = lines
    .map((l) => [l.facility, ...l.rows.map(([k, v]) => `  ${k}: ${v}`)].join("\n"))
    .join("\n\n");
  const htmlExtra = lines
    .map(
      (l) =>
        `<h3 style="margin-bottom: 0.25em">${escapeHtml(l.facility)}</h3>\n<table cellpadding="4" style="border-collapse: collapse">\n` +
        l.rows.map(([k, v]) => `<tr><th align="left">${escapeHtml(k)}</th><td>${escapeHtml(v)}</td></tr>`).join("\n") +
        "\n</table>",
    )
    .join("\n");
  const yours = p.allocations.length === 1 ? "your facility's final allocation" : "the final allocations of your facilities";
  return render(`Plan published: ${p.planTitle} (version ${p.planVersion}), ${p.basinName}`, {
    greeting: `Hello ${p.recipientName},`,
    paragraphs: [
      `The plan "${p.planTitle}" (version ${p.planVersion}) for ${p.basinName} was published on ${formatWhen(p.publishedAt, p.timeZone)}.` +
        (p.allocations.length > 0 ? ` Below is ${yours}.` : ""),
      ...(p.governing ? [governingSentence(p.governing)] : []),
    ],
    textExtra: textExtra || undefined,
    htmlExtra,
    action: { label: "Read the published plan", url: p.url },
    caution: true,
  });
}
