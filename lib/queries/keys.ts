/** Query keys, scoped by parent id so a mutation can invalidate exactly what it touched. */
export const queryKeys = {
  basins: {
    all: () => ["basins"] as const,
    list: () => ["basins", "list"] as const,
    detail: (basinId: string) => ["basins", basinId] as const,
    members: (basinId: string) => ["basins", basinId, "members"] as const,
    facilities: (basinId: string) => ["basins", basinId, "facilities"] as const,
    invitations: (basinId: string) => ["basins", basinId, "invitations"] as const,
    follow: (basinId: string) => ["basins", basinId, "follow"] as const,
    audit: (basinId: string) => ["basins", basinId, "audit"] as const,
    networks: (basinId: string) => ["basins", basinId, "networks"] as const,
    network: (basinId: string, networkId: string) => ["basins", basinId, "networks", networkId] as const,
    imports: (basinId: string) => ["basins", basinId, "imports"] as const,
    mappings: (basinId: string) => ["basins", basinId, "field-mappings"] as const,
    gauges: (basinId: string) => ["basins", basinId, "gauges"] as const,
    surveys: (basinId: string) => ["basins", basinId, "surveys"] as const,
    survey: (basinId: string, surveyId: string) => ["basins", basinId, "surveys", surveyId] as const,
    scenarios: (basinId: string) => ["basins", basinId, "scenarios"] as const,
    scenario: (basinId: string, scenarioId: string) => ["basins", basinId, "scenarios", scenarioId] as const,
    runs: (basinId: string) => ["basins", basinId, "runs"] as const,
    run: (basinId: string, runId: string) => ["basins", basinId, "runs", runId] as const,
    plans: (basinId: string) => ["basins", basinId, "plans"] as const,
    plan: (basinId: string, planId: string) => ["basins", basinId, "plans", planId] as const,
  },
  users: () => ["users"] as const,
  /** Who is signed in, as the shared pages' header shows it. */
  signedIn: () => ["me", "session"] as const,
};

/**
 * What a mutation invalidates, as react-query filters. Keys match by prefix, so a parent key
 * (the basin, a plan list) is given `exact: true` when only it changed, not what lies under it.
 */
export interface KeyTarget {
  queryKey: readonly unknown[];
  exact?: boolean;
}

const planList = (basinId: string): KeyTarget => ({ queryKey: queryKeys.basins.plans(basinId), exact: true });
const onePlan = (basinId: string, planId: string): KeyTarget => ({ queryKey: queryKeys.basins.plan(basinId, planId), exact: true });

/** The keys each plan, review, comment and invitation mutation changes (tests/unit/queries/keys.test.ts). */
export const invalidations = {
  /** A new plan (or a new version of one) joins the list; the plan it revises changes only when it is published. */
  proposePlan: (basinId: string): KeyTarget[] => [planList(basinId)],
  /** The plan's stage and period, the list's stage; the first review's zone becomes the basin's. */
  openReview: (basinId: string, planId: string): KeyTarget[] => [
    onePlan(basinId, planId),
    planList(basinId),
    { queryKey: queryKeys.basins.detail(basinId), exact: true },
  ],
  /** A later end (and the reason) on the plan; the list's stage may change back from closed to open. */
  extendReview: (basinId: string, planId: string): KeyTarget[] => [onePlan(basinId, planId), planList(basinId)],
  withdrawPlan: (basinId: string, planId: string): KeyTarget[] => [onePlan(basinId, planId), planList(basinId)],
  /** Publishing a revision supersedes the earlier version: every plan of the basin and the list. */
  publishPlan: (basinId: string): KeyTarget[] => [{ queryKey: queryKeys.basins.plans(basinId) }],
  /** Threads (comments and responses) travel with the plan. */
  addComment: (basinId: string, planId: string): KeyTarget[] => [onePlan(basinId, planId)],
  respondToThread: (basinId: string, planId: string): KeyTarget[] => [onePlan(basinId, planId)],
  invite: (basinId: string): KeyTarget[] => [{ queryKey: queryKeys.basins.invitations(basinId) }],
  revokeInvitation: (basinId: string): KeyTarget[] => [{ queryKey: queryKeys.basins.invitations(basinId) }],
  /** Joining a basin: one's own basin list, the basin's members and its open invitations. */
  acceptInvitation: (basinId: string): KeyTarget[] => [
    { queryKey: queryKeys.basins.list() },
    { queryKey: queryKeys.basins.members(basinId) },
    { queryKey: queryKeys.basins.invitations(basinId) },
  ],
};
