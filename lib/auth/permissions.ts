import { BASIN_ROLES, type BasinRole } from "@/lib/domain";

// The roles are domain vocabulary (lib/domain/roles.ts); re-exported for the callers that read them here.
export { BASIN_ROLES, type BasinRole };

/**
 * Everything a member can do inside one basin. Later features add actions
 * here and grant them below; a handler names the action it needs and the
 * guard (lib/auth/guard.ts) is the only place that reads this table.
 */
export const BASIN_ACTIONS = [
  "basin.read",
  "basin.update",
  "members.read",
  "members.manage",
  "facilities.read",
  "facilities.manage",
  "audit.read",
  "network.import",
  "scenario.read",
  "scenario.edit",
  "scenario.run",
  "plan.propose",
  "review.manage",
  "plan.publish",
  "comment.create",
  "comment.answer",
] as const;
export type BasinAction = (typeof BASIN_ACTIONS)[number];

/**
 * Site administrators look after every basin's settings, members, facilities
 * and audit trail (not its scenarios, plans or reviews): every action of
 * those areas, derived from BASIN_ACTIONS so a new action there is covered.
 */
const ADMIN_AREAS = ["basin", "members", "facilities", "audit"] as const;
export const ADMIN_BASIN_ACTIONS: readonly BasinAction[] = BASIN_ACTIONS.filter((a) =>
  (ADMIN_AREAS as readonly string[]).includes(a.split(".")[0]),
);

/** Site-wide actions, held by site admins only. */
export const SITE_ACTIONS = ["users.manage", "basins.manage"] as const;
export type SiteAction = (typeof SITE_ACTIONS)[number];

const PLANNER: readonly BasinAction[] = [
  "basin.read",
  "members.read",
  "facilities.read",
  "facilities.manage",
  "network.import",
  "scenario.read",
  "scenario.edit",
  "scenario.run",
  "plan.propose",
  "comment.create",
  "comment.answer",
];

/** The one role → permission table. */
export const ROLE_PERMISSIONS: Record<BasinRole, readonly BasinAction[]> = {
  lead: [...PLANNER, "basin.update", "members.manage", "audit.read", "review.manage", "plan.publish"],
  planner: PLANNER,
  discharger: ["basin.read", "facilities.read", "comment.create"],
  stakeholder: ["basin.read", "comment.create"],
};

export function roleAllows(role: BasinRole | null | undefined, action: BasinAction): boolean {
  return role != null && ROLE_PERMISSIONS[role].includes(action);
}

/** The roles that hold `action`, for the sentence a refusal reads ("Only the basin's planners and lead can …"). */
export function rolesAllowing(action: BasinAction): BasinRole[] {
  return BASIN_ROLES.filter((r) => ROLE_PERMISSIONS[r].includes(action));
}

/** Who may create a basin: site admins, and anyone who already leads a basin. */
export function mayCreateBasin(user: { isAdmin: boolean; leadsAnyBasin: boolean }): boolean {
  return user.isAdmin || user.leadsAnyBasin;
}
