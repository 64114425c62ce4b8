import Link from "next/link";
import { redirect } from "next/navigation";
import type { ReactNode } from "react";
import { NameMark } from "@/components/brand/name-mark";
import { RoleBadge } from "@/components/ui/role-badge";
import { currentActor } from "@/lib/auth/session";

export const dynamic = "force-dynamic";

export default async function WorkspaceLayout({ children }: { children: ReactNode }) {
  const actor = await currentActor();
  if (!actor) redirect("/signin");
  return (
    <div className="min-h-screen">
      <header className="border-b border-rule bg-paper-raised">
        <div className="mx-auto flex max-w-6xl items-center gap-6 px-6 py-3">
          <Link href="/basins" className="no-underline hover:no-underline" aria-label="Your basins">
            <NameMark />
          </Link>
          <nav className="flex gap-4 text-sm">
            <Link href="/basins">Basins</Link>
            <Link href="/reviews">Plans under review</Link>
            {actor.isAdmin && <Link href="/admin/users">Users</Link>}
          </nav>
          <div className="ml-auto flex items-center gap-3 text-sm">
            <span className="text-ink-soft" data-testid="signed-in-as">
              {actor.name}
            </span>
            {actor.isAdmin && <RoleBadge role="admin" />}
            <Link href="/signout">Sign out</Link>
          </div>
        </div>
      </header>
      <main className="mx-auto max-w-6xl px-6 py-8">{children}</main>
    </div>
  );
}
