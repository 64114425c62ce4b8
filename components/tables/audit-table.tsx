"use client";
import { When } from "@/components/layout/basin-zone";
import Link from "next/link";
import { CsvButton, downloadCsv, type CsvColumn } from "@/components/tables/sortable-table";
import { AUDIT_DETAIL_NAMES, AUDIT_TARGET_NAMES, auditAction, nameOf } from "@/lib/format/labels";
import type { AuditEventDto } from "@/lib/services/audit";

const actionText = (e: AuditEventDto) => auditAction(e.action);

/** Where an event's target can be opened, when it still can: the page that shows what the event changed. */
export function auditTargetHref(basinId: string, e: Pick<AuditEventDto, "action" | "targetType" | "targetId" | "planId">): string | null {
  const base = `/basins/${basinId}`;
  if (!e.targetId) return null;
  switch (e.targetType) {
    case "plan":
      return `${base}/plans/${e.targetId}`;
    case "thread":
      return e.planId ? `${base}/plans/${e.planId}#thread-${e.targetId}` : null;
    case "scenario":
      return e.action === "scenario.deleted" ? null : `${base}/scenarios/${e.targetId}`;
    case "run":
      return `${base}/runs/${e.targetId}`;
    case "network":
    case "reach":
    case "import":
      return `${base}/network`;
    case "facility":
    case "user":
    case "invitation":
      return `${base}/members`;
    case "basin":
      return `${base}/settings`;
    default:
      return null;
  }
}

/** Plain names for a detail key: the table's, else the camelCase key in words ("closedAt" → "closed at"). */
const detailName = (k: string) => AUDIT_DETAIL_NAMES[k] ?? k.replace(/([a-z])([A-Z])/g, "$1 $2").replace(/_/g, " ").toLowerCase();

/** An ISO timestamp as "2027-01-03 07:32 UTC"; any other text as it is. */
const isoMinute = (v: string) => v.replace(/^(\d{4}-\d{2}-\d{2})T(\d{2}:\d{2})(:\d{2}(\.\d+)?)?Z$/, "$1 $2 UTC");

/** "name: value" pairs of an event's details, on one line. */
function detailText(details: Record<string, unknown>): string {
  return Object.entries(details)
    .filter(([, v]) => v !== null && v !== undefined && v !== "")
    .map(([k, v]) => `${detailName(k)}: ${typeof v === "object" ? JSON.stringify(v) : isoMinute(String(v))}`)
    .join("; ");
}

const COLUMNS: CsvColumn<AuditEventDto>[] = [
  { header: "Time (UTC)", value: (e) => e.at },
  { header: "Who", value: (e) => e.actor ?? "Sagline (on schedule)" },
  { header: "What happened", value: (e) => actionText(e) },
  { header: "On", value: (e) => nameOf(AUDIT_TARGET_NAMES, e.targetType) },
  { header: "Target id", value: (e) => e.targetId },
  { header: "Details", value: (e) => detailText(e.details) },
  // the stored code, for matching the trail against the database or another export
  { header: "Event code", value: (e) => e.action },
];

export function AuditTable({ basinId, basinName, events }: { basinId: string; basinName: string; events: AuditEventDto[] }) {
  if (events.length === 0) return <p className="text-sm text-ink-soft">Nothing recorded here yet.</p>;
  const target = (e: AuditEventDto) => {
    const word = nameOf(AUDIT_TARGET_NAMES, e.targetType);
    const href = auditTargetHref(basinId, e);
    return href ? <Link href={href}>{word}</Link> : word;
  };
  return (
    <div className="space-y-2">
      <div className="flex justify-end">
        <CsvButton label="Download these events (CSV)" onClick={() => downloadCsv(`audit-trail-${basinId}.csv`, events, COLUMNS, [`Audit trail of ${basinName}`])} />
      </div>
      <div className="overflow-x-auto">
      <table className="data-table" data-testid="audit-table">
        <thead>
          <tr>
            <th>When</th>
            <th>Who</th>
            <th>What</th>
            <th className="hidden sm:table-cell">On</th>
            <th className="hidden sm:table-cell">Details</th>
          </tr>
        </thead>
        <tbody>
          {events.map((e) => (
            <tr key={e.id}>
              <td className="text-xs sm:whitespace-nowrap">
                <When at={e.at} />
              </td>
              <td>{e.actor ?? <span className="text-ink-faint">Sagline (on schedule)</span>}</td>
              <td>
                {actionText(e)}
                {/* on a phone what it changed and the details sit under what happened instead of in columns of their own */}
                <span className="mt-1 block break-words text-xs text-ink-soft sm:hidden">
                  {target(e)}
                  {Object.keys(e.details).length > 0 ? ` · ${detailText(e.details)}` : ""}
                </span>
              </td>
              <td className="hidden sm:table-cell">{target(e)}</td>
              <td className="hidden max-w-md break-words text-xs text-ink-soft sm:table-cell">{detailText(e.details)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      </div>
    </div>
  );
}
