import { describe, expect, it } from "vitest";
import { auditAction, AUDIT_ACTION_NAMES, conditionName, nameOf, REAERATION_NAMES, titleWithBasin } from "@/lib/format/labels";
import { KA_METHODS } from "@/lib/domain";

describe("display names", () => {
  it("a plan title that already names the basin is not prefixed again", () => {
    expect(titleWithBasin("Tamsel River basin", "Tamsel River basin: DO waste-load allocation (Base)")).toBe("Tamsel River basin: DO waste-load allocation (Base)");
    expect(titleWithBasin("Tamsel River basin", "Summer plan")).toBe("Tamsel River basin: Summer plan");
  });

  it("audit actions read as a sentence's verb, never as the stored code", () => {
    expect(auditAction("comment.added")).toBe("Commented in a thread");
    for (const [code, words] of Object.entries(AUDIT_ACTION_NAMES)) expect(words, code).not.toContain(code);
    // an unknown action still reads as words, with its code for the record
    expect(auditAction("x.unknown")).toBe("Recorded an event (x.unknown)");
  });

  it("every reaeration formula a run can record has a name", () => {
    for (const m of KA_METHODS) expect(nameOf(REAERATION_NAMES, m), m).not.toBe(m);
  });

  it("the model file's own unnamed condition never reads as its code", () => {
    expect(conditionName("base")).toBe("the design condition");
    expect(conditionName("Hot, dry 7Q10")).toBe("Hot, dry 7Q10");
  });
});
