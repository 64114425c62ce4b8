import type { Metadata } from "next";
import { MembersPanel } from "@/components/tables/members-panel";
import { Denied } from "@/components/ui/denied";
import { basinPageAccess } from "@/lib/auth/page-access";

export const metadata: Metadata = { title: "Members" };

export default async function MembersPage({ params }: { params: Promise<{ basinId: string }> }) {
  const { basinId } = await params;
  const access = await basinPageAccess(basinId, "members.read");
  if (!access.ok) return <Denied message={access.message} />;
  return (
    <MembersPanel
      basinId={access.basin.id}
      canManage={access.can("members.manage")}
      canManageFacilities={access.can("facilities.manage")}
      me={access.actor.id}
    />
  );
}
