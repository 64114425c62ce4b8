"use client";
import type { FieldInfo } from "@/geo/types";
import type { Bindings, ModelField } from "@/geo/mapping-fields";
import { unitText } from "@/geo/mapping-fields";

/** One row per model field: pick the source field (samples shown) and its unit. */
export function MappingEditor({
  title,
  fields,
  source,
  bindings,
  onChange,
}: {
  title: string;
  fields: readonly ModelField[];
  source: readonly FieldInfo[];
  bindings: Bindings;
  onChange: (b: Bindings) => void;
}) {
  const set = (key: string, patch: Partial<NonNullable<Bindings[string]>> | null) => {
    if (patch === null) {
      const next = { ...bindings };
      delete next[key];
      onChange(next);
      return;
    }
    const prev = bindings[key] ?? { source: "" };
    onChange({ ...bindings, [key]: { ...prev, ...patch } });
  };
  return (
    <div className="overflow-x-auto">
    <table className="data-table" aria-label={title}>
      <thead>
        <tr>
          <th>Model field</th>
          <th>Source field</th>
          <th>Unit</th>
          <th>Sample values</th>
        </tr>
      </thead>
      <tbody>
        {fields.map((f) => {
          const b = bindings[f.key];
          const info = source.find((s) => s.name === b?.source);
          return (
            <tr key={f.key}>
              <td>
                {f.label}
                {f.required && <span className="text-clay-700"> *</span>}
              </td>
              <td>
                <select
                  aria-label={`Source field for ${f.label}`}
                  className="rounded border border-rule-strong bg-paper-raised px-2 py-1 text-sm"
                  value={b?.source ?? ""}
                  onChange={(e) =>
                    e.target.value
                      ? set(f.key, { source: e.target.value, unit: b?.unit ?? f.units?.[0], kind: b?.kind ?? f.kinds?.[0] })
                      : set(f.key, null)
                  }
                >
                  <option value="">{f.required ? "Choose…" : "(not mapped)"}</option>
                  {source.map((s) => (
                    <option key={s.name} value={s.name}>
                      {s.name}
                    </option>
                  ))}
                </select>
              </td>
              <td>
                {f.units && b?.source && (
                  <select
                    aria-label={`Unit of ${f.label}`}
                    className="rounded border border-rule-strong bg-paper-raised px-2 py-1 text-sm"
                    value={b.unit ?? f.units[0]}
                    onChange={(e) => set(f.key, { unit: e.target.value })}
                  >
                    {f.units.map((u) => (
                      <option key={u} value={u}>
                        {unitText(u)}
                      </option>
                    ))}
                  </select>
                )}
                {f.kinds && b?.source && (
                  <select
                    aria-label={`Kind of ${f.label}`}
                    className="rounded border border-rule-strong bg-paper-raised px-2 py-1 text-sm"
                    value={b.kind ?? f.kinds[0]}
                    onChange={(e) => set(f.key, { kind: e.target.value as "BOD5" | "CBODu" })}
                  >
                    {f.kinds.map((k) => (
                      <option key={k} value={k}>
                        {k === "CBODu" ? "ultimate CBOD" : "BOD5"}
                      </option>
                    ))}
                  </select>
                )}
              </td>
              <td className="min-w-[14rem] text-xs text-ink-faint">
                {info ? `${info.samples.slice(0, 4).join(" · ")}${info.kind === "empty" ? "(empty)" : ""}` : ""}
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
    </div>
  );
}
