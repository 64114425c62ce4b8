import type { CsvColumn } from "@/components/tables/sortable-table";
import { exportPreface } from "./caution";

export interface ThreadForSummary {
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
export function responsivenessRows(threads: ThreadForSummary[]): ResponsivenessRow[] {
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
        response: t.response ?? "",
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
  { header: "Role", value: (r) => r.role },
  { header: "Comment", value: (r) => r.comment },
  { header: "Response", value: (r) => r.response },
  { header: "Responded by", value: (r) => r.responder },
  { header: "Thread", value: (r) => r.status },
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
