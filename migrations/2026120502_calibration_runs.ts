import { sql, type Kysely } from "kysely";

// A run may be a calibration: kinetic coefficients fitted to a survey's DO on one condition of
// a scenario (lib/calibration/), its inputs and result stored like any run's.

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table runs drop constraint runs_kind`.execute(db);
  await sql`alter table runs add constraint runs_kind check (kind in ('model', 'allocation', 'calibration'))`.execute(db);
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await sql`delete from runs where kind = 'calibration'`.execute(db);
  await sql`alter table runs drop constraint runs_kind`.execute(db);
  await sql`alter table runs add constraint runs_kind check (kind in ('model', 'allocation'))`.execute(db);
}
