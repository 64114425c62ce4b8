import type { Db } from "@/db/client";
import { listAuditEvents } from "@/db/queries/audit";
import { requireBasinAction, type Actor } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";

export interface AuditEventDto {
  id: string;
  action: string;
  targetType: string;
  targetId: string | null;
  details: Record<string, unknown>;
  at: string;
  actor: string | null;
}

/** The audit trail's areas, each a set of action prefixes. */
export const AUDIT_AREAS = {
  plans: { label: "Plans and review", prefixes: ["plan.", "review.", "comment.", "thread."] },
  members: { label: "Basin, members and facilities", prefixes: ["basin.", "member.", "facility.", "invitation.", "user."] },
  network: { label: "Imports and network", prefixes: ["import.", "network."] },
  scenarios: { label: "Scenarios and runs", prefixes: ["scenario.", "run."] },
} as const;
export type AuditArea = keyof typeof AUDIT_AREAS;

export const isAuditArea = (value: unknown): value is AuditArea => typeof value === "string" && value in AUDIT_AREAS;

/** A page of the basin's audit trail, newest first (leads and admins). */
export async function listBasinAudit(
  db: Db,
  actor: Actor | null,
  basinId: string,
  options: { area?: AuditArea; beforeId?: string; limit?: number } = {},
): Promise<AuditEventDto[]> {
  const { basin } = await requireBasinAction(db, actor, basinId, "audit.read");
  if (options.beforeId !== undefined && !/^[1-9]\d{0,17}$/.test(options.beforeId)) {
    throw new AppError("invalid", "Not an audit event id", [{ path: "before", message: "Give the id of an audit event" }]);
  }
  const rows = await listAuditEvents(db, basin.id, {
    prefixes: options.area ? [...AUDIT_AREAS[options.area].prefixes] : undefined,
    beforeId: options.beforeId,
    limit: options.limit,
  });
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
