import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { MyFacilities } from "@/components/plans/my-facilities";
import { Denied } from "@/components/ui/denied";
import { Notice } from "@/components/ui/notice";
import { basinPageAccess } from "@/lib/auth/page-access";
import { AppError } from "@/lib/errors";
import { getMyFacilities } from "@/lib/services/my-facilities";

export const metadata: Metadata = { title: "My facilities" };

/** A discharger's view: its facilities' proposed allocations, DO below each outfall, and each one's thread. */
export default async function MyFacilitiesPage({
  params,
  searchParams,
}: {
  params: Promise<{ basinId: string }>;
  searchParams: Promise<{ plan?: string }>;
}) {
  const { basinId } = await params;
  const { plan: planId } = await searchParams;
  const access = await basinPageAccess(basinId, "basin.read");
  if (!access.ok) return <Denied message={access.message} />;
  let view;
  try {
    view = await getMyFacilities(access.scope, planId);
  } catch (e) {
    if (e instanceof AppError && e.status === 404) notFound();
    throw e;
  }
  if (view.facilities.length === 0) {
    return <Notice tone="info">You do not represent a facility in this basin. A lead links dischargers to their facilities on the members page.</Notice>;
  }
  if (!view.plan) {
    return (
      <Notice tone="info" title="No proposed plan yet">
        Your facilities ({view.facilities.map((f) => f.name).join(", ")}) will show their proposed allocations here once a plan goes to review. See{" "}
        <Link href={`/basins/${access.basin.id}/plans`}>Plans</Link>.
      </Notice>
    );
  }
  return <MyFacilities basinId={access.basin.id} facilities={view.facilities} plans={view.plans} initial={view.plan} unitSystem={access.basin.unitSystem} />;
}
