import type { Db } from "@/db/client";
import { findBasinWithRole, findUserInBasin, type BasinRecord } from "@/db/queries/basins";
import type { BasinRole } from "@/db/schema";
import { AppError, forbidden, notFound } from "@/lib/errors";
import { refusal } from "@/lib/format/labels";
import { actorOf, requireActor, type Actor } from "./guard";
import { ADMIN_BASIN_ACTIONS, roleAllows, rolesAllowing, type BasinAction } from "./permissions";

/**
 * One request's view of one basin: who is asking, the basin, and their role in
 * it, read once (one basin+role query). Services take a scope instead of
 * (db, actor, basinId) and call `scope.require(action)` next to the data;
 * `can` answers from the role already read, so a page may ask as often as it
 * likes without another query.
 */
export interface BasinScope {
  readonly db: Db;
  readonly actor: Actor;
  readonly basin: BasinRecord;
  readonly role: BasinRole | null;
  /** Whether the role (or site administration) allows `action`; no query. */
  can(action: BasinAction): boolean;
  /** Throws the 403 a refused action gets (the not-a-member sentence for outsiders). */
  require(action: BasinAction): void;
  /** The same scope on another handle (a transaction), for multi-row writes. */
  in(db: Db): BasinScope;
}

function allows(actor: Actor, role: BasinRole | null, action: BasinAction): boolean {
  return roleAllows(role, action) || (actor.isAdmin && ADMIN_BASIN_ACTIONS.includes(action));
}

/** The refusal for `action`: the same sentences the guard has always given. */
export function refuse(actor: Actor, role: BasinRole | null, action: BasinAction): AppError {
  if (!role && !actor.isAdmin) return new AppError("forbidden", "You are not a member of this basin; its lead can invite you.");
  return forbidden(refusal(action, rolesAllowing(action), role));
}

/** A scope from what was already read (no query). */
export function scopeOf(db: Db, actor: Actor, basin: BasinRecord, role: BasinRole | null): BasinScope {
  return {
    db,
    actor,
    basin,
    role,
    can: (action) => allows(actor, role, action),
    require: (action) => {
      if (!allows(actor, role, action)) throw refuse(actor, role, action);
    },
    in: (other) => scopeOf(other, actor, basin, role),
  };
}

/**
 * The one builder: 401 when signed out, 404 for an unknown basin, else the
 * scope (one basin+role read). route(), the page helper and trusted scripts
 * and tests all build scopes here.
 */
export async function basinScope(db: Db, actor: Actor | null, basinId: string): Promise<BasinScope> {
  const a = requireActor(actor);
  const found = await findBasinWithRole(db, basinId, a.id);
  if (!found) throw notFound("Basin");
  return scopeOf(db, a, found.basin, found.role);
}

/**
 * route()'s builder for basin routes: the session's account (null when gone or
 * stale, as loadActor) and, for that account, the basin's scope (null when the
 * basin does not exist), from one query instead of a user read and a basin+role read.
 */
export async function sessionBasinScope(
  db: Db,
  session: { userId: string; sessionVersion: number },
  basinId: string,
): Promise<{ actor: Actor | null; scope: BasinScope | null }> {
  const found = await findUserInBasin(db, session.userId, basinId);
  const actor = actorOf(found.user, session.sessionVersion);
  if (!actor || !found.basin) return { actor, scope: null };
  return { actor, scope: scopeOf(db, actor, found.basin, found.role) };
}
