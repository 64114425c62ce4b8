import type { Db } from "@/db/client";
import { insertAuditEvent } from "@/db/queries/audit";
import { findFacility, linkFacilityUser } from "@/db/queries/facilities";
import {
  findInvitation,
  findInvitationByTokenHash,
  findLiveInvitationForEmail,
  insertInvitation,
  listOpenInvitations,
  lockInvitation,
  markInvitationAccepted,
  markInvitationRevoked,
  type InvitationRecord,
} from "@/db/queries/invitations";
import { findMembershipRole, insertMembership } from "@/db/queries/memberships";
import { findUserByEmail, insertUser } from "@/db/queries/users";
import type { BasinRole } from "@/db/schema";
import { invitationEmail } from "@/lib/email/account-templates";
import { queueEmail } from "@/lib/email/outbox";
import { requireActor, type Actor } from "@/lib/auth/guard";
import type { BasinScope } from "@/lib/auth/scope";
import { AppError, conflict, forbidden, notFound } from "@/lib/errors";
import type { InvitationCreateInput, InvitationRegisterInput } from "@/lib/validation/account";
import { appUrl } from "@/lib/email/app-url";
import { TOKEN_LIFETIME_MS, hashToken, newToken } from "./accounts";
import { hashPassword } from "./users";

export type InvitationStatus = "pending" | "expired" | "accepted" | "revoked";

export interface InvitationDto {
  id: string;
  email: string;
  role: BasinRole;
  facilityId: string | null;
  facilityName: string | null;
  invitedBy: string | null;
  createdAt: string;
  expiresAt: string;
  status: InvitationStatus;
}

function statusOf(i: InvitationRecord, now = new Date()): InvitationStatus {
  if (i.accepted_at) return "accepted";
  if (i.revoked_at) return "revoked";
  return i.expires_at.getTime() <= now.getTime() ? "expired" : "pending";
}

function invitationDto(i: InvitationRecord): InvitationDto {
  return {
    id: i.id,
    email: i.email,
    role: i.role,
    facilityId: i.facility_id,
    facilityName: i.facility_name,
    invitedBy: i.inviter_name,
    createdAt: i.created_at.toISOString(),
    expiresAt: i.expires_at.toISOString(),
    status: statusOf(i),
  };
}

/** Lead: the basin's invitations not yet accepted or revoked (expired ones say so). */
export async function listInvitations(scope: BasinScope): Promise<InvitationDto[]> {
  scope.require("members.manage");
  const { db, basin } = scope;
  return (await listOpenInvitations(db, basin.id)).map(invitationDto);
}

/**
 * Lead: invite an address into the basin with a role (a discharger names one
 * of the basin's facilities). The invitation e-mail is queued in the same
 * transaction; the link works once, for 14 days.
 */
export async function createInvitation(scope: BasinScope,
  input: InvitationCreateInput,
): Promise<InvitationDto> {
  scope.require("members.manage");
  const { db, actor, basin } = scope;
  const lead = actor!;
  return db.transaction().execute(async (trx) => {
    const now = new Date();
    const facilityId = input.role === "discharger" ? (input.facilityId ?? null) : null;
    const facility = facilityId ? await findFacility(trx, basin.id, facilityId) : undefined;
    if (facilityId && !facility) {
      throw new AppError("invalid", "That facility is not one of this basin's facilities", [
        { path: "facilityId", message: "No such facility in this basin" },
      ]);
    }
    const existing = await findUserByEmail(trx, input.email);
    if (existing && (await findMembershipRole(trx, basin.id, existing.id))) {
      throw conflict(`${input.email} is already a member of this basin`, [{ path: "email", message: "Already a member" }]);
    }
    if (await findLiveInvitationForEmail(trx, basin.id, input.email, now)) {
      throw conflict(`${input.email} already has an open invitation; revoke it to send a new one`, [
        { path: "email", message: "Already invited" },
      ]);
    }
    const { token, hash } = newToken();
    const expiresAt = new Date(now.getTime() + TOKEN_LIFETIME_MS.invite);
    const { id } = await insertInvitation(trx, {
      basin_id: basin.id,
      email: input.email,
      role: input.role,
      facility_id: facility?.id ?? null,
      invited_by: lead.id,
      token_hash: hash,
      expires_at: expiresAt,
    });
    await queueEmail(trx, {
      to: input.email,
      kind: "account",
      basinId: basin.id,
      dedupeKey: `invitation:${id}`,
      ...invitationEmail({
        inviterName: lead.name,
        basinName: basin.name,
        role: input.role,
        facilityName: facility?.name ?? null,
        url: `${appUrl()}/invite?token=${token}`,
        expiresAt,
      }),
    });
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: lead.id,
      action: "invitation.sent",
      targetType: "invitation",
      targetId: id,
      details: { email: input.email, role: input.role, facilityId: facility?.id ?? null },
    });
    return invitationDto((await findInvitation(trx, basin.id, id))!);
  });
}

/** Lead: withdraw an open invitation; its link stops working at once. */
export async function revokeInvitation(scope: BasinScope, invitationId: string): Promise<void> {
  scope.require("members.manage");
  const { db, actor, basin } = scope;
  await db.transaction().execute(async (trx) => {
    const inv = await findInvitation(trx, basin.id, invitationId);
    if (!inv) throw notFound("Invitation");
    if (!(await markInvitationRevoked(trx, inv.id, new Date()))) {
      throw conflict(`This invitation was already ${inv.accepted_at ? "accepted" : "revoked"}`);
    }
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "invitation.revoked",
      targetType: "invitation",
      targetId: inv.id,
      details: { email: inv.email, role: inv.role },
    });
  });
}

/** What the invitation page shows to whoever holds the link. */
export interface InvitationPreviewDto {
  basinId: string;
  basinName: string;
  email: string;
  role: BasinRole;
  facilityName: string | null;
  invitedBy: string | null;
  expiresAt: string;
  status: InvitationStatus;
  /** Whether the invited address already has an account (sign in to accept) or not (create it). */
  accountExists: boolean;
}

async function byToken(db: Db, token: string): Promise<InvitationRecord> {
  const inv = await findInvitationByTokenHash(db, hashToken(token));
  if (!inv) {
    throw new AppError("not_found", "This invitation link is not valid", [{ path: "token", message: "Unknown invitation" }]);
  }
  return inv;
}

export async function previewInvitation(db: Db, token: string): Promise<InvitationPreviewDto> {
  const inv = await byToken(db, token);
  return {
    basinId: inv.basin_id,
    basinName: inv.basin_name,
    email: inv.email,
    role: inv.role,
    facilityName: inv.facility_name,
    invitedBy: inv.inviter_name,
    expiresAt: inv.expires_at.toISOString(),
    status: statusOf(inv),
    accountExists: (await findUserByEmail(db, inv.email)) !== undefined,
  };
}

const UNUSABLE: Record<Exclude<InvitationStatus, "pending">, string> = {
  accepted: "This invitation has already been accepted",
  revoked: "This invitation was withdrawn by the basin's lead",
  expired: "This invitation has expired; ask the basin's lead for a new one",
};

/** Locks the invitation and checks it can still be accepted (409 naming `token` otherwise). */
async function usable(trx: Db, token: string, now: Date): Promise<InvitationRecord> {
  const first = await byToken(trx, token);
  await lockInvitation(trx, first.id);
  const inv = (await findInvitation(trx, first.basin_id, first.id))!;
  const status = statusOf(inv, now);
  if (status !== "pending") throw conflict(UNUSABLE[status], [{ path: "token", message: UNUSABLE[status] }]);
  return inv;
}

/** Membership (and the discharger's facility link) from an accepted invitation, all audited. */
async function join(trx: Db, inv: InvitationRecord, userId: string, now: Date): Promise<void> {
  if (await findMembershipRole(trx, inv.basin_id, userId)) {
    throw conflict("You are already a member of this basin; ask its lead to change your role instead");
  }
  if (!(await markInvitationAccepted(trx, inv.id, userId, now))) throw conflict(UNUSABLE.accepted);
  await insertMembership(trx, inv.basin_id, userId, inv.role);
  if (inv.role === "discharger" && inv.facility_id) await linkFacilityUser(trx, inv.facility_id, userId);
  await insertAuditEvent(trx, {
    basinId: inv.basin_id,
    actorId: userId,
    action: "invitation.accepted",
    targetType: "invitation",
    targetId: inv.id,
    details: { email: inv.email, role: inv.role },
  });
  await insertAuditEvent(trx, {
    basinId: inv.basin_id,
    actorId: userId,
    action: "member.added",
    targetType: "user",
    targetId: userId,
    details: { email: inv.email, role: inv.role, facilityId: inv.facility_id, invitationId: inv.id, invitedBy: inv.invited_by },
  });
}

export interface AcceptedDto {
  basinId: string;
  email: string;
  role: BasinRole;
}

/** Accept as the signed-in account, which must be the invited address. */
export async function acceptInvitation(db: Db, actor: Actor | null, token: string): Promise<AcceptedDto> {
  const me = requireActor(actor);
  return db.transaction().execute(async (trx) => {
    const now = new Date();
    const inv = await usable(trx, token, now);
    if (inv.email !== me.email.toLowerCase()) {
      throw forbidden(
        `This invitation was sent to ${inv.email}, but you are signed in as ${me.email}. ` +
          "Sign out and sign in with the invited address to accept it.",
      );
    }
    await join(trx, inv, me.id, now);
    return { basinId: inv.basin_id, email: inv.email, role: inv.role };
  });
}

/**
 * Accept by creating the invited account: the invitation reached the
 * address, so the account starts confirmed. 409 when the address already has
 * an account (sign in and accept instead).
 */
export async function acceptInvitationAsNewAccount(
  db: Db,
  token: string,
  input: Pick<InvitationRegisterInput, "name" | "password">,
): Promise<AcceptedDto> {
  const passwordHash = await hashPassword(input.password);
  return db.transaction().execute(async (trx) => {
    const now = new Date();
    const inv = await usable(trx, token, now);
    if (await findUserByEmail(trx, inv.email)) {
      throw conflict(`An account already uses ${inv.email}; sign in with it to accept the invitation`);
    }
    const user = await insertUser(trx, {
      email: inv.email,
      name: input.name,
      password_hash: passwordHash,
      email_verified_at: now,
    });
    await insertAuditEvent(trx, {
      basinId: null,
      actorId: user.id,
      action: "user.registered",
      targetType: "user",
      targetId: user.id,
      details: { email: user.email, invitationId: inv.id },
    });
    await join(trx, inv, user.id, now);
    return { basinId: inv.basin_id, email: inv.email, role: inv.role };
  });
}
