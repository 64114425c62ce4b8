import { networkSummaries } from "./networks";
import { sql } from "kysely";
import type { Db } from "../client";

/**
 * What a finished run's outcome is read from, cut out of its stored result by PostgreSQL:
 * each condition's name and minimum, and the allocation's feasibility, condition names and
 * the condition of each binding checkpoint. The profiles (most of a result's bytes) stay in
 * the database.
 */
export interface RunOutcomeRow {
  id: string;
  scenario_id: string;
  kind: "model" | "allocation";
  finished_at: Date | null;
  conditions: { name: string; minimum: { reach: string; km: number; do_mg_l: number }; criterion_do_mg_l: number }[] | null;
  allocation: { feasible: boolean; conditions: string[]; binding: string[] } | null;
}

const outcomeColumns = sql<Pick<RunOutcomeRow, "conditions" | "allocation">>`
  (select jsonb_agg(jsonb_build_object('name', c->'name', 'minimum', c->'run'->'minimum', 'criterion_do_mg_l', c->'run'->'criterion_do_mg_l') order by o)
     from jsonb_array_elements(r.result->'conditions') with ordinality as t(c, o)) as conditions,
  case when jsonb_typeof(r.result->'allocation') = 'object' then jsonb_build_object(
    'feasible', r.result->'allocation'->'feasible',
    'conditions', coalesce(r.result->'allocation'->'conditions', '[]'::jsonb),
    'binding', coalesce((select jsonb_agg(b->'condition') from jsonb_array_elements(r.result->'allocation'->'binding') as b), '[]'::jsonb)
  ) end as allocation`;

/** The newest finished run of each scenario of a basin (one row per scenario that has one). */
export async function latestDoneRunPerScenario(db: Db, basinId: string): Promise<RunOutcomeRow[]> {
  // pick the runs first, so only their results are read
  const { rows } = await sql<RunOutcomeRow>`
    with latest as (
      select distinct on (scenario_id) id from runs
      where basin_id = ${basinId} and status = 'done'
      order by scenario_id, finished_at desc nulls last, created_at desc)
    select r.id, r.scenario_id, r.kind, r.finished_at, ${outcomeColumns}
    from runs r join latest l on l.id = r.id`.execute(db);
  return rows;
}

/** Outcomes of a basin's finished runs, newest first (as many as the runs list shows). */
export async function doneRunOutcomes(db: Db, basinId: string, limit = 200): Promise<RunOutcomeRow[]> {
  const { rows } = await sql<RunOutcomeRow>`
    with shown as (
      select id, created_at from runs where basin_id = ${basinId} and status = 'done' order by created_at desc limit ${limit})
    select r.id, r.scenario_id, r.kind, r.finished_at, ${outcomeColumns}
    from runs r join shown s on s.id = r.id
    order by s.created_at desc`.execute(db);
  return rows;
}

/** The basin's newest network version with its size and who saved it. */
export async function currentNetworkSummary(db: Db, basinId: string) {
  return networkSummaries(db, basinId).limit(1).executeTakeFirst();
}
