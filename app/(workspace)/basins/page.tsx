import type { Metadata } from "next";
import Link from "next/link";
import { BasinList } from "@/components/tables/basin-list";
import { getDb } from "@/db/client";
import { currentActor } from "@/lib/auth/session";
import { canCreateBasin } from "@/lib/services/basins";

export const metadata: Metadata = { title: "Basins" };

export default async function BasinsPage() {
  const actor = await currentActor();
  const mayCreate = await canCreateBasin(getDb(), actor);
  return (
    <div>
      <div className="mb-6 flex items-end justify-between gap-4">
        <div>
          <h1>Your basins</h1>
          <p className="text-sm text-ink-soft">Each basin has its own members, network, scenarios and plans.</p>
        </div>
        {mayCreate && (
          <Link href="/basins/new" className="rounded-md bg-tarn-600 px-4 py-2 text-sm font-medium text-white no-underline hover:bg-tarn-700 hover:no-underline">
            New basin
          </Link>
        )}
      </div>
      <BasinList />
    </div>
  );
}
