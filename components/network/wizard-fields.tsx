"use client";
import { useState } from "react";
import { Controller, useFormContext } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { DISCHARGER_FIELDS, fromMapping, REACH_FIELDS, toMapping } from "@/geo/mapping-fields";
import type { ImportLayer } from "@/lib/domain";
import { useMappingsQuery, useSaveMappingMutation } from "@/lib/queries/networks";
import type { FieldMappingDto } from "@/lib/services/imports";
import type { ImportFormValues } from "@/lib/validation/import-form";
import type { FieldMappingSave } from "@/lib/validation/network";
import { MappingEditor } from "./mapping-editor";
import type { Uploads } from "./wizard-files";

const FIELDS = { reaches: REACH_FIELDS, dischargers: DISCHARGER_FIELDS } as const;
const TITLES = {
  reaches: { heading: "Reach fields", table: "Reach field mapping" },
  dischargers: { heading: "Discharger fields", table: "Discharger field mapping" },
} as const;

/** Step 2: the source field and unit of each model field, per uploaded layer; saved mappings offered and kept. */
export function WizardFields({ basinId, uploads, onFailure }: { basinId: string; uploads: Uploads; onFailure: (e: unknown) => void }) {
  const { control, getValues } = useFormContext<ImportFormValues>();
  const mappings = useMappingsQuery(basinId);
  const saveMapping = useSaveMappingMutation(basinId);
  const [mappingName, setMappingName] = useState("");

  const saveAll = async () => {
    try {
      for (const layer of ["reaches", "dischargers"] as const) {
        if (!uploads[layer]) continue;
        const mapping = toMapping(FIELDS[layer], getValues(`bindings.${layer}`));
        await saveMapping.mutateAsync({ layer, name: mappingName, mapping } as FieldMappingSave);
      }
      setMappingName("");
    } catch (e) {
      onFailure(e);
    }
  };

  return (
    <section className="card space-y-4">
      <h2>2. Fields</h2>
      <p className="text-sm text-ink-soft">Check the suggested source field and unit of each model field. Values are converted to SI on import.</p>
      {(["reaches", "dischargers"] as const).map((layer) => {
        const upload = uploads[layer];
        if (!upload) return null;
        return (
          <Controller
            key={layer}
            control={control}
            name={`bindings.${layer}`}
            render={({ field }) => (
              <div>
                <div className="mb-2 flex flex-wrap items-center gap-3">
                  <h3 className="font-semibold">{TITLES[layer].heading}</h3>
                  <SavedMappingPicker layer={layer} saved={mappings.data ?? []} onPick={(mapping) => field.onChange(fromMapping(FIELDS[layer], mapping))} />
                </div>
                <MappingEditor title={TITLES[layer].table} fields={FIELDS[layer]} source={upload.fields} bindings={field.value} onChange={field.onChange} />
              </div>
            )}
          />
        );
      })}
      <div className="flex flex-wrap items-end gap-3 border-t border-rule pt-4">
        <div>
          <label htmlFor="mapping-name" className="field-label">
            Save these mappings for the next import as
          </label>
          <input id="mapping-name" className="field-input" value={mappingName} onChange={(e) => setMappingName(e.target.value)} />
        </div>
        <Button variant="secondary" disabled={!mappingName.trim() || saveMapping.isPending} onClick={saveAll}>
          Save mappings
        </Button>
      </div>
    </section>
  );
}

function SavedMappingPicker({
  layer,
  saved: all,
  onPick,
}: {
  layer: ImportLayer;
  saved: FieldMappingDto[];
  onPick: (mapping: Record<string, unknown>) => void;
}) {
  const saved = all.filter((m) => m.layer === layer);
  if (saved.length === 0) return null;
  return (
    <select
      aria-label={`Saved ${layer} mappings`}
      className="rounded border border-rule-strong bg-paper-raised px-2 py-1 text-sm"
      value=""
      onChange={(e) => {
        const m = saved.find((x) => x.id === e.target.value);
        if (m) onPick(m.mapping);
      }}
    >
      <option value="">Use a saved mapping…</option>
      {saved.map((m) => (
        <option key={m.id} value={m.id}>
          {m.name}
        </option>
      ))}
    </select>
  );
}
