import type { Db } from "@/db/client";
import { insertAuditEvent } from "@/db/queries/audit";
import { findBasinBySlug, insertBasin, listBasinsForUser, updateBasin as updateBasinRow } from "@/db/queries/basins";
import { insertMembership, userLeadsAnyBasin } from "@/db/queries/memberships";
import type { BasinUpdate } from "@/db/schema";
import { requireActor, type Actor } from "@/lib/auth/guard";
import type { BasinScope } from "@/lib/auth/scope";
import { mayCreateBasin } from "@/lib/auth/permissions";
import { conflict, forbidden } from "@/lib/errors";
import type { BasinCreateInput, BasinUpdateInput } from "@/lib/validation/basin";
import { basinDto, basinListDto, type BasinDto } from "./dto";

/** Basins the actor belongs to; a site admin sees every basin. */
export async function listMyBasins(db: Db, actor: Actor | null): Promise<BasinDto[]> {
  const a = requireActor(actor);
  return (await listBasinsForUser(db, a.id, a.isAdmin)).map(basinListDto);
}

export async function canCreateBasin(db: Db, actor: Actor | null): Promise<boolean> {
  if (!actor) return false;
  return mayCreateBasin({ isAdmin: actor.isAdmin, leadsAnyBasin: await userLeadsAnyBasin(db, actor.id) });
}

const slugTaken = (slug: string) =>
  conflict(`The short name "${slug}" is already used by another basin`, [{ path: "slug", message: "Already in use" }]);

/** Create a basin; its creator becomes its lead. Admins and existing leads only. */
export async function createBasin(db: Db, actor: Actor | null, input: BasinCreateInput): Promise<BasinDto> {
  const a = requireActor(actor);
  if (!(await canCreateBasin(db, a))) throw forbidden("Only site administrators and basin leads may create basins");
  return db.transaction().execute(async (trx) => {
    if (await findBasinBySlug(trx, input.slug)) throw slugTaken(input.slug);
    const basin = await insertBasin(trx, {
      slug: input.slug,
      name: input.name,
      description: input.description,
      do_criterion_mg_l: input.doCriterionMgL,
      unit_system: input.unitSystem,
      min_review_days: input.minReviewDays,
      time_zone: input.timeZone,
      created_by: a.id,
    });
    await insertMembership(trx, basin.id, a.id, "lead");
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: a.id,
      action: "basin.created",
      targetType: "basin",
      targetId: basin.id,
      details: { name: basin.name, slug: basin.slug },
    });
    return basinDto(basin, "lead");
  });
}

export async function getBasin(scope: BasinScope): Promise<BasinDto> {
  scope.require("basin.read");
  const { basin, role } = scope;
  return basinDto(basin, role);
}

/** Change basin settings (lead or admin); records what changed. */
export async function updateBasin(scope: BasinScope,
  input: BasinUpdateInput,
): Promise<BasinDto> {
  scope.require("basin.update");
  const { db, actor, basin, role } = scope;
  const patch: BasinUpdate = {};
  if (input.name !== undefined) patch.name = input.name;
  if (input.slug !== undefined) patch.slug = input.slug;
  if (input.description !== undefined) patch.description = input.description;
  if (input.doCriterionMgL !== undefined) patch.do_criterion_mg_l = input.doCriterionMgL;
  if (input.unitSystem !== undefined) patch.unit_system = input.unitSystem;
  if (input.minReviewDays !== undefined) patch.min_review_days = input.minReviewDays;
  if (input.timeZone !== undefined) patch.time_zone = input.timeZone;
  return db.transaction().execute(async (trx) => {
    if (input.slug !== undefined && input.slug !== basin.slug) {
      const other = await findBasinBySlug(trx, input.slug);
      if (other && other.id !== basin.id) throw slugTaken(input.slug);
    }
    const updated = await updateBasinRow(trx, basin.id, patch);
    if (!updated) throw conflict("The basin was removed while you were editing it");
    const before: Record<string, unknown> = {};
    for (const key of Object.keys(patch) as (keyof typeof patch)[]) before[key] = basin[key as keyof typeof basin];
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "basin.updated",
      targetType: "basin",
      targetId: basin.id,
      details: { before, after: patch },
    });
    return basinDto(updated, role);
  });
}
