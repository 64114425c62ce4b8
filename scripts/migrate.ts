import { createDb } from "@/db/client";
import { migrateDown, migrateToLatest } from "@/db/migrate";

const direction = process.argv[2] ?? "latest";
const db = createDb();
try {
  const applied = direction === "down" ? await migrateDown(db) : await migrateToLatest(db);
  console.log(applied.length ? applied.join("\n") : "database is up to date");
} catch (error) {
  console.error(error instanceof Error ? error.message : String(error));
  process.exitCode = 1;
} finally {
  await db.destroy();
}
