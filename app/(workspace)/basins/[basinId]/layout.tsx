import { notFound } from "next/navigation";
import type { ReactNode } from "react";
import { BasinTabs } from "@/components/layout/basin-tabs";
import { BasinZoneProvider } from "@/components/layout/basin-zone";
import { Denied } from "@/components/ui/denied";
import { RoleBadge } from "@/components/ui/role-badge";
import { basinPageAccess } from "@/lib/auth/page-access";
import { myFacilityIds } from "@/lib/services/facilities";

export default async function BasinLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ basinId: string }>;
}) {
  const { basinId } = await params;
  const access = await basinPageAccess(basinId, "basin.read");
  if (!access.ok) {
    if (access.status === 404) notFound();
    return <Denied message={access.message} />;
  }
  const { basin, role } = access;
  const tabs = [
    { href: `/basins/${basin.id}`, label: "Overview", show: true },
    { href: `/basins/${basin.id}/network`, label: "Network", show: access.can("scenario.read") },
    { href: `/basins/${basin.id}/gauges`, label: "Gauges", show: access.can("scenario.read") },
    { href: `/basins/${basin.id}/surveys`, label: "Surveys", show: access.can("scenario.read") },
    { href: `/basins/${basin.id}/scenarios`, label: "Scenarios", show: access.can("scenario.read") },
    { href: `/basins/${basin.id}/plans`, label: "Plans", show: true },
    { href: `/basins/${basin.id}/my-facilities`, label: "My facilities", show: (await myFacilityIds(access.scope)).length > 0 },
    { href: `/basins/${basin.id}/members`, label: "Members & facilities", show: access.can("members.read") },
    { href: `/basins/${basin.id}/audit`, label: "Audit trail", show: access.can("audit.read") },
    { href: `/basins/${basin.id}/settings`, label: "Settings", show: access.can("basin.update") },
  ].filter((t) => t.show);
  return (
    <div>
      <div className="mb-2 flex flex-wrap items-center gap-3">
        <h1>{basin.name}</h1>
        {role && <RoleBadge role={role} />}
        {!role && access.actor.isAdmin && <RoleBadge role="admin" />}
      </div>
      <BasinTabs tabs={tabs.map(({ href, label }) => ({ href, label }))} />
      <div className="mt-6">
        <BasinZoneProvider zone={basin.timeZone}>{children}</BasinZoneProvider>
      </div>
    </div>
  );
}
