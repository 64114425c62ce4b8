/** The usual design low flows a gauge record gives (lib/hydrology/low-flow.ts DESIGN_FLOWS): n-day minimum, T-year return period. */
export const DESIGN_FLOW_NAMES = ["1Q10", "7Q10", "30Q5", "7Q2"] as const;
export type DesignFlowName = (typeof DESIGN_FLOW_NAMES)[number];
