import { describe, expect, it } from "vitest";
import { SCENARIO_FIELD_LABELS } from "@/lib/format/labels";
import { allocationSettingsSchema, scenarioInputsSchema } from "@/lib/validation/scenario";

const messageOf = (result: { success: boolean; error?: { issues: { message: string; path: PropertyKey[] }[] } }) => result.error?.issues.map((i) => i.message) ?? [];

describe("scenario validation messages use the editor's labels", () => {
  it("a reserve share of 0.95 is refused under the field's own label", () => {
    const messages = messageOf(allocationSettingsSchema.safeParse({ reserveFraction: 0.95 }));
    expect(messages).toEqual([`${SCENARIO_FIELD_LABELS.reserveFraction} must be at most 0.9 (90 % of the capacity)`]);
    expect(messages.join(" ")).not.toMatch(/reserve fraction/);
  });

  it("a negative margin of safety share names the field instead of zod's default wording", () => {
    const messages = messageOf(allocationSettingsSchema.safeParse({ mosFraction: -0.1 }));
    expect(messages).toEqual(["Margin of safety as a share of capacity cannot be negative"]);
  });

  it("design temperature, flow scale and profile spacing name their labels and units", () => {
    const messages = messageOf(
      scenarioInputsSchema.safeParse({ stepKm: 0.01, conditions: [{ name: "Low flow", flowScale: 0, temperatureC: 50 }] }),
    );
    expect(messages).toEqual(
      expect.arrayContaining([
        "Profile spacing must be at least 0.05 km (50 m)",
        "Flow scale must be above zero",
        "Design temperature must be at most 45 °C (113 °F)",
      ]),
    );
    // no message starts with a lower-case code-like field name
    for (const m of messages) expect(m).toMatch(/^[A-Z]/);
  });
});
