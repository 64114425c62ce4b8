import { Migrator, type MigrationResultSet } from "kysely";
import { migrationProvider } from "@/migrations";
import type { Db } from "./client";

function migrator(db: Db): Migrator {
  return new Migrator({ db, provider: migrationProvider });
}

function check(result: MigrationResultSet): string[] {
  if (result.error) {
    const failed = result.results?.find((r) => r.status === "Error");
    throw new Error(`migration ${failed?.migrationName ?? "(unknown)"} failed: ${String(result.error)}`);
  }
  return (result.results ?? []).map((r) => `${r.direction} ${r.migrationName}`);
}

/** Apply every pending migration; returns the names applied. */
export async function migrateToLatest(db: Db): Promise<string[]> {
  return check(await migrator(db).migrateToLatest());
}

/** Undo the most recent migration. */
export async function migrateDown(db: Db): Promise<string[]> {
  return check(await migrator(db).migrateDown());
}

/** Undo every migration (used by tests of the down path). */
export async function migrateToNothing(db: Db): Promise<string[]> {
  const { NO_MIGRATIONS } = await import("kysely");
  return check(await migrator(db).migrateTo(NO_MIGRATIONS));
}
