import { describe, expect, it } from "vitest";
import { BASIN_ACTIONS, BASIN_ROLES, mayCreateBasin, ROLE_PERMISSIONS, roleAllows, rolesAllowing, SITE_ACTIONS } from "@/lib/auth/permissions";
import { ACTION_PHRASES, refusal, SITE_ACTION_PHRASES } from "@/lib/format/labels";

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

describe("refusals in a sentence", () => {
  it("every action has a phrase, so no refusal names an action code", () => {
    for (const a of BASIN_ACTIONS) expect(ACTION_PHRASES[a], a).toBeTruthy();
    for (const a of SITE_ACTIONS) expect(SITE_ACTION_PHRASES[a], a).toBeTruthy();
  });

  it("says who may do it and what the reader is", () => {
    expect(refusal("scenario.read", rolesAllowing("scenario.read"), "discharger")).toBe(
      "Only the basin's planners and lead can see the network, scenarios and runs; you are a discharger here.",
    );
    expect(refusal("plan.publish", rolesAllowing("plan.publish"), "planner")).toBe("Only the basin's lead can publish plans; you are a planner here.");
    expect(refusal("facilities.read", rolesAllowing("facilities.read"), "stakeholder")).toBe(
      "Only the basin's planners, dischargers and lead can see the basin's facilities; you are a stakeholder here.",
    );
    expect(refusal("audit.read", rolesAllowing("audit.read"), null)).toBe("Only the basin's lead can read the audit trail.");
    for (const a of BASIN_ACTIONS) expect(refusal(a, rolesAllowing(a), "stakeholder")).not.toMatch(/[a-z]\.[a-z]/);
  });
});
