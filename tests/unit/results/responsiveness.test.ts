import { describe, expect, it } from "vitest";
import { PLANNING_CAUTION } from "@/lib/results/caution";
import { awaitsResponse, responsivenessPreface, responsivenessRows } from "@/lib/results/responsiveness";

const c = (author: string, at: string, body = "text") => ({ author, role: "stakeholder", body, at });

describe("responsiveness summary", () => {
  it("lists every comment once, the plan-wide thread first, each with its thread's response", () => {
    const rows = responsivenessRows([
      { facilityName: "Marrowby Creamery", permitId: "DP-1002", status: "open", response: null, responder: null, comments: [c("B", "2026-12-02T10:00:00Z")] },
      { facilityName: null, permitId: null, status: "addressed", response: "Noted.", responder: "Tobias Wren", comments: [c("C", "2026-12-03T00:00:00Z"), c("A", "2026-12-01T00:00:00Z")] },
      { facilityName: "Dunmere Board Mill", permitId: "DP-1004", status: "open", response: null, responder: null, comments: [] },
    ]);
    expect(rows.map((r) => [r.topic, r.author])).toEqual([
      ["The plan as a whole", "A"],
      ["The plan as a whole", "C"],
      ["Marrowby Creamery", "B"],
    ]);
    expect(rows[0]).toMatchObject({ response: "Noted.", responder: "Tobias Wren", status: "addressed" });
    expect(rows[2]).toMatchObject({ permitId: "DP-1002", response: "" });
  });

  it("carries the planning caution first in its notes", () => {
    const preface = responsivenessPreface("Tamsel River plan", 2);
    expect(preface.slice(0, PLANNING_CAUTION.length)).toEqual([...PLANNING_CAUTION]);
    expect(preface.at(-1)).toMatch(/version 2/);
  });
});

describe("threads awaiting a response", () => {
  const at = (when: string) => ({ at: when });
  it("waits when commented and unanswered, or commented again after the response", () => {
    expect(awaitsResponse({ comments: [], respondedAt: null })).toBe(false);
    expect(awaitsResponse({ comments: [at("2027-01-05T10:00:00Z")], respondedAt: null })).toBe(true);
    expect(awaitsResponse({ comments: [at("2027-01-05T10:00:00Z")], respondedAt: "2027-01-06T09:00:00Z" })).toBe(false);
    expect(awaitsResponse({ comments: [at("2027-01-05T10:00:00Z"), at("2027-01-07T08:00:00Z")], respondedAt: "2027-01-06T09:00:00Z" })).toBe(true);
  });
});
