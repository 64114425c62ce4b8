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
    slug: "vell-river",
    name: "Vell River basin",
    description:
      "Invented demonstration basin: the Vell River and its tributaries Corran Brook and Ashby Water, " +
      "flowing past the towns of Hollin Cross, Dunmere and Saltreach. Summer low flow with warm water " +
      "sets the critical condition.",
    doCriterionMgL: 5,
    unitSystem: "SI",
    members: [
      { key: "lead", role: "lead" },
      { key: "planner", role: "planner" },
      { key: "discharger", role: "discharger" },
      { key: "stakeholder", role: "stakeholder" },
    ],
    facilities: [
      { name: "Hollin Cross Water Recovery Works", permitId: "VR-0101", dischargerKeys: ["discharger"] },
      { name: "Dunmere Municipal Treatment Plant", permitId: "VR-0102", dischargerKeys: [] },
      { name: "Saltreach Creamery", permitId: "VR-0203", dischargerKeys: [] },
      { name: "Corran Brook Paperboard Mill", permitId: "VR-0304", dischargerKeys: [] },
    ],
  },
  {
    slug: "tamsey-creek",
    name: "Tamsey Creek basin",
    description: "Invented second basin, in US customary units. The demo discharger is not a member here.",
    doCriterionMgL: 4,
    unitSystem: "US",
    members: [
      { key: "lead", role: "lead" },
      { key: "planner", role: "planner" },
    ],
    facilities: [{ name: "Tamsey Village Lagoons", permitId: "TC-0001", dischargerKeys: [] }],
  },
];
