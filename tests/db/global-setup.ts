import type { TestProject } from "vitest/node";
import { createDb } from "@/db/client";
import { migrateToLatest } from "@/db/migrate";
import { createThrowawayDatabase, dropDatabase, ensureTestCluster } from "../support/test-db";

declare module "vitest" {
  export interface ProvidedContext {
    databaseUrl: string;
  }
}

/** One throwaway, migrated database for the whole db run; dropped afterwards. */
export default async function setup(project: TestProject) {
  ensureTestCluster();
  const { url, name } = await createThrowawayDatabase("sagline_db_test");
  const db = createDb(url, 2);
  await migrateToLatest(db);
  await db.destroy();
  project.provide("databaseUrl", url);
  return async () => {
    if (!process.env.SAGLINE_KEEP_TEST_DB) await dropDatabase(name);
  };
}
