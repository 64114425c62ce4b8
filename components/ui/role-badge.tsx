import { ROLE_NAMES } from "@/lib/format/labels";
import type { BasinRole } from "@/lib/domain";

const STYLE: Record<BasinRole, string> = {
  lead: "bg-tarn-600 text-white",
  planner: "bg-tarn-100 text-tarn-900",
  discharger: "bg-ochre-100 text-ochre-700",
  stakeholder: "bg-paper-sunk text-ink-soft",
};

// the role's display name (lib/format/labels ROLE_NAMES), never its code
export function RoleBadge({ role }: { role: BasinRole | "admin" }) {
  const cls = role === "admin" ? "bg-ink text-paper" : STYLE[role];
  return <span className={`inline-block rounded-full px-2.5 py-0.5 text-xs font-semibold ${cls}`}>{ROLE_NAMES[role]}</span>;
}
