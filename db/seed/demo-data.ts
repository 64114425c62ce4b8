import type { BasinRole, UnitSystem } from "../schema";

/**
 * The invented demo basin. Every river, town, facility and person here is
 * made up; none of it is an expected value in any test of the science.
 */
export const DEMO_PASSWORD_NOTE = "Demo accounts only — change or remove them before real use.";

export interface DemoUser {
  key: "admin" | BasinRole;
  name: string;
  email: string;
  password: string;
  isAdmin: boolean;
}

export const DEMO_USERS: DemoUser[] = [
  { key: "admin", name: "Ada Penrose", email: "admin@sagline.test", password: "demo-admin-pass", isAdmin: true },
  { key: "lead", name: "Maren Oakhurst", email: "lead@sagline.test", password: "demo-lead-pass", isAdmin: false },
  { key: "planner", name: "Tobias Wren", email: "planner@sagline.test", password: "demo-planner-pass", isAdmin: false },
  { key: "discharger", name: "Ines Calder", email: "discharger@sagline.test", password: "demo-discharger-pass", isAdmin: false },
  { key: "stakeholder", name: "Dev Halloran", email: "stakeholder@sagline.test", password: "demo-stakeholder-pass", isAdmin: false },
];

export interface DemoBasin {
  slug: string;
  name: string;
  description: string;
  doCriterionMgL: number;
  unitSystem: UnitSystem;
  members: { key: BasinRole; role: BasinRole }[];
  facilities: { name: string; permitId: string; dischargerKeys: BasinRole[] }[];
}

export const DEMO_BASINS: DemoBasin[] = [
  {
    slug: "tamsel-river",
    name: "Tamsel River basin",
    description:
      "Invented demonstration basin: the Tamsel River and its tributaries, flowing past Quillford, " +
      "Marrowby, East Penhallow, Dunmere and Harrowgate. Summer low flow with warm water sets the " +
      "critical condition.",
    doCriterionMgL: 5,
    unitSystem: "SI",
    members: [
      { key: "lead", role: "lead" },
      { key: "planner", role: "planner" },
      { key: "discharger", role: "discharger" },
      { key: "stakeholder", role: "stakeholder" },
    ],
    // Permit ids match the demo discharger file (tests/fixtures/demo/tamsel-dischargers.csv).
    facilities: [
      { name: "Quillford Water Reclamation Plant", permitId: "DP-1001", dischargerKeys: ["discharger"] },
      { name: "Marrowby Creamery", permitId: "DP-1002", dischargerKeys: [] },
      { name: "East Penhallow Sanitary District", permitId: "DP-1003", dischargerKeys: [] },
      { name: "Dunmere Board Mill", permitId: "DP-1004", dischargerKeys: [] },
      { name: "Harrowgate Village Wastewater Works", permitId: "DP-1005", dischargerKeys: [] },
    ],
  },
  {
    slug: "kestle-water",
    name: "Kestle Water basin",
    description: "Invented second basin, in US customary units. The demo discharger is not a member here.",
    doCriterionMgL: 4,
    unitSystem: "US",
    members: [
      { key: "lead", role: "lead" },
      { key: "planner", role: "planner" },
    ],
    facilities: [{ name: "Kestle Village Lagoons", permitId: "KW-0001", dischargerKeys: [] }],
  },
];
