import type { Metadata } from "next";
import { NetworkView } from "@/components/network/network-view";
import { Denied } from "@/components/ui/denied";
import { basinPageAccess } from "@/lib/auth/page-access";

export const metadata: Metadata = { title: "Network" };

export default async function NetworkPage({ params }: { params: Promise<{ basinId: string }> }) {
  const { basinId } = await params;
  const access = await basinPageAccess(basinId, "scenario.read");
  if (!access.ok) return <Denied message={access.message} />;
  return (
    <NetworkView
      basinId={access.basin.id}
      basinSlug={access.basin.slug}
      unitSystem={access.basin.unitSystem}
      canImport={await access.can("network.import")}
    />
  );
}
