import type { Db } from "@/db/client";
import { insertAuditEvent } from "@/db/queries/audit";
import {
  countLeads,
  deleteMembership,
  findMembershipRole,
  insertMembership,
  listMembers as listMemberRows,
  updateMembershipRole,
} from "@/db/queries/memberships";
import { unlinkUserFromBasinFacilities } from "@/db/queries/facilities";
import { lockBasin } from "@/db/queries/basins";
import { findUserByEmail } from "@/db/queries/users";
import type { Actor } from "@/lib/auth/guard";
import { basinScope, type BasinScope } from "@/lib/auth/scope";
import { AppError, conflict, notFound } from "@/lib/errors";
import type { MemberAddInput, MemberUpdateInput } from "@/lib/validation/member";
import { memberDto, type MemberDto } from "./dto";
import { endSessions } from "./users";

export async function listMembers(scope: BasinScope): Promise<MemberDto[]> {
  scope.require("members.read");
  const { db, basin } = scope;
  return (await listMemberRows(db, basin.id)).map(memberDto);
}

/** Add an existing account to the basin with a role. */
export async function addMember(scope: BasinScope, input: MemberAddInput): Promise<MemberDto> {
  scope.require("members.manage");
  const { db, actor, basin } = scope;
  return db.transaction().execute(async (trx) => {
    const user = await findUserByEmail(trx, input.email);
    if (!user) {
      throw new AppError("invalid", `No account uses ${input.email}; an administrator must create it first`, [
        { path: "email", message: "No such account" },
      ]);
    }
    if (await findMembershipRole(trx, basin.id, user.id)) {
      throw conflict(`${user.name} is already a member of this basin`, [{ path: "email", message: "Already a member" }]);
    }
    await insertMembership(trx, basin.id, user.id, input.role);
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "member.added",
      targetType: "user",
      targetId: user.id,
      // a site admin giving themselves a basin role is allowed, and said so plainly in the basin's audit trail
      details: { email: user.email, role: input.role, ...(selfGranted(actor, user.id) ? { selfGrantedBySiteAdmin: true } : {}) },
    });
    const rows = await listMemberRows(trx, basin.id);
    return memberDto(rows.find((r) => r.user_id === user.id)!);
  });
}

/** A site admin changing their own basin role (the only way anyone can). */
const selfGranted = (actor: Actor | null, userId: string) => actor?.isAdmin === true && actor.id === userId;

/**
 * Membership changes in one basin happen one at a time (the basin's row is
 * locked), and the actor's own right is checked again under the lock: two
 * leads demoting each other at once leave one lead, not none.
 */
async function serialiseMembership(trx: Db, scope: BasinScope): Promise<void> {
  await lockBasin(trx, scope.basin.id);
  (await basinScope(trx, scope.actor, scope.basin.id)).require("members.manage");
}

async function refuseLastLead(trx: Db, basinId: string, userId: string, verb: string): Promise<void> {
  const role = await findMembershipRole(trx, basinId, userId);
  if (!role) throw notFound("Member");
  if (role === "lead" && (await countLeads(trx, basinId)) <= 1) {
    throw conflict(`Cannot ${verb} the basin's only lead; make someone else lead first`);
  }
}

export async function changeMemberRole(scope: BasinScope,
  userId: string,
  input: MemberUpdateInput,
): Promise<MemberDto> {
  scope.require("members.manage");
  const { db, actor, basin } = scope;
  return db.transaction().execute(async (trx) => {
    await serialiseMembership(trx, scope);
    const before = await findMembershipRole(trx, basin.id, userId);
    if (!before) throw notFound("Member");
    if (before !== input.role) await refuseLastLead(trx, basin.id, userId, "change the role of");
    await updateMembershipRole(trx, basin.id, userId, input.role);
    // a role taken away ends the person's sessions (they sign in again under the new role)
    if (before !== input.role) await endSessions(trx, userId);
    if (before === "discharger" && input.role !== "discharger") {
      await unlinkUserFromBasinFacilities(trx, basin.id, userId);
    }
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "member.role_changed",
      targetType: "user",
      targetId: userId,
      details: { from: before, to: input.role, ...(selfGranted(actor, userId) ? { selfGrantedBySiteAdmin: true } : {}) },
    });
    const rows = await listMemberRows(trx, basin.id);
    return memberDto(rows.find((r) => r.user_id === userId)!);
  });
}

/** Remove a member; takes effect on their next request (roles are read per check). */
export async function removeMember(scope: BasinScope, userId: string): Promise<void> {
  scope.require("members.manage");
  const { db, actor, basin } = scope;
  await db.transaction().execute(async (trx) => {
    await serialiseMembership(trx, scope);
    await refuseLastLead(trx, basin.id, userId, "remove");
    await unlinkUserFromBasinFacilities(trx, basin.id, userId);
    await deleteMembership(trx, basin.id, userId);
    await endSessions(trx, userId);
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "member.removed",
      targetType: "user",
      targetId: userId,
    });
  });
}
