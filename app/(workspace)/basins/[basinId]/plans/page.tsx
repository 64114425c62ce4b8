import type { Metadata } from "next";
import { PlanList } from "@/components/plans/plan-list";
import { Denied } from "@/components/ui/denied";
import { basinPageAccess } from "@/lib/auth/page-access";

export const metadata: Metadata = { title: "Plans" };

export default async function PlansPage({ params }: { params: Promise<{ basinId: string }> }) {
  const { basinId } = await params;
  const access = await basinPageAccess(basinId, "basin.read");
  if (!access.ok) return <Denied message={access.message} />;
  return <PlanList basinId={access.basin.id} />;
}
