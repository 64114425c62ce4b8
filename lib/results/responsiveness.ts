import type { CsvColumn } from "@/lib/reports/csv-text";
import { nameOf, ROLE_NAMES, THREAD_STATUS_NAMES } from "@/lib/format/labels";
import { formatDay } from "@/lib/format/zoned-time";
import { exportPreface } from "./caution";

/** What the lead acknowledged on publishing with threads unanswered (db/schema PublicationAcknowledgement). */
export interface PublicationAcknowledgementLike {
  by: string;
  at: string;
  statement: string;
  threads: Array<{ id: string; topic: string; comments: number }>;
}

/**
 * The line a thread left unanswered carries in the responsiveness summary: that it had no
 * response when the plan was published, who acknowledged that, when (in `timeZone`'s
 * date), and the lead's statement.
 */
export function acknowledgementNote(ack: PublicationAcknowledgementLike, timeZone = "UTC"): string {
  const day = formatDay(new Date(ack.at), timeZone);
  return `No response when the plan was published on ${day}; acknowledged by ${ack.by}: "${ack.statement}"`;
}

/** One sentence for the summary's head: how many threads went out unanswered, and the statement. */
export function acknowledgementSummary(ack: PublicationAcknowledgementLike, timeZone = "UTC"): string {
  const n = ack.threads.length;
  const day = formatDay(new Date(ack.at), timeZone);
  return (
    `${n} thread${n === 1 ? " was" : "s were"} published without a response (${ack.threads.map((t) => t.topic).join("; ")}). ` +
    `${ack.by} acknowledged this on ${day}: "${ack.statement}"`
  );
}

export interface ThreadForSummary {
  /** The thread's id (matches a publication acknowledgement's threads). */
  id?: string;
  facilityName: string | null;
  permitId: string | null;
  status: string;
  response: string | null;
  responder: string | null;
  comments: { author: string; role: string; body: string; at: string }[];
}

export interface ResponsivenessRow {
  topic: string;
  permitId: string;
  at: string;
  author: string;
  role: string;
  comment: string;
  response: string;
  responder: string;
  status: string;
}

/**
 * The responsiveness summary: every comment with the response its thread
 * received, thread by thread (the plan as a whole first), oldest comment first.
 */
export function responsivenessRows(threads: ThreadForSummary[], ack: PublicationAcknowledgementLike | null = null): ResponsivenessRow[] {
  const acknowledged = new Set(ack?.threads.map((t) => t.id) ?? []);
  const ordered = [...threads].sort((a, b) => (a.facilityName === null ? -1 : b.facilityName === null ? 1 : a.facilityName.localeCompare(b.facilityName)));
  return ordered.flatMap((t) =>
    [...t.comments]
      .sort((a, b) => a.at.localeCompare(b.at))
      .map((c) => ({
        topic: t.facilityName ?? "The plan as a whole",
        permitId: t.permitId ?? "",
        at: c.at,
        author: c.author,
        role: c.role,
        comment: c.body,
        // a thread with later comments than its response keeps the response and gains the note
        response: [t.response ?? "", ack && t.id && acknowledged.has(t.id) ? acknowledgementNote(ack) : ""].filter(Boolean).join(" — "),
        responder: t.responder ?? "",
        status: t.status,
      })),
  );
}

export const RESPONSIVENESS_COLUMNS: CsvColumn<ResponsivenessRow>[] = [
  { header: "Topic", value: (r) => r.topic },
  { header: "Permit id", value: (r) => r.permitId },
  { header: "Commented at (UTC)", value: (r) => r.at },
  { header: "Author", value: (r) => r.author },
  { header: "Role", value: (r) => nameOf(ROLE_NAMES, r.role) },
  { header: "Comment", value: (r) => r.comment },
  { header: "Response", value: (r) => r.response },
  { header: "Responded by", value: (r) => r.responder },
  { header: "Thread", value: (r) => nameOf(THREAD_STATUS_NAMES, r.status) },
];

export const responsivenessPreface = (planTitle: string, version: number) => exportPreface(`Responsiveness summary: ${planTitle}, version ${version}`);

/**
 * Whether a thread waits for a planner: it has a comment and no response yet,
 * or a comment written after the last response.
 */
export function awaitsResponse(thread: { comments: { at: string }[]; respondedAt: string | null }): boolean {
  if (thread.comments.length === 0) return false;
  if (!thread.respondedAt) return true;
  const answered = Date.parse(thread.respondedAt);
  return thread.comments.some((c) => Date.parse(c.at) > answered);
}
