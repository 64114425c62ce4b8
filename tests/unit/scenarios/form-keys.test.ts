import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { formKey, fromFormKeys, idOfFormKey, toFormKeys } from "@/lib/scenarios/form-keys";

describe("form keys for reach and permit ids", () => {
  it("never contain a dot and never read as an array index", () => {
    for (const id of ["R.2", "12", "0", "TR-03", "KY0021491", "a b/c", "Bärenbach.1"]) {
      const key = formKey(id);
      expect(key).not.toContain(".");
      expect(/^\d+$/.test(key)).toBe(false);
      expect(idOfFormKey(key)).toBe(id);
    }
  });

  it("round-trip any id and any record", () => {
    fc.assert(fc.property(fc.string(), (id) => idOfFormKey(formKey(id)) === id));
    fc.assert(
      fc.property(fc.dictionary(fc.string(), fc.integer()), (record) => {
        expect(fromFormKeys(toFormKeys(record))).toEqual(record);
      }),
    );
  });
});
