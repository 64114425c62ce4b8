import type { Db } from "@/db/client";
import { facilityIdsForUser, listFacilities as listFacilityRows } from "@/db/queries/facilities";
import { requireBasinAction, type Actor } from "@/lib/auth/guard";
import { notFound } from "@/lib/errors";
import { getPlan, listPlans } from "./plans";

/** Plan states a discharger's view offers: the ones it can read (drafts and withdrawn plans are not proposals to it). */
const OFFERED = new Set(["review", "closed", "published"]);

/**
 * A discharger's own view of a basin: the facilities it represents, the plans
 * that propose allocations to them, and one of those plans in full (the newest
 * unless `planId` names another). Anyone who may read the basin gets an answer;
 * it is empty for people who represent no facility.
 */
export async function getMyFacilities(db: Db, actor: Actor | null, basinId: string, planId?: string) {
  const { basin } = await requireBasinAction(db, actor, basinId, "basin.read");
  const mine = new Set(await facilityIdsForUser(db, basin.id, actor!.id));
  const facilities = (await listFacilityRows(db, basin.id))
    .filter((f) => mine.has(f.id))
    .map((f) => ({ id: f.id, name: f.name, permitId: f.permit_id }));
  const plans = facilities.length === 0 ? [] : (await listPlans(db, actor, basin.id)).filter((p) => OFFERED.has(p.status));
  const chosen = planId ? plans.find((p) => p.id === planId) : plans[0];
  if (planId && !chosen) throw notFound("Plan");
  const plan = chosen ? await getPlan(db, actor, basin.id, chosen.id) : null;
  return { facilities, plans, plan };
}
