import Link from "next/link";
import { redirect } from "next/navigation";
import type { ReactNode } from "react";
import { SiteHeader } from "@/components/layout/site-header";
import { RoleBadge } from "@/components/ui/role-badge";
import { currentActor } from "@/lib/auth/session";

export const dynamic = "force-dynamic";

export default async function WorkspaceLayout({ children }: { children: ReactNode }) {
  const actor = await currentActor();
  if (!actor) redirect("/signin");
  const links = [
    { href: "/basins", label: "Basins" },
    { href: "/reviews", label: "Plans under review" },
    ...(actor.isAdmin ? [{ href: "/admin/users", label: "Users" }] : []),
  ];
  return (
    <div className="min-h-screen">
      <SiteHeader
        homeHref="/basins"
        homeLabel="Your basins"
        navLabel="Workspace"
        links={links}
        account={
          <>
            <span className="min-w-0 truncate text-ink-soft" data-testid="signed-in-as">
              {actor.name}
            </span>
            {/* the badge is for the wide header; on a phone the Users link says as much */}
            {actor.isAdmin && (
              <span className="hidden shrink-0 sm:inline">
                <RoleBadge role="admin" />
              </span>
            )}
            <Link href="/signout" className="shrink-0 whitespace-nowrap">
              Sign out
            </Link>
          </>
        }
      />
      <main className="mx-auto max-w-6xl px-4 py-6 sm:px-6 sm:py-8">{children}</main>
    </div>
  );
}
