import { QueryClient } from "@tanstack/react-query";
import { describe, expect, it } from "vitest";
import { invalidate } from "@/lib/queries/invalidate";
import { invalidations, queryKeys } from "@/lib/queries/keys";

const A = "11111111-1111-4111-8111-111111111111";
const B = "22222222-2222-4222-8222-222222222222";
const P = "33333333-3333-4333-8333-333333333333";
const Q = "44444444-4444-4444-8444-444444444444";

/** Every key a page of basin A (and one of basin B) may hold, by a name the tests use. */
const cached = {
  basinList: queryKeys.basins.list(),
  basinA: queryKeys.basins.detail(A),
  membersA: queryKeys.basins.members(A),
  facilitiesA: queryKeys.basins.facilities(A),
  invitationsA: queryKeys.basins.invitations(A),
  followA: queryKeys.basins.follow(A),
  networksA: queryKeys.basins.networks(A),
  scenariosA: queryKeys.basins.scenarios(A),
  runsA: queryKeys.basins.runs(A),
  plansA: queryKeys.basins.plans(A),
  planP: queryKeys.basins.plan(A, P),
  planQ: queryKeys.basins.plan(A, Q),
  basinB: queryKeys.basins.detail(B),
  plansB: queryKeys.basins.plans(B),
  invitationsB: queryKeys.basins.invitations(B),
  users: queryKeys.users(),
} as const;
type Name = keyof typeof cached;

/** Fill a cache with every key, run the targets, and name the keys left invalidated. */
async function invalidated(targets: Parameters<typeof invalidate>[1]): Promise<Name[]> {
  const qc = new QueryClient();
  for (const key of Object.values(cached)) qc.setQueryData(key, { filled: true });
  await invalidate(qc, targets);
  return (Object.keys(cached) as Name[]).filter((n) => qc.getQueryState(cached[n])?.isInvalidated).sort();
}

describe("what each plan, review, comment and invitation mutation invalidates", () => {
  it("proposing a plan: the basin's plan list only (no plan's own page, no other basin)", async () => {
    expect(await invalidated(invalidations.proposePlan(A))).toEqual(["plansA"]);
  });

  it("opening a review: that plan, the list, and the basin itself (its time zone), not the basin's other data", async () => {
    expect(await invalidated(invalidations.openReview(A, P))).toEqual(["basinA", "planP", "plansA"]);
  });

  it("extending a review and withdrawing: that plan and the list", async () => {
    expect(await invalidated(invalidations.extendReview(A, P))).toEqual(["planP", "plansA"]);
    expect(await invalidated(invalidations.withdrawPlan(A, Q))).toEqual(["planQ", "plansA"]);
  });

  it("publishing: every plan of the basin (a revision supersedes its earlier version) and the list, not another basin's", async () => {
    expect(await invalidated(invalidations.publishPlan(A))).toEqual(["planP", "planQ", "plansA"]);
  });

  it("a comment or a response: the plan that holds the thread, nothing else", async () => {
    expect(await invalidated(invalidations.addComment(A, P))).toEqual(["planP"]);
    expect(await invalidated(invalidations.respondToThread(A, Q))).toEqual(["planQ"]);
  });

  it("inviting and revoking: the basin's invitations", async () => {
    expect(await invalidated(invalidations.invite(A))).toEqual(["invitationsA"]);
    expect(await invalidated(invalidations.revokeInvitation(B))).toEqual(["invitationsB"]);
  });

  it("accepting an invitation: one's basins, the basin's members and invitations", async () => {
    expect(await invalidated(invalidations.acceptInvitation(A))).toEqual(["basinList", "invitationsA", "membersA"]);
  });

  it("keys nest under their basin, so a basin-wide invalidation reaches its plans and invitations", async () => {
    expect(await invalidated([{ queryKey: queryKeys.basins.detail(A) }])).toEqual(
      ["basinA", "facilitiesA", "followA", "invitationsA", "membersA", "networksA", "planP", "planQ", "plansA", "runsA", "scenariosA"].sort(),
    );
  });
});
