import { listBasinPlans } from "@/db/queries/plans";
import { currentNetworkSummary, doneRunOutcomes, latestDoneRunPerScenario, type RunOutcomeRow } from "@/db/queries/run-outcomes";
import { listScenarios as listScenarioRows } from "@/db/queries/scenarios";
import type { BasinScope } from "@/lib/auth/scope";
import { PLAN_STAGE_TEXT, planStage, type PlanStage } from "@/lib/plans/review-rules";
import { runOutcome, type RunOutcome } from "@/lib/results/run-outcome";
import { listBasinAudit, type AuditEventDto } from "./audit";

export interface CurrentNetworkDto {
  id: string;
  version: number;
  reachCount: number;
  outfallCount: number;
  totalLengthKm: number;
  note: string;
  createdAt: string;
  createdBy: string | null;
}

export interface ScenarioOverviewDto {
  id: string;
  name: string;
  networkVersion: number;
  /** The scenario is bound to an older network version than the basin's newest. */
  newerNetwork: boolean;
  updatedAt: string;
  /** The newest finished run and what it came to; null when it has not been run to the end yet. */
  latestRun: { id: string; kind: "model" | "allocation"; finishedAt: string | null; outcome: RunOutcome | null } | null;
}

export interface PlanOverviewDto {
  id: string;
  title: string;
  version: number;
  stage: PlanStage;
  stageText: string;
  createdAt: string;
  createdBy: string | null;
  review: { startsAt: string; endsAt: string; closedAt: string | null } | null;
  publishedAt: string | null;
}

/**
 * The basin's hub as one reader may see it. A section the reader may not read is null
 * (not empty), so the page leaves it out rather than saying there is nothing.
 */
export interface BasinOverviewDto {
  /** Planners and leads (scenario.read): the newest network version. */
  network: CurrentNetworkDto | null;
  /** Whether a network exists at all is planner knowledge too; null for others. */
  scenarios: ScenarioOverviewDto[] | null;
  /** Every reader: the plans they may read (drafts only for planners and leads). */
  plans: PlanOverviewDto[];
  /** Leads and admins (audit.read): the newest few audit events. */
  activity: AuditEventDto[] | null;
}

const RECENT_EVENTS = 6;

const outcomeOf = (r: RunOutcomeRow): RunOutcome | null => runOutcome({ kind: r.kind, conditions: r.conditions ?? [], allocation: r.allocation });

/** The overview of a basin (basin.read), each part only as the reader's role allows. A fixed number of queries, whatever the basin holds. */
export async function basinOverview(scope: BasinScope, now = new Date()): Promise<BasinOverviewDto> {
  scope.require("basin.read");
  const { db, basin } = scope;
  const [planner, auditor] = [scope.can("scenario.read"), scope.can("audit.read")];
  const [net, scenarioRows, latestRuns, planRows, events] = await Promise.all([
    planner ? currentNetworkSummary(db, basin.id) : undefined,
    planner ? listScenarioRows(db, basin.id) : [],
    planner ? latestDoneRunPerScenario(db, basin.id) : [],
    listBasinPlans(db, basin.id, planner ? "planner" : "signedIn"),
    auditor ? listBasinAudit(scope, { limit: RECENT_EVENTS }) : null,
  ]);
  const runBy = new Map(latestRuns.map((r) => [r.scenario_id, r]));
  return {
    network: net
      ? {
          id: net.id,
          version: net.version,
          reachCount: Number(net.reach_count ?? 0),
          outfallCount: Number(net.outfall_count ?? 0),
          totalLengthKm: net.total_length_km,
          note: net.note,
          createdAt: net.created_at.toISOString(),
          createdBy: net.created_by_name,
        }
      : null,
    scenarios: planner
      ? scenarioRows.map((s) => {
          const run = runBy.get(s.id);
          return {
            id: s.id,
            name: s.name,
            networkVersion: s.network_version,
            newerNetwork: net !== undefined && s.network_version < net.version,
            updatedAt: s.updated_at.toISOString(),
            latestRun: run ? { id: run.id, kind: run.kind, finishedAt: run.finished_at?.toISOString() ?? null, outcome: outcomeOf(run) } : null,
          };
        })
      : null,
    plans: planRows.map((p) => {
      const period = p.starts_at && p.ends_at ? { startsAt: p.starts_at, endsAt: p.ends_at, closedAt: p.closed_at } : null;
      const stage = planStage(p.status, period, now);
      return {
        id: p.id,
        title: p.title,
        version: p.version,
        stage,
        stageText: PLAN_STAGE_TEXT[stage],
        createdAt: p.created_at.toISOString(),
        createdBy: p.created_by_name,
        review: period ? { startsAt: period.startsAt.toISOString(), endsAt: period.endsAt.toISOString(), closedAt: period.closedAt?.toISOString() ?? null } : null,
        publishedAt: p.published_at?.toISOString() ?? null,
      };
    }),
    activity: events,
  };
}

export interface RunOutcomesDto {
  /** The basin's newest network version (null before any import). */
  latestNetworkVersion: number | null;
  /** Outcome of each finished run in the runs list, by run id. */
  runs: Record<string, RunOutcome | null>;
}

/** Outcomes of the basin's finished runs for the runs list (scenario.read), and the newest network version. */
export async function listRunOutcomes(scope: BasinScope): Promise<RunOutcomesDto> {
  scope.require("scenario.read");
  const { db, basin } = scope;
  const [rows, net] = await Promise.all([doneRunOutcomes(db, basin.id), currentNetworkSummary(db, basin.id)]);
  return { latestNetworkVersion: net?.version ?? null, runs: Object.fromEntries(rows.map((r) => [r.id, outcomeOf(r)])) };
}
