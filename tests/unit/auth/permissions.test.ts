import { describe, expect, it } from "vitest";
import { BASIN_ACTIONS, BASIN_ROLES, mayCreateBasin, ROLE_PERMISSIONS, roleAllows } from "@/lib/auth/permissions";

describe("role → permission table", () => {
  it("names only known actions, without repeats", () => {
    for (const role of BASIN_ROLES) {
      const actions = ROLE_PERMISSIONS[role];
      for (const a of actions) expect(BASIN_ACTIONS).toContain(a);
      expect(new Set(actions).size).toBe(actions.length);
    }
  });

  it("a lead can do everything a planner can, and more", () => {
    for (const a of ROLE_PERMISSIONS.planner) expect(roleAllows("lead", a)).toBe(true);
    for (const a of ["basin.update", "members.manage", "review.manage", "plan.publish"] as const) {
      expect(roleAllows("lead", a)).toBe(true);
      expect(roleAllows("planner", a)).toBe(false);
    }
  });

  it("dischargers and stakeholders read and comment but never edit, run or publish", () => {
    for (const role of ["discharger", "stakeholder"] as const) {
      expect(roleAllows(role, "basin.read")).toBe(true);
      expect(roleAllows(role, "comment.create")).toBe(true);
      for (const a of ["basin.update", "members.read", "scenario.read", "scenario.edit", "scenario.run", "network.import", "plan.publish"] as const) {
        expect(roleAllows(role, a), `${role} ${a}`).toBe(false);
      }
    }
    expect(roleAllows("discharger", "facilities.read")).toBe(true);
    expect(roleAllows("stakeholder", "facilities.read")).toBe(false);
  });

  it("draft scenarios are visible to planners and leads only", () => {
    const readers = BASIN_ROLES.filter((r) => roleAllows(r, "scenario.read"));
    expect(readers.sort()).toEqual(["lead", "planner"]);
  });

  it("no role means no permission", () => {
    for (const a of BASIN_ACTIONS) expect(roleAllows(null, a)).toBe(false);
  });

  it("basins are created by admins and existing leads", () => {
    expect(mayCreateBasin({ isAdmin: true, leadsAnyBasin: false })).toBe(true);
    expect(mayCreateBasin({ isAdmin: false, leadsAnyBasin: true })).toBe(true);
    expect(mayCreateBasin({ isAdmin: false, leadsAnyBasin: false })).toBe(false);
  });
});
