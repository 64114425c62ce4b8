import type { Metadata } from "next";
import { UsersAdmin } from "@/components/tables/users-admin";
import { Denied } from "@/components/ui/denied";
import { currentActor } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Users" };

export default async function UsersAdminPage() {
  const actor = await currentActor();
  if (!actor?.isAdmin) return <Denied message="Only site administrators manage user accounts." />;
  return (
    <div>
      <h1 className="mb-1">Users</h1>
      <p className="mb-6 text-sm text-ink-soft">
        Accounts for planners, leads, dischargers and stakeholders. Basin leads then add accounts to their basins.
      </p>
      <UsersAdmin />
    </div>
  );
}
