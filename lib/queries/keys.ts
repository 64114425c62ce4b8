/** Query keys, scoped by parent id so a mutation can invalidate exactly what it touched. */
export const queryKeys = {
  me: () => ["me"] as const,
  basins: {
    all: () => ["basins"] as const,
    list: () => ["basins", "list"] as const,
    detail: (basinId: string) => ["basins", basinId] as const,
    members: (basinId: string) => ["basins", basinId, "members"] as const,
    facilities: (basinId: string) => ["basins", basinId, "facilities"] as const,
    audit: (basinId: string) => ["basins", basinId, "audit"] as const,
    networks: (basinId: string) => ["basins", basinId, "networks"] as const,
    network: (basinId: string, networkId: string) => ["basins", basinId, "networks", networkId] as const,
    imports: (basinId: string) => ["basins", basinId, "imports"] as const,
    mappings: (basinId: string) => ["basins", basinId, "field-mappings"] as const,
    scenarios: (basinId: string) => ["basins", basinId, "scenarios"] as const,
    scenario: (basinId: string, scenarioId: string) => ["basins", basinId, "scenarios", scenarioId] as const,
    runs: (basinId: string) => ["basins", basinId, "runs"] as const,
    run: (basinId: string, runId: string) => ["basins", basinId, "runs", runId] as const,
    plans: (basinId: string) => ["basins", basinId, "plans"] as const,
    plan: (basinId: string, planId: string) => ["basins", basinId, "plans", planId] as const,
  },
  users: () => ["users"] as const,
};
