import type { Db } from "../client";

export interface AuditInput {
  basinId: string | null;
  actorId: string | null;
  action: string;
  targetType: string;
  targetId?: string | null;
  details?: Record<string, unknown>;
}

export async function insertAuditEvent(db: Db, e: AuditInput): Promise<void> {
  await db
    .insertInto("audit_events")
    .values({
      basin_id: e.basinId,
      actor_id: e.actorId,
      action: e.action,
      target_type: e.targetType,
      target_id: e.targetId ?? null,
      details: JSON.stringify(e.details ?? {}),
    })
    .execute();
}

export async function listAuditEvents(db: Db, basinId: string, limit = 200) {
  return db
    .selectFrom("audit_events as a")
    .leftJoin("users as u", "u.id", "a.actor_id")
    .select(["a.id", "a.action", "a.target_type", "a.target_id", "a.details", "a.created_at", "u.name as actor_name"])
    .where("a.basin_id", "=", basinId)
    .orderBy("a.created_at", "desc")
    .orderBy("a.id", "desc")
    .limit(limit)
    .execute();
}
