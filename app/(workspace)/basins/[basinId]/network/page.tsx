import type { Metadata } from "next";
import { NetworkView } from "@/components/network/network-view";
import { Denied } from "@/components/ui/denied";
import { basinPageAccess } from "@/lib/auth/page-access";

export const metadata: Metadata = { title: "Network" };

export default async function NetworkPage({
  params,
  searchParams,
}: {
  params: Promise<{ basinId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { basinId } = await params;
  // ?saved=<version>: the import wizard has just saved that version
  const saved = Number((await searchParams).saved);
  const access = await basinPageAccess(basinId, "scenario.read");
  if (!access.ok) return <Denied message={access.message} />;
  return (
    <NetworkView
      basinId={access.basin.id}
      basinSlug={access.basin.slug}
      unitSystem={access.basin.unitSystem}
      canImport={access.can("network.import")}
      savedVersion={Number.isInteger(saved) && saved > 0 ? saved : undefined}
    />
  );
}
