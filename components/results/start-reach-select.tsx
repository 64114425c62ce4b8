"use client";
import type { ModelFile } from "@/lib/model";

/** "From" — the reach a DO profile starts at, headwaters marked; the profile follows its water to the outlet. */
export function StartReachSelect({ id, model, heads, value, onChange }: { id: string; model: ModelFile; heads: readonly string[]; value: string; onChange: (reach: string) => void }) {
  return (
    <div>
      <label htmlFor={id} className="field-label">
        From
      </label>
      <select id={id} className="field-input" value={value} onChange={(e) => onChange(e.target.value)}>
        {model.reaches.map((x) => (
          <option key={x.id} value={x.id}>
            {x.id}
            {heads.includes(x.id) ? " (headwater)" : ""}
          </option>
        ))}
      </select>
    </div>
  );
}
