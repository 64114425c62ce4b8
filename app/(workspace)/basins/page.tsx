import type { Metadata } from "next";
import Link from "next/link";
import { BasinList, ReaderLanding } from "@/components/tables/basin-list";
import { Notice } from "@/components/ui/notice";
import { getDb } from "@/db/client";
import { currentActor } from "@/lib/auth/session";
import { canCreateBasin } from "@/lib/services/basins";
import { readerHome } from "@/lib/services/plan-readers";

export const metadata: Metadata = { title: "Basins" };

/**
 * Where a signed-in person lands: their basins; or, outside every basin, the plans they can
 * read and the basins they can follow — for staff an administrator made an account for,
 * with a word on being added to a basin.
 */
export default async function BasinsPage() {
  const db = getDb();
  const actor = await currentActor();
  const [mayCreate, home] = await Promise.all([canCreateBasin(db, actor), readerHome(db, actor)]);
  if (home.kind !== "member") {
    return (
      <div className="space-y-6">
        <div>
          <h1>{home.kind === "public" ? "Plans you can read and comment on" : "Your basins"}</h1>
          <p className="max-w-2xl text-sm text-ink-soft" data-testid="account-kind">
            {home.kind === "public"
              ? "Your account is for reading plans and taking part in their public review: read the plans under review and comment while a review is open, read published plans, and follow a basin to be told when something happens. To work on a basin's plans, ask its lead to invite you."
              : "Each basin has its own members, network, scenarios and plans."}
          </p>
        </div>
        {home.kind === "staff" && (
          <Notice tone="info" title="Not a member of a basin yet">
            You are not a member of any basin yet. A basin lead can add you on the basin&apos;s members page; you will see the basin here then. Meanwhile you can
            read the plans below, as anyone signed in can.
          </Notice>
        )}
        <ReaderLanding home={home} />
      </div>
    );
  }
  return (
    <div>
      <div className="mb-6 flex items-end justify-between gap-4">
        <div>
          <h1>Your basins</h1>
          <p className="text-sm text-ink-soft">Each basin has its own members, network, scenarios and plans.</p>
        </div>
        {mayCreate && (
          <Link href="/basins/new" className="shrink-0 whitespace-nowrap rounded-md bg-tarn-600 px-4 py-2 text-sm font-medium text-white no-underline hover:bg-tarn-700 hover:no-underline">
            New basin
          </Link>
        )}
      </div>
      <BasinList />
    </div>
  );
}
