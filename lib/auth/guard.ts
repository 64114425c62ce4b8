import type { Db } from "@/db/client";
import { findBasinWithRole, type BasinRecord } from "@/db/queries/basins";
import { findUserById } from "@/db/queries/users";
import type { BasinRole } from "@/db/schema";
import { AppError, forbidden, notFound, unauthenticated } from "@/lib/errors";
import { refusal, SITE_ACTION_PHRASES } from "@/lib/format/labels";
import { ADMIN_BASIN_ACTIONS, roleAllows, rolesAllowing, type BasinAction, type SiteAction } from "./permissions";

/** The signed-in person, as re-read from the database for every check. */
export interface Actor {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
}

/**
 * Resolve a session's user id to a live account, or null when it no longer
 * exists or the session is stale: its session version is not the account's
 * current one (the password was reset or a basin role taken away since it
 * signed in). Session readers always pass a version (0 for a token carrying
 * none); only trusted server code (scripts, the demo) leaves it out.
 */
export async function loadActor(db: Db, userId: string | null | undefined, sessionVersion?: number): Promise<Actor | null> {
  if (!userId) return null;
  const user = await findUserById(db, userId);
  if (!user || (sessionVersion !== undefined && user.session_version !== sessionVersion)) return null;
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.is_admin };
}

export function requireActor(actor: Actor | null): Actor {
  if (!actor) throw unauthenticated();
  return actor;
}

export function requireSiteAction(actor: Actor | null, action: SiteAction): Actor {
  const a = requireActor(actor);
  if (!a.isAdmin) throw forbidden(`Only site administrators can ${SITE_ACTION_PHRASES[action] ?? "do this"}.`);
  return a;
}

export interface BasinAccess {
  basin: BasinRecord;
  role: BasinRole | null;
}

/**
 * The one guard for basin-scoped work: the basin must exist and the actor's
 * current role in it (read now, not from the session) must allow `action`.
 * Throws 401 when signed out, 404 for an unknown basin, 403 otherwise.
 */
export async function requireBasinAction(
  db: Db,
  actor: Actor | null,
  basinId: string,
  action: BasinAction,
): Promise<BasinAccess> {
  const a = requireActor(actor);
  const found = await findBasinWithRole(db, basinId, a.id);
  if (!found) throw notFound("Basin");
  const { basin, role } = found;
  if (roleAllows(role, action) || (a.isAdmin && ADMIN_BASIN_ACTIONS.includes(action))) {
    return { basin, role };
  }
  if (!role && !a.isAdmin) throw new AppError("forbidden", "You are not a member of this basin; its lead can invite you.");
  throw forbidden(refusal(action, rolesAllowing(action), role));
}

/** The same check as a boolean, for deciding what a page shows. */
export async function canInBasin(db: Db, actor: Actor | null, basinId: string, action: BasinAction): Promise<boolean> {
  try {
    await requireBasinAction(db, actor, basinId, action);
    return true;
  } catch (error) {
    if (error instanceof AppError) return false;
    throw error;
  }
}
