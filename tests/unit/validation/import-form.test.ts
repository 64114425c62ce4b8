import { describe, expect, it } from "vitest";
import { importDefaults } from "@/lib/domain";
import { checkDraft, commitOf, draftOf, importFormDefaults, importFormSchema, type ImportForm } from "@/lib/validation/import-form";
import { networkCommitSchema, networkDraftSchema } from "@/lib/validation/network";

const REACH_UPLOAD = "0b5a7a7e-2f7c-4f55-9d0f-6a3c0b1f2e11";
const DISCHARGER_UPLOAD = "4c1d2e3f-5a6b-4c7d-8e9f-0a1b2c3d4e5f";

function filled(over: Partial<ImportForm> = {}): ImportForm {
  return {
    ...importFormDefaults(),
    reachImportId: REACH_UPLOAD,
    bindings: {
      reaches: { reachId: { source: "REACH_ID" }, designFlow: { source: "Q_CFS", unit: "cfs" }, velocity: { source: "VEL" } },
      dischargers: {},
    },
    ...over,
  };
}

describe("the import wizard's form", () => {
  it("starts from the API's own default options and parses as its own schema", () => {
    const start = importFormDefaults();
    expect(start.options).toEqual(importDefaults());
    expect(importFormSchema.safeParse(start).success).toBe(true);
  });

  it("turns the planner's bindings into the very draft the validate route parses", () => {
    const { draft, problem } = checkDraft(filled());
    expect(problem).toBeUndefined();
    // a unit left unchosen takes the field's first unit (m/s), a chosen one is kept
    expect(draft!.reachMapping).toEqual({ reachId: "REACH_ID", designFlow: { source: "Q_CFS", unit: "cfs" }, velocity: { source: "VEL", unit: "m/s" } });
    expect(draft!.dischargerImportId).toBeUndefined();
    expect(networkDraftSchema.parse(draftOf(filled()))).toEqual(draft);
  });

  it("sends the outlet and reassignments only when the planner chose them", () => {
    expect(draftOf(filled()).options).not.toHaveProperty("outlets");
    expect(draftOf(filled()).options).not.toHaveProperty("reassign");
    const chosen = draftOf(filled({ outletReach: "R9", reassign: { "PX-1": "R4" } })).options;
    expect(chosen).toMatchObject({ outlets: [{ reachId: "R9" }], reassign: { "PX-1": "R4" } });
  });

  it("names where a refused draft went wrong, in the wizard's words", () => {
    expect(checkDraft(filled({ reachImportId: "" })).problem).toMatch(/^Reach lines: reachImportId must be an upload id/);
    const noDischargerFields = checkDraft(filled({ dischargerImportId: DISCHARGER_UPLOAD }));
    expect(noDischargerFields.problem).toMatch(/^Discharger fields/);
    const badTolerance = checkDraft(filled({ options: { ...importDefaults(), toleranceM: -1 } }));
    expect(badTolerance.problem).toMatch(/^Options \(toleranceM\): /);
  });

  it("makes the commit route's body, accepted, with the note", () => {
    const values = filled({ note: "spring survey lines" });
    const { draft } = checkDraft(values);
    const body = commitOf(draft!, values);
    expect(networkCommitSchema.parse(body)).toEqual({ draft, note: "spring survey lines", acceptReport: true });
  });
});
