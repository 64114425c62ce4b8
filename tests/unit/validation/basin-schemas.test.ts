import { describe, expect, it } from "vitest";
import { basinCreateSchema, basinUpdateSchema } from "@/lib/validation/basin";
import { memberAddSchema } from "@/lib/validation/member";
import { userCreateSchema } from "@/lib/validation/user";

const valid = { name: "Vell River basin", slug: "vell-river", description: "", doCriterionMgL: 5, unitSystem: "SI" };
const paths = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) =>
  (r.error?.issues ?? []).map((i) => i.path.join("."));

describe("basin schema (shared by the form and the API)", () => {
  it("accepts a valid basin and coerces the criterion from form text", () => {
    const r = basinCreateSchema.safeParse({ ...valid, doCriterionMgL: "4.5" });
    expect(r.success && r.data.doCriterionMgL).toBe(4.5);
  });
  it.each([
    ["slug", { slug: "Vell River" }],
    ["slug", { slug: "-vell" }],
    ["name", { name: "V" }],
    ["doCriterionMgL", { doCriterionMgL: 0 }],
    ["doCriterionMgL", { doCriterionMgL: 20 }],
    ["doCriterionMgL", { doCriterionMgL: "five" }],
    ["unitSystem", { unitSystem: "metric" }],
  ])("rejects a bad %s", (path, patch) => {
    const r = basinCreateSchema.safeParse({ ...valid, ...patch });
    expect(r.success).toBe(false);
    expect(paths(r)).toEqual([path]);
  });
  it("update needs at least one field", () => {
    expect(basinUpdateSchema.safeParse({}).success).toBe(false);
    expect(basinUpdateSchema.safeParse({ unitSystem: "US" }).success).toBe(true);
  });
});

describe("member and user schemas", () => {
  it("normalises e-mail addresses", () => {
    const r = memberAddSchema.parse({ email: "  Ines.Calder@Sagline.TEST ", role: "discharger" });
    expect(r.email).toBe("ines.calder@sagline.test");
  });
  it("rejects unknown roles and short passwords by field", () => {
    expect(paths(memberAddSchema.safeParse({ email: "a@b.test", role: "owner" }))).toEqual(["role"]);
    expect(paths(userCreateSchema.safeParse({ name: "Al", email: "a@b.test", password: "short", isAdmin: false }))).toEqual([
      "password",
    ]);
  });
});
