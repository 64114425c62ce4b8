import type { Metadata } from "next";
import Link from "next/link";
import { AuditTable } from "@/components/tables/audit-table";
import { Denied } from "@/components/ui/denied";
import { basinPageAccess } from "@/lib/auth/page-access";
import { AUDIT_AREAS, listBasinAudit } from "@/lib/services/audit";
import { auditQuerySchema } from "@/lib/validation/audit";

export const metadata: Metadata = { title: "Audit trail" };

const PAGE = 100;

/** Who did what and when in this basin (leads and admins), newest first, by area, a page at a time. */
export default async function AuditPage({
  params,
  searchParams,
}: {
  params: Promise<{ basinId: string }>;
  searchParams: Promise<{ area?: string; before?: string }>;
}) {
  const { basinId } = await params;
  const query = await searchParams;
  const access = await basinPageAccess(basinId, "audit.read");
  if (!access.ok) return <Denied message={access.message} />;
  // a hand-edited address that does not parse shows the newest events of every area
  const parsed = auditQuerySchema.safeParse(query);
  const { area, before } = parsed.success ? parsed.data : {};
  const events = await listBasinAudit(access.scope, { area, before, limit: PAGE });
  const base = `/basins/${access.basin.id}/audit`;
  const href = (a?: string, b?: string) => {
    const q = new URLSearchParams();
    if (a) q.set("area", a);
    if (b) q.set("before", b);
    const s = q.toString();
    return s ? `${base}?${s}` : base;
  };
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-2 text-sm" role="group" aria-label="Area">
        <span className="text-ink-soft">Show:</span>
        <Link href={href()} aria-current={!area ? "page" : undefined} className={!area ? "font-semibold" : undefined}>
          Everything
        </Link>
        {Object.entries(AUDIT_AREAS).map(([key, a]) => (
          <Link key={key} href={href(key)} aria-current={area === key ? "page" : undefined} className={area === key ? "font-semibold" : undefined}>
            {a.label}
          </Link>
        ))}
      </div>
      {before && (
        <p className="text-sm text-ink-soft">
          Older events · <Link href={href(area)}>back to the newest</Link>
        </p>
      )}
      <AuditTable basinId={access.basin.id} basinName={access.basin.name} events={events} />
      {events.length === PAGE && (
        <Link href={href(area, events[events.length - 1].id)} className="text-sm">
          Older events
        </Link>
      )}
    </div>
  );
}
