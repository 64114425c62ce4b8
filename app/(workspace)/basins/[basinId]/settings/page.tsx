import type { Metadata } from "next";
import { BasinSettings } from "@/components/forms/basin-settings";
import { Denied } from "@/components/ui/denied";
import { basinPageAccess } from "@/lib/auth/page-access";

export const metadata: Metadata = { title: "Basin settings" };

export default async function BasinSettingsPage({ params }: { params: Promise<{ basinId: string }> }) {
  const { basinId } = await params;
  const access = await basinPageAccess(basinId, "basin.update");
  if (!access.ok) return <Denied message={access.message} />;
  return (
    <section>
      <h2 className="mb-4">Settings</h2>
      <BasinSettings basin={access.basin} />
    </section>
  );
}
