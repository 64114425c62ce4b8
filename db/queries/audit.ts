import { sql } from "kysely";
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

export interface AuditFilter {
  /** Keep events whose action starts with one of these (e.g. "plan." ), when given. */
  prefixes?: string[];
  /** Only events recorded before this one (its id; paging backwards). */
  beforeId?: string;
  limit?: number;
}

export async function listAuditEvents(db: Db, basinId: string, filter: AuditFilter = {}) {
  let q = db
    .selectFrom("audit_events as a")
    .leftJoin("users as u", "u.id", "a.actor_id")
    // a thread's plan, so the trail can link to the thread on its plan's page
    .leftJoin("threads as t", (j) => j.on("a.target_type", "=", "thread").on(sql`t.id::text`, "=", sql.ref("a.target_id")))
    .select(["a.id", "a.action", "a.target_type", "a.target_id", "a.details", "a.created_at", "u.name as actor_name", "t.plan_id as thread_plan_id"])
    .where("a.basin_id", "=", basinId);
  const { prefixes, beforeId } = filter;
  if (prefixes && prefixes.length > 0) q = q.where((eb) => eb.or(prefixes.map((p) => eb("a.action", "like", `${p.replace(/[%_\\]/g, "\\$&")}%`))));
  if (beforeId) q = q.where("a.id", "<", beforeId);
  // ids follow the order events were written; created_at is the time of their transaction
  return q
    .orderBy("a.id", "desc")
    .limit(filter.limit ?? 200)
    .execute();
}
