import type { Metadata } from "next";
import { ImportWizard } from "@/components/network/import-wizard";
import { Denied } from "@/components/ui/denied";
import { basinPageAccess } from "@/lib/auth/page-access";

export const metadata: Metadata = { title: "Import a network" };

export default async function ImportPage({ params }: { params: Promise<{ basinId: string }> }) {
  const { basinId } = await params;
  const access = await basinPageAccess(basinId, "network.import");
  if (!access.ok) return <Denied message={access.message} />;
  return (
    <div>
      <h2 className="mb-4">Import a network</h2>
      <ImportWizard basinId={access.basin.id} />
    </div>
  );
}
