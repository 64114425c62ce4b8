import { z } from "zod";

const id = (name: string) => z.uuid(`${name} is not a valid id`);

export const basinParams = z.object({ basinId: id("basinId") });
export const memberParams = basinParams.extend({ userId: id("userId") });
export const facilityParams = basinParams.extend({ facilityId: id("facilityId") });
export const facilityUserParams = facilityParams.extend({ userId: id("userId") });

export const importParams = basinParams.extend({ importId: id("importId") });
/** A network version id, or "latest" for the basin's newest version. */
export const networkParams = basinParams.extend({
  networkId: z.union([z.literal("latest"), id("networkId")], { message: 'networkId must be a network id or "latest"' }),
});
export const reachParams = basinParams.extend({ networkId: id("networkId"), reachId: z.string().min(1).max(200) });
export const outfallParams = basinParams.extend({ networkId: id("networkId"), facilityId: id("facilityId") });
export const scenarioParams = basinParams.extend({ scenarioId: id("scenarioId") });
export const runParams = basinParams.extend({ runId: id("runId") });
export const planParams = basinParams.extend({ planId: id("planId") });
export const threadParams = basinParams.extend({ threadId: id("threadId") });
export const gaugeParams = basinParams.extend({ gaugeId: id("gaugeId") });
export const surveyParams = basinParams.extend({ surveyId: id("surveyId") });
