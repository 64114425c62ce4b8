import { describe, expect, it } from "vitest";
import { serverMessages } from "@/components/plans/plan-acts";
import { ApiError } from "@/lib/queries/fetcher";

describe("serverMessages: a failed plan mutation's messages beside the form's fields", () => {
  it("nothing when the mutation has not failed", () => {
    expect(serverMessages(null, ["body"])).toEqual({ field: {}, general: null });
  });

  it("each named field's first message, and no general message when a field was named", () => {
    const e = new ApiError(422, "invalid", "Invalid request", [
      { path: "endsAt", message: "Must be after the start" },
      { path: "endsAt", message: "second message" },
      { path: "other", message: "not shown by this form" },
    ]);
    expect(serverMessages(e, ["startsAt", "endsAt"])).toEqual({ field: { endsAt: "Must be after the start" }, general: null });
  });

  it("the general message when none of the form's fields was named (a 409, a network error)", () => {
    const e = new ApiError(409, "conflict", "Comments are accepted only while the plan's review period is open");
    expect(serverMessages(e, ["body"])).toEqual({ field: {}, general: "Comments are accepted only while the plan's review period is open" });
    expect(serverMessages(new Error("Failed to fetch"), ["body"]).general).toBe("Failed to fetch");
  });
});
