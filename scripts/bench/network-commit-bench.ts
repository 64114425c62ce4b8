/**
 * Committing a network (issue 11: a 2k-reach network in ≤ 2 s): the synthetic zipped
 * shapefile and discharger CSV are uploaded to a throwaway database on the test cluster
 * (started when it is not running, as `npm test` does), then `commitNetwork` saves them
 * as the basin's next version — validation from the stored uploads, then nodes, reaches,
 * facilities and outfalls in one transaction. `validateDraft` of the same draft runs
 * beside it: the share of validation in the commit.
 */
import { performance } from "node:perf_hooks";
import { createDb } from "../../db/client";
import { migrateToLatest } from "../../db/migrate";
import { insertBasin } from "../../db/queries/basins";
import { insertMembership } from "../../db/queries/memberships";
import { insertUser } from "../../db/queries/users";
import type { Actor } from "../../lib/auth/guard";
import { basinScope, type BasinScope } from "../../lib/auth/scope";
import { uploadImport } from "../../lib/services/imports";
import { commitNetwork, validateDraft } from "../../lib/services/networks";
import type { NetworkDraft } from "../../lib/validation/network";
import { createThrowawayDatabase, dropDatabase, ensureTestCluster } from "../../tests/support/test-db";
import { SYNTHETIC_DISCHARGER_MAPPING, SYNTHETIC_REACH_MAPPING, syntheticFiles } from "./geo-import";
import { median } from "./measure";

async function draftFor(scope: BasinScope, files: ReturnType<typeof syntheticFiles>): Promise<NetworkDraft> {
  const reaches = await uploadImport(scope, { name: "synthetic.zip", bytes: Buffer.from(files.zip) }, { layer: "reaches" });
  const dischargers = await uploadImport(scope, { name: "dischargers.csv", bytes: Buffer.from(files.csv) }, { layer: "dischargers" });
  return {
    reachImportId: reaches.id,
    reachMapping: SYNTHETIC_REACH_MAPPING,
    dischargerImportId: dischargers.id,
    dischargerMapping: SYNTHETIC_DISCHARGER_MAPPING,
    options: { toleranceM: 5, maxSnapDistanceM: 500, maxReachLengthKm: 10, allowMultipleOutlets: false },
  } as NetworkDraft;
}

export async function networkCommitBench(target: number, dischargerCount: number, repeats = 3): Promise<void> {
  ensureTestCluster();
  const { url, name } = await createThrowawayDatabase("sagline_bench");
  const db = createDb(url, 4);
  try {
    await migrateToLatest(db);
    const u = await insertUser(db, { email: "bench-lead@bench.test", name: "Bench lead", password_hash: "x", is_admin: false });
    const actor: Actor = { id: u.id, email: u.email, name: u.name, isAdmin: false };
    const basin = await insertBasin(db, { slug: "bench", name: "Bench basin", description: "" });
    await insertMembership(db, basin.id, actor.id, "lead");
    const scope = await basinScope(db, actor, basin.id);
    const files = syntheticFiles(target, dischargerCount);
    const commits: number[] = [];
    const validations: number[] = [];
    let reaches = 0;
    for (let i = 0; i < repeats; i++) {
      const draft = await draftFor(scope, files);
      const v0 = performance.now();
      await validateDraft(scope, draft);
      validations.push(performance.now() - v0);
      const c0 = performance.now();
      const saved = await commitNetwork(scope, { draft, note: "", acceptReport: true });
      commits.push(performance.now() - c0);
      reaches = saved.reachCount;
    }
    const c = median(commits);
    const v = median(validations);
    console.log(
      `network commit, ${reaches} reaches + ${dischargerCount} dischargers into PostgreSQL: commit (validation of the stored uploads + the writes, one transaction) ` +
        `median ${c.toFixed(0)} ms, min ${Math.min(...commits).toFixed(0)} ms, against the 2 s target (${(c / 2000).toFixed(2)}×); ` +
        `validateDraft of the same draft alone: median ${v.toFixed(0)} ms (the uploads parsed once are reused, so the two overlap)`,
    );
  } finally {
    await db.destroy();
    await dropDatabase(name);
  }
}

if (process.argv[1]?.endsWith("network-commit-bench.ts")) {
  await networkCommitBench(Number(process.argv[2] ?? 2000), Number(process.argv[3] ?? 200));
  process.exit(0);
}
