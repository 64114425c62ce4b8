import { listAuditEvents } from "@/db/queries/audit";
import type { BasinScope } from "@/lib/auth/scope";
import type { AuditQuery } from "@/lib/validation/audit";

export interface AuditEventDto {
  id: string;
  action: string;
  targetType: string;
  targetId: string | null;
  details: Record<string, unknown>;
  at: string;
  actor: string | null;
  /** For a thread's events: the plan the thread belongs to (the trail links to the thread on that plan's page). */
  planId?: string | null;
}

type AuditArea = NonNullable<AuditQuery["area"]>;

/** The audit trail's areas, each a set of action prefixes. */
export const AUDIT_AREAS: Record<AuditArea, { label: string; prefixes: readonly string[] }> = {
  plans: { label: "Plans and review", prefixes: ["plan.", "review.", "comment.", "thread."] },
  members: { label: "Basin, members and facilities", prefixes: ["basin.", "member.", "facility.", "invitation.", "user."] },
  network: { label: "Imports and network", prefixes: ["import.", "network."] },
  scenarios: { label: "Scenarios and runs", prefixes: ["scenario.", "run."] },
};

/** A page of the basin's audit trail, newest first (leads and admins); `options` as auditQuerySchema checks them. */
export async function listBasinAudit(scope: BasinScope, options: AuditQuery & { limit?: number } = {}): Promise<AuditEventDto[]> {
  scope.require("audit.read");
  const { db, basin } = scope;
  const rows = await listAuditEvents(db, basin.id, {
    prefixes: options.area ? [...AUDIT_AREAS[options.area].prefixes] : undefined,
    beforeId: options.before,
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
    planId: r.thread_plan_id ?? null,
  }));
}
