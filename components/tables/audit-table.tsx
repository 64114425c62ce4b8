"use client";
import { When } from "@/components/layout/basin-zone";
import Link from "next/link";
import { CsvButton, downloadCsv, type CsvColumn } from "@/components/tables/sortable-table";
import type { AuditEventDto } from "@/lib/services/audit";

/** Plain words for each recorded action; unknown actions show as recorded. */
const ACTION_TEXT: Record<string, string> = {
  "basin.created": "Basin created",
  "basin.updated": "Basin settings changed",
  "member.added": "Member added",
  "member.removed": "Member removed",
  "member.role_changed": "Member's role changed",
  "facility.created": "Facility added",
  "facility.user_linked": "Discharger linked to a facility",
  "facility.user_unlinked": "Discharger unlinked from a facility",
  "invitation.sent": "Invitation sent",
  "invitation.accepted": "Invitation accepted",
  "invitation.revoked": "Invitation revoked",
  "import.uploaded": "GIS file uploaded",
  "network.committed": "Network version saved",
  "network.reach_edited": "Reach edited",
  "network.discharger_edited": "Outfall edited",
  "scenario.created": "Scenario created",
  "scenario.updated": "Scenario changed",
  "scenario.deleted": "Scenario deleted",
  "run.queued": "Run started",
  "plan.proposed": "Plan proposed",
  "plan.exported": "Unpublished plan exported",
  "plan.published": "Plan published",
  "plan.withdrawn": "Plan withdrawn",
  "review.opened": "Review period opened",
  "review.extended": "Review period extended",
  "review.closed": "Review period closed",
  "comment.added": "Comment added",
  "thread.addressed": "Thread answered",
};

const actionText = (action: string) => ACTION_TEXT[action] ?? action;

/** "key: value" pairs of an event's details, on one line. */
function detailText(details: Record<string, unknown>): string {
  return Object.entries(details)
    .map(([k, v]) => `${k}: ${typeof v === "object" && v !== null ? JSON.stringify(v) : String(v)}`)
    .join("; ");
}

const COLUMNS: CsvColumn<AuditEventDto>[] = [
  { header: "time (UTC)", value: (e) => e.at },
  { header: "who", value: (e) => e.actor ?? "Sagline (scheduled)" },
  { header: "action", value: (e) => e.action },
  { header: "what", value: (e) => actionText(e.action) },
  { header: "target type", value: (e) => e.targetType },
  { header: "target id", value: (e) => e.targetId },
  { header: "details", value: (e) => detailText(e.details) },
];

export function AuditTable({ basinId, basinName, events }: { basinId: string; basinName: string; events: AuditEventDto[] }) {
  if (events.length === 0) return <p className="text-sm text-ink-soft">Nothing recorded here yet.</p>;
  const target = (e: AuditEventDto) => {
    if (e.targetType === "plan" && e.targetId) return <Link href={`/basins/${basinId}/plans/${e.targetId}`}>plan</Link>;
    if (e.targetType === "scenario" && e.targetId && e.action !== "scenario.deleted") return <Link href={`/basins/${basinId}/scenarios/${e.targetId}`}>scenario</Link>;
    return e.targetType;
  };
  return (
    <div className="space-y-2">
      <div className="flex justify-end">
        <CsvButton label="Download these events (CSV)" onClick={() => downloadCsv(`audit-${basinId}.csv`, events, COLUMNS, [`Audit trail of ${basinName}`])} />
      </div>
      <table className="data-table" data-testid="audit-table">
        <thead>
          <tr>
            <th>When</th>
            <th>Who</th>
            <th>What</th>
            <th>On</th>
            <th>Details</th>
          </tr>
        </thead>
        <tbody>
          {events.map((e) => (
            <tr key={e.id}>
              <td className="whitespace-nowrap text-xs">
                <When at={e.at} />
              </td>
              <td>{e.actor ?? <span className="text-ink-faint">Sagline (scheduled)</span>}</td>
              <td>
                {actionText(e.action)} <span className="font-mono text-xs text-ink-faint">{e.action}</span>
              </td>
              <td>{target(e)}</td>
              <td className="max-w-md break-words text-xs text-ink-soft">{detailText(e.details)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
