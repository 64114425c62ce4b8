import { z } from "zod";

export const AUDIT_AREA_KEYS = ["plans", "members", "network", "scenarios"] as const;

/** A page of the audit trail: one area, events recorded before a given event (by id). */
export const auditQuerySchema = z.object({
  area: z.enum(AUDIT_AREA_KEYS, `Unknown area; use one of ${AUDIT_AREA_KEYS.join(", ")}`).optional(),
  before: z.string().regex(/^[1-9]\d{0,17}$/, "Give the id of an audit event").optional(),
});
export type AuditQuery = z.infer<typeof auditQuerySchema>;
