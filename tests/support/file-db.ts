import { afterAll } from "vitest";
import { createDb, getDb, type Db } from "@/db/client";
import { stopBoss } from "@/lib/jobs/queue";

/**
 * The db project's throwaway database for one test file: a small pool of its
 * own (tests/db/setup-env.ts has pointed DATABASE_URL at it), closed after the
 * file together with the job queue and the process-wide pool the services use.
 */
export function fileDb(poolSize = 3): Db {
  const db = createDb(process.env.DATABASE_URL, poolSize);
  afterAll(async () => {
    await stopBoss();
    await db.destroy();
    await getDb().destroy();
  });
  return db;
}
