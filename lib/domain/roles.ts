/** A member's role in a basin (memberships.role, invitations.role). The order is the table's: most rights first. */
export const BASIN_ROLES = ["lead", "planner", "discharger", "stakeholder"] as const;
export type BasinRole = (typeof BASIN_ROLES)[number];

/** A member's role as a reader sees it; "admin" is the site administrator, who holds no basin role. */
export const ROLE_NAMES: Readonly<Record<BasinRole | "admin", string>> = {
  lead: "Agency lead",
  planner: "Planner",
  discharger: "Discharger",
  stakeholder: "Stakeholder",
  admin: "Site administrator",
};

/** The role as a group, for "the basin's planners and lead". */
export const ROLE_GROUP_NAMES: Readonly<Record<BasinRole, string>> = {
  lead: "lead",
  planner: "planners",
  discharger: "dischargers",
  stakeholder: "stakeholders",
};
