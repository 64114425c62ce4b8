import type { Db } from "../client";
import { findBasinBySlug, insertBasin } from "../queries/basins";
import { findFacilityByPermit, insertFacility, linkFacilityUser } from "../queries/facilities";
import { findMembershipRole, insertMembership } from "../queries/memberships";
import { findUserByEmail, insertUser } from "../queries/users";
import { DEMO_BASINS, DEMO_USERS } from "./demo-data";

/**
 * Load the invented demo basin and one user per role. Re-runnable: anything
 * already present (matched by e-mail, slug, permit id) is left as it is.
 * One transaction, so a failure leaves nothing half-loaded.
 */
export async function seedDemo(db: Db, hash: (password: string) => Promise<string>): Promise<{ created: number }> {
  let created = 0;
  await db.transaction().execute(async (trx) => {
    const ids = new Map<string, string>();
    for (const u of DEMO_USERS) {
      let user = await findUserByEmail(trx, u.email);
      if (!user) {
        user = await insertUser(trx, {
          email: u.email,
          name: u.name,
          password_hash: await hash(u.password),
          is_admin: u.isAdmin,
        });
        created++;
      }
      ids.set(u.key, user.id);
    }
    for (const b of DEMO_BASINS) {
      let basin = await findBasinBySlug(trx, b.slug);
      if (!basin) {
        basin = await insertBasin(trx, {
          slug: b.slug,
          name: b.name,
          description: b.description,
          do_criterion_mg_l: b.doCriterionMgL,
          unit_system: b.unitSystem,
          created_by: ids.get("admin")!,
        });
        created++;
      }
      for (const m of b.members) {
        const userId = ids.get(m.key)!;
        if (!(await findMembershipRole(trx, basin.id, userId))) {
          await insertMembership(trx, basin.id, userId, m.role);
          created++;
        }
      }
      for (const f of b.facilities) {
        let facility = await findFacilityByPermit(trx, basin.id, f.permitId);
        if (!facility) {
          facility = await insertFacility(trx, { basin_id: basin.id, name: f.name, permit_id: f.permitId });
          created++;
        }
        for (const key of f.dischargerKeys) await linkFacilityUser(trx, facility.id, ids.get(key)!);
      }
    }
  });
  return { created };
}
