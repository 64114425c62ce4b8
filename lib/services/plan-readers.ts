import type { Feature, FeatureCollection } from "geojson";
import type { Db } from "@/db/client";
import { createdByAdministrator } from "@/db/queries/account-origin";
import { listBasinsForUser } from "@/db/queries/basins";
import { isFollowing } from "@/db/queries/follows";
import { networkOutfalls } from "@/db/queries/networks";
import { planReachLines } from "@/db/queries/plan-reports";
import { requireActor, type Actor } from "@/lib/auth/guard";
import { outfallFeature, reachFeature } from "./networks";
import { getPlanForReader, listPublishedPlans, listReviews } from "./plans";

/**
 * Who a signed-in person is to Sagline, for the page they land on: a member of some basin
 * (or a site admin, who sees every basin); staff an administrator has made an account for,
 * not yet added to a basin; or a member of the public who registered themselves.
 */
export type AccountKind = "member" | "staff" | "public";

/**
 * What a signed-in reader outside every basin is offered: plans under review (they may read
 * and comment while a review is open), published plans, and the basins those plans belong
 * to with whether the reader follows each. `kind` says which of the two landing texts fits;
 * for a member the lists are left empty (they land on their basins).
 */
export async function readerHome(db: Db, actor: Actor | null) {
  const me = requireActor(actor);
  const basins = await listBasinsForUser(db, me.id, me.isAdmin);
  const kind: AccountKind = me.isAdmin || basins.length > 0 ? "member" : (await createdByAdministrator(db, me.id)) ? "staff" : "public";
  // a member lands on their basins; the lists are for readers outside every basin
  if (kind === "member") return { kind, reviews: [], published: [], follows: [] };
  const [reviews, published] = await Promise.all([listReviews(db, me), listPublishedPlans(db)]);
  const named = new Map<string, string>();
  for (const p of [...reviews, ...published]) named.set(p.basinId, p.basinName);
  const follows = await Promise.all(
    [...named].map(async ([basinId, basinName]) => ({ basinId, basinName, followed: await isFollowing(db, basinId, me.id) })),
  );
  return { kind, reviews, published, follows: follows.sort((a, b) => a.basinName.localeCompare(b.basinName)) };
}

export type ReaderHome = Awaited<ReturnType<typeof readerHome>>;

/**
 * A plan for a reader outside its basin (getPlanForReader decides who may read it) with a map
 * of its facilities: the reach lines kept with the plan (the network version its run was
 * computed on) and the outfalls of that version's facilities that the plan allocates to,
 * snapped to their reaches, named as the plan names them. A plan whose snapshot does not
 * name its network version gets the reach lines only.
 */
export async function getPlanForReaderWithMap(db: Db, actor: Actor | null, basinId: string, planId: string) {
  const found = await getPlanForReader(db, actor, basinId, planId);
  const networkId = (found.plan.snapshot as { scenario?: { networkId?: string } }).scenario?.networkId;
  const names = new Map(found.plan.allocations.map((a) => [a.permitId, a.facilityName]));
  const [reaches, outfalls] = await Promise.all([planReachLines(db, found.plan.id), networkId ? networkOutfalls(db, networkId) : Promise.resolve([])]);
  const features: Feature[] = [
    ...reaches.map(reachFeature),
    ...outfalls.filter((o) => names.has(o.permit_id)).map((o) => outfallFeature(o, names.get(o.permit_id))),
  ];
  const network: FeatureCollection = { type: "FeatureCollection", features };
  return { ...found, network };
}
