import type { Metadata } from "next";
import { ScenarioList } from "@/components/scenarios/scenario-list";
import { Denied } from "@/components/ui/denied";
import { basinPageAccess } from "@/lib/auth/page-access";

export const metadata: Metadata = { title: "Scenarios" };

export default async function ScenariosPage({ params }: { params: Promise<{ basinId: string }> }) {
  const { basinId } = await params;
  const access = await basinPageAccess(basinId, "scenario.read");
  if (!access.ok) return <Denied message={access.message} />;
  return <ScenarioList basinId={access.basin.id} canEdit={access.can("scenario.edit")} />;
}
