import { formatWhen } from "@/lib/format/zoned-time";
import { escapeHtml, render, type PlanRef, type RenderedEmail } from "./templates";

export interface DigestComment {
  authorName: string;
  authorRole: string;
  body: string;
  at: Date;
}

/** How many comments a digest quotes in full; the rest are counted. */
export const DIGEST_QUOTED = 10;
const QUOTE_CHARS = 600;

const clip = (text: string) => {
  const flat = text.replace(/\r\n?/g, "\n").trim();
  return flat.length > QUOTE_CHARS ? `${flat.slice(0, QUOTE_CHARS)}…` : flat;
};

/**
 * The summary of a busy thread: how many comments arrived in the window and
 * the latest of them (newest last), each clipped, with a link to the rest.
 */
export function threadDigestEmail(
  p: PlanRef & { threadTitle: string; windowMinutes: number; total: number; latest: DigestComment[]; timeZone?: string },
): RenderedEmail {
  const shown = p.latest.slice(-DIGEST_QUOTED);
  const more = p.total - shown.length;
  const line = (c: DigestComment) => `${c.authorName} (${c.authorRole}), ${formatWhen(c.at, p.timeZone ?? "UTC")}`;
  return render(`${p.total} new comments: ${p.threadTitle} (${p.planTitle})`, {
    greeting: `Hello ${p.recipientName},`,
    paragraphs: [
      `${p.total} comments arrived within ${p.windowMinutes} minutes in "${p.threadTitle}", a thread you take part in on the plan ` +
        `"${p.planTitle}" (version ${p.planVersion}) for ${p.basinName}. Busy threads are summarised like this, at most one summary per ` +
        `${p.windowMinutes} minutes, instead of one e-mail per comment.` +
        (more > 0 ? ` The latest ${shown.length} are below; open the thread for the other ${more}.` : ""),
    ],
    textExtra: shown
      .map((c) => `${line(c)}:\n${clip(c.body).split("\n").map((l) => `> ${l}`).join("\n")}`)
      .join("\n\n"),
    htmlExtra: shown
      .map(
        (c) =>
          `<p style="margin: 1em 0 0.2em"><strong>${escapeHtml(line(c))}</strong></p>` +
          `<blockquote style="border-left: 3px solid #cbd2d9; margin: 0 0 1em; padding-left: 1em">${escapeHtml(clip(c.body)).replace(/\n/g, "<br>\n")}</blockquote>`,
      )
      .join("\n"),
    action: { label: "Open the thread", url: p.url },
    caution: true,
  });
}
