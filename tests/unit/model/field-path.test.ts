import { describe, expect, it } from "vitest";
import { formatPath, ModelInputError } from "@/lib/model/errors";

describe("one formatter for field paths (model errors, zod issues, CLIs)", () => {
  it("writes indices in brackets and keys with dots", () => {
    expect(formatPath(["dischargers", 2, "km"])).toBe("dischargers[2].km");
    expect(formatPath([0, "id"])).toBe("[0].id");
    expect(formatPath(["allocation", "bounds", "MR-1", "min_kg_day"])).toBe("allocation.bounds.MR-1.min_kg_day");
  });

  it("names the whole file, or what the caller says, for an empty path", () => {
    expect(formatPath([])).toBe("(model)");
    expect(formatPath([], "arguments")).toBe("arguments");
  });

  it("a model input error reads its path the same way", () => {
    expect(new ModelInputError(["reaches", 1, "depth_m"], "must be greater than zero").message).toBe("reaches[1].depth_m: must be greater than zero");
  });
});
