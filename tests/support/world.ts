import { randomBytes } from "node:crypto";
import type { Db } from "@/db/client";
import { insertBasin } from "@/db/queries/basins";
import { insertFacility, linkFacilityUser } from "@/db/queries/facilities";
import { insertMembership } from "@/db/queries/memberships";
import { insertUser } from "@/db/queries/users";
import type { BasinRole } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";

export const WORLD_PASSWORD = "world-password-1";
// bcrypt hash of WORLD_PASSWORD at cost 4 (cheap for tests; verified by bcrypt.compare in the sign-in tests).
let hashPromise: Promise<string> | null = null;
async function worldHash(): Promise<string> {
  const bcrypt = (await import("bcryptjs")).default;
  hashPromise ??= bcrypt.hash(WORLD_PASSWORD, 4);
  return hashPromise;
}

export type WorldUserKey = "admin" | BasinRole | "outsider" | "spare" | "spareDischarger" | "target";

export interface World {
  basinId: string;
  otherBasinId: string;
  facilityId: string;
  users: Record<WorldUserKey, Actor>;
}

/**
 * A fresh basin with one member per role, an outsider (signed in, not a
 * member), a spare account (not a member, to be added), a stakeholder
 * "target" (to be re-roled or removed), a discharger not yet linked, and a
 * facility linked to the discharger. Unique names so worlds never collide.
 */
export async function buildWorld(db: Db): Promise<World> {
  const tag = randomBytes(4).toString("hex");
  const hash = await worldHash();
  const keys: WorldUserKey[] = [
    "admin",
    "lead",
    "planner",
    "discharger",
    "stakeholder",
    "outsider",
    "spare",
    "spareDischarger",
    "target",
  ];
  const users = {} as Record<WorldUserKey, Actor>;
  for (const key of keys) {
    const u = await insertUser(db, {
      email: `${key.toLowerCase()}-${tag}@world.test`,
      name: `${key} ${tag}`,
      password_hash: hash,
      is_admin: key === "admin",
    });
    users[key] = { id: u.id, email: u.email, name: u.name, isAdmin: u.is_admin };
  }
  const basin = await insertBasin(db, { slug: `world-${tag}`, name: `World ${tag}`, description: "test basin" });
  const other = await insertBasin(db, { slug: `other-${tag}`, name: `Other ${tag}`, description: "not yours" });
  const roles: [WorldUserKey, BasinRole][] = [
    ["lead", "lead"],
    ["planner", "planner"],
    ["discharger", "discharger"],
    ["stakeholder", "stakeholder"],
    ["spareDischarger", "discharger"],
    ["target", "stakeholder"],
  ];
  for (const [key, role] of roles) await insertMembership(db, basin.id, users[key].id, role);
  await insertMembership(db, other.id, users.outsider.id, "lead");
  const facility = await insertFacility(db, { basin_id: basin.id, name: `Plant ${tag}`, permit_id: `P-${tag}` });
  await linkFacilityUser(db, facility.id, users.discharger.id);
  return { basinId: basin.id, otherBasinId: other.id, facilityId: facility.id, users };
}
