import type { Db } from "@/db/client";
import { listAuditEvents } from "@/db/queries/audit";
import { requireBasinAction, type Actor } from "@/lib/auth/guard";

export interface AuditEventDto {
  id: string;
  action: string;
  targetType: string;
  targetId: string | null;
  details: Record<string, unknown>;
  at: string;
  actor: string | null;
}

export async function listBasinAudit(db: Db, actor: Actor | null, basinId: string): Promise<AuditEventDto[]> {
  const { basin } = await requireBasinAction(db, actor, basinId, "audit.read");
  const rows = await listAuditEvents(db, basin.id);
  return rows.map((r) => ({
    id: String(r.id),
    action: r.action,
    targetType: r.target_type,
    targetId: r.target_id,
    details: r.details,
    at: r.created_at.toISOString(),
    actor: r.actor_name,
  }));
}
