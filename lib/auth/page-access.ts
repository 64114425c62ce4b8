import "server-only";
import { cache } from "react";
import { getDb } from "@/db/client";
import type { BasinRole } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { basinDto, type BasinDto } from "@/lib/services/dto";
import type { Actor } from "./guard";
import type { BasinAction } from "./permissions";
import { basinScope, type BasinScope } from "./scope";
import { currentActor } from "./session";

type Refused = { ok: false; status: 401 | 403 | 404; message: string };

export type BasinPageAccess =
  | { ok: true; scope: BasinScope; actor: Actor; basin: BasinDto; role: BasinRole | null; can: (a: BasinAction) => boolean }
  | Refused;

function refused(error: unknown): Refused {
  if (error instanceof AppError && (error.status === 401 || error.status === 403 || error.status === 404)) {
    return { ok: false, status: error.status, message: error.message };
  }
  throw error;
}

/**
 * The basin scope of this request (React cache, keyed by basin id): a page and
 * its layout share one session read, one user row and one basin+role read.
 */
export const basinPageScope = cache(async (basinId: string): Promise<{ ok: true; scope: BasinScope } | Refused> => {
  try {
    return { ok: true, scope: await basinScope(getDb(), await currentActor(), basinId) };
  } catch (error) {
    return refused(error);
  }
});

/** The guard, for server-rendered pages: the scope of this request, refused unless it allows `action`. */
export async function basinPageAccess(basinId: string, action: BasinAction): Promise<BasinPageAccess> {
  const found = await basinPageScope(basinId);
  if (!found.ok) return found;
  const { scope } = found;
  try {
    scope.require(action);
  } catch (error) {
    return refused(error);
  }
  return { ok: true, scope, actor: scope.actor, basin: basinDto(scope.basin, scope.role), role: scope.role, can: scope.can };
}
