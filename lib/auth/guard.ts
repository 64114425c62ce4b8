import type { Db } from "@/db/client";
import { findUserById } from "@/db/queries/users";
import { forbidden, unauthenticated } from "@/lib/errors";
import { SITE_ACTION_PHRASES } from "@/lib/format/labels";
import type { SiteAction } from "./permissions";

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
  return actorOf(await findUserById(db, userId), sessionVersion);
}

/** loadActor's rule on an account already read: gone or stale is null. */
export function actorOf(
  user: { id: string; email: string; name: string; is_admin: boolean; session_version: number } | undefined,
  sessionVersion?: number,
): Actor | null {
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
