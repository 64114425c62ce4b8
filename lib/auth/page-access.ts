import "server-only";
import { getDb } from "@/db/client";
import type { BasinRole } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { basinDto, type BasinDto } from "@/lib/services/dto";
import { canInBasin, requireBasinAction, type Actor } from "./guard";
import type { BasinAction } from "./permissions";
import { currentActor } from "./session";

export type BasinPageAccess =
  | { ok: true; actor: Actor; basin: BasinDto; role: BasinRole | null; can: (a: BasinAction) => Promise<boolean> }
  | { ok: false; status: 401 | 403 | 404; message: string };

/** The guard, for server-rendered pages: the same check the API routes use. */
export async function basinPageAccess(basinId: string, action: BasinAction): Promise<BasinPageAccess> {
  const db = getDb();
  const actor = await currentActor();
  try {
    const { basin, role } = await requireBasinAction(db, actor, basinId, action);
    return {
      ok: true,
      actor: actor!,
      basin: basinDto(basin, role),
      role,
      can: (a) => canInBasin(db, actor, basin.id, a),
    };
  } catch (error) {
    if (error instanceof AppError && (error.status === 401 || error.status === 403 || error.status === 404)) {
      return { ok: false, status: error.status, message: error.message };
    }
    throw error;
  }
}
