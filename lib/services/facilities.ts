import { insertAuditEvent } from "@/db/queries/audit";
import {
  facilityIdsForUser,
  findFacility,
  findFacilityByPermit,
  insertFacility,
  linkFacilityUser,
  listFacilities as listFacilityRows,
  unlinkFacilityUser,
} from "@/db/queries/facilities";
import { findMembershipRole } from "@/db/queries/memberships";
import type { BasinScope } from "@/lib/auth/scope";
import { roleAllows } from "@/lib/auth/permissions";
import { AppError, conflict, notFound } from "@/lib/errors";
import type { FacilityCreateInput, FacilityLinkInput } from "@/lib/validation/member";
import { facilityDto, type FacilityDto } from "./dto";

/**
 * Facilities of a basin. Planners, leads and admins see all of them with their
 * linked users; a discharger sees only the facilities it is linked to.
 */
export async function listFacilities(scope: BasinScope): Promise<FacilityDto[]> {
  scope.require("facilities.read");
  const { db, actor, basin, role } = scope;
  const all = (await listFacilityRows(db, basin.id)).map(facilityDto);
  if (actor.isAdmin || roleAllows(role, "facilities.manage")) return all;
  const mine = new Set(await facilityIdsForUser(db, basin.id, actor.id));
  return all.filter((f) => mine.has(f.id)).map((f) => ({ ...f, users: f.users.filter((u) => u.id === actor.id) }));
}

export async function createFacility(scope: BasinScope,
  input: FacilityCreateInput,
): Promise<FacilityDto> {
  scope.require("facilities.manage");
  const { db, actor, basin } = scope;
  return db.transaction().execute(async (trx) => {
    if (await findFacilityByPermit(trx, basin.id, input.permitId)) {
      throw conflict(`Permit id ${input.permitId} already belongs to a facility in this basin`, [
        { path: "permitId", message: "Already in use" },
      ]);
    }
    const f = await insertFacility(trx, { basin_id: basin.id, name: input.name, permit_id: input.permitId });
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "facility.created",
      targetType: "facility",
      targetId: f.id,
      details: { name: f.name, permitId: f.permit_id },
    });
    return facilityDto({ ...f, users: [] });
  });
}

/** Link a discharger member of the basin to a facility. */
export async function linkUserToFacility(scope: BasinScope,
  facilityId: string,
  input: FacilityLinkInput,
): Promise<FacilityDto> {
  scope.require("members.manage");
  const { db, actor, basin } = scope;
  return db.transaction().execute(async (trx) => {
    const facility = await findFacility(trx, basin.id, facilityId);
    if (!facility) throw notFound("Facility");
    const role = await findMembershipRole(trx, basin.id, input.userId);
    if (role !== "discharger") {
      throw new AppError("invalid", "Only members with the discharger role can be linked to a facility", [
        { path: "userId", message: role ? `Member is a ${role}` : "Not a member of this basin" },
      ]);
    }
    await linkFacilityUser(trx, facility.id, input.userId);
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "facility.user_linked",
      targetType: "facility",
      targetId: facility.id,
      details: { userId: input.userId },
    });
    const f = (await listFacilityRows(trx, basin.id)).find((x) => x.id === facility.id)!;
    return facilityDto(f);
  });
}

export async function unlinkUserFromFacility(scope: BasinScope,
  facilityId: string,
  userId: string,
): Promise<void> {
  scope.require("members.manage");
  const { db, actor, basin } = scope;
  await db.transaction().execute(async (trx) => {
    const facility = await findFacility(trx, basin.id, facilityId);
    if (!facility) throw notFound("Facility");
    if (!(await unlinkFacilityUser(trx, facility.id, userId))) throw notFound("Link between this user and facility");
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "facility.user_unlinked",
      targetType: "facility",
      targetId: facility.id,
      details: { userId },
    });
  });
}

/** The facilities of a basin that the actor represents (empty for everyone else). */
export async function myFacilityIds(scope: BasinScope): Promise<string[]> {
  return facilityIdsForUser(scope.db, scope.basin.id, scope.actor.id);
}
