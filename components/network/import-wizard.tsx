"use client";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { BasinMapLazy } from "@/components/map/basin-map-lazy";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import type { Problem } from "@/geo";
import { networkPreview } from "@/geo/preview";
import type { ImportDto } from "@/lib/services/imports";
import {
  useCommitMutation,
  useMappingsQuery,
  useSaveMappingMutation,
  useUploadMutation,
  type DraftResultDto,
} from "@/lib/queries/networks";
import type { NetworkDraft } from "@/lib/validation/network";
import { MappingEditor } from "./mapping-editor";
import { DISCHARGER_FIELDS, fromMapping, guessBindings, REACH_FIELDS, toMapping, type Bindings } from "@/geo/mapping-fields";
import { ReportView } from "./report-view";
import { UploadBox, type UploadChoice } from "./upload-box";
import { useValidation } from "./use-validation";

type Layer = "reaches" | "dischargers";

/**
 * Upload → map fields → validate → accept and save. Nothing is stored as a
 * network until the planner accepts a report without errors.
 */
export function ImportWizard({ basinId }: { basinId: string }) {
  const router = useRouter();
  const upload = useUploadMutation(basinId);
  const validate = useValidation(basinId);
  const commit = useCommitMutation(basinId);
  const saveMapping = useSaveMappingMutation(basinId);
  const mappings = useMappingsQuery(basinId);

  const [uploads, setUploads] = useState<Partial<Record<Layer, ImportDto>>>({});
  const [bindings, setBindings] = useState<Record<Layer, Bindings>>({ reaches: {}, dischargers: {} });
  const [options, setOptions] = useState({ toleranceM: 5, maxSnapDistanceM: 500, maxReachLengthKm: 10, allowMultipleOutlets: false });
  const [outletReach, setOutletReach] = useState("");
  const [reassign, setReassign] = useState<Record<string, string>>({});
  const [result, setResult] = useState<DraftResultDto | null>(null);
  const [shown, setShown] = useState<Problem | null>(null);
  const [accepted, setAccepted] = useState(false);
  const [note, setNote] = useState("");
  const [failure, setFailure] = useState<string | null>(null);
  const [mappingName, setMappingName] = useState("");

  const fail = (e: unknown) => setFailure(e instanceof Error ? e.message : String(e));

  const onUpload = async (layer: Layer, file: File, choice: UploadChoice) => {
    setFailure(null);
    setResult(null);
    const dto = await upload.mutateAsync({ file, layer, ...choice });
    setUploads((u) => ({ ...u, [layer]: dto }));
    const fields = layer === "reaches" ? REACH_FIELDS : DISCHARGER_FIELDS;
    setBindings((b) => ({ ...b, [layer]: guessBindings(fields, dto.fields) }));
    return dto;
  };

  const draft = (): NetworkDraft | null => {
    if (!uploads.reaches) return null;
    return {
      reachImportId: uploads.reaches.id,
      reachMapping: toMapping(REACH_FIELDS, bindings.reaches) as NetworkDraft["reachMapping"],
      ...(uploads.dischargers
        ? {
            dischargerImportId: uploads.dischargers.id,
            dischargerMapping: toMapping(DISCHARGER_FIELDS, bindings.dischargers) as NetworkDraft["dischargerMapping"],
          }
        : {}),
      options: {
        ...options,
        ...(outletReach ? { outlets: [{ reachId: outletReach }] } : {}),
        ...(Object.keys(reassign).length ? { reassign } : {}),
      },
    };
  };

  const runValidation = async () => {
    const d = draft();
    if (!d) return;
    setFailure(null);
    setShown(null);
    setAccepted(false);
    try {
      setResult(await validate.run(d));
    } catch (e) {
      setResult(null);
      fail(e);
    }
  };

  const save = async () => {
    const d = draft();
    if (!d) return;
    setFailure(null);
    try {
      const saved = await commit.mutateAsync({ draft: d, note, acceptReport: true });
      router.push(`/basins/${basinId}/network?saved=${saved.version}`);
      router.refresh();
    } catch (e) {
      fail(e);
    }
  };

  const preview = useMemo(() => (result ? networkPreview(result.report.network) : null), [result]);
  const reachIds = result?.report.network.reaches.map((r) => r.id).sort() ?? [];

  const mappingPicker = (layer: Layer) => {
    const saved = (mappings.data ?? []).filter((m) => m.layer === layer);
    if (saved.length === 0) return null;
    const fields = layer === "reaches" ? REACH_FIELDS : DISCHARGER_FIELDS;
    return (
      <select
        aria-label={`Saved ${layer} mappings`}
        className="rounded border border-rule-strong bg-paper-raised px-2 py-1 text-sm"
        value=""
        onChange={(e) => {
          const m = saved.find((x) => x.id === e.target.value);
          if (m) setBindings((b) => ({ ...b, [layer]: fromMapping(fields, m.mapping) }));
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
  };

  return (
    <div className="space-y-6">
      {failure && <Notice tone="error" title="That did not work">{failure}</Notice>}

      <section className="card">
        <h2 className="mb-1">1. Files</h2>
        <p className="mb-4 text-sm text-ink-soft">
          Reach lines as a zipped shapefile (.shp, .shx, .dbf and .prj) or GeoJSON; discharger locations as a shapefile,
          GeoJSON or CSV with latitude/longitude or X/Y columns. Every upload is kept with its checksum so plans can be traced to
          their inputs.
        </p>
        <div className="grid gap-4 md:grid-cols-2">
          <UploadBox label="Reach lines" accept=".zip,.geojson,.json" uploaded={uploads.reaches} onUpload={(f, choice) => onUpload("reaches", f, choice)} />
          <UploadBox
            label="Dischargers (optional)"
            accept=".zip,.geojson,.json,.csv,.txt"
            uploaded={uploads.dischargers}
            points
            onUpload={(f, choice) => onUpload("dischargers", f, choice)}
          />
        </div>
      </section>

      {uploads.reaches && (
        <section className="card space-y-4">
          <h2>2. Fields</h2>
          <p className="text-sm text-ink-soft">Check the suggested source field and unit of each model field. Values are converted to SI on import.</p>
          {(["reaches", "dischargers"] as const).map((layer) =>
            uploads[layer] ? (
              <div key={layer}>
                <div className="mb-2 flex flex-wrap items-center gap-3">
                  <h3 className="font-semibold">{layer === "reaches" ? "Reach fields" : "Discharger fields"}</h3>
                  {mappingPicker(layer)}
                </div>
                <MappingEditor
                  title={layer === "reaches" ? "Reach field mapping" : "Discharger field mapping"}
                  fields={layer === "reaches" ? REACH_FIELDS : DISCHARGER_FIELDS}
                  source={uploads[layer]!.fields}
                  bindings={bindings[layer]}
                  onChange={(b) => setBindings((all) => ({ ...all, [layer]: b }))}
                />
              </div>
            ) : null,
          )}
          <div className="flex flex-wrap items-end gap-3 border-t border-rule pt-4">
            <div>
              <label htmlFor="mapping-name" className="field-label">
                Save these mappings for the next import as
              </label>
              <input id="mapping-name" className="field-input" value={mappingName} onChange={(e) => setMappingName(e.target.value)} />
            </div>
            <Button
              variant="secondary"
              disabled={!mappingName.trim() || saveMapping.isPending}
              onClick={async () => {
                try {
                  await saveMapping.mutateAsync({ layer: "reaches", name: mappingName, mapping: toMapping(REACH_FIELDS, bindings.reaches) as never });
                  if (uploads.dischargers) {
                    await saveMapping.mutateAsync({
                      layer: "dischargers",
                      name: mappingName,
                      mapping: toMapping(DISCHARGER_FIELDS, bindings.dischargers) as never,
                    });
                  }
                  setMappingName("");
                } catch (e) {
                  fail(e);
                }
              }}
            >
              Save mappings
            </Button>
          </div>
        </section>
      )}

      {uploads.reaches && (
        <section className="card space-y-4">
          <h2>3. Check the network</h2>
          <div className="grid gap-4 sm:grid-cols-4">
            <NumberOption label="Join line ends within (m)" value={options.toleranceM} onChange={(v) => setOptions((o) => ({ ...o, toleranceM: v }))} />
            <NumberOption
              label="Snap dischargers within (m)"
              value={options.maxSnapDistanceM}
              onChange={(v) => setOptions((o) => ({ ...o, maxSnapDistanceM: v }))}
            />
            <NumberOption
              label="Flag reaches longer than (km)"
              value={options.maxReachLengthKm}
              onChange={(v) => setOptions((o) => ({ ...o, maxReachLengthKm: v }))}
            />
            <div>
              <label htmlFor="outlet" className="field-label">
                Outlet
              </label>
              <select id="outlet" className="field-input" value={outletReach} onChange={(e) => setOutletReach(e.target.value)}>
                <option value="">Suggested</option>
                {reachIds.map((id) => (
                  <option key={id} value={id}>
                    downstream end of {id}
                  </option>
                ))}
              </select>
            </div>
          </div>
          <label className="flex items-center gap-2 text-sm">
            <input
              type="checkbox"
              checked={options.allowMultipleOutlets}
              onChange={(e) => setOptions((o) => ({ ...o, allowMultipleOutlets: e.target.checked }))}
            />
            The basin has several separate outlets (treat separate parts as independent trees)
          </label>
          <Button onClick={runValidation} disabled={validate.pending}>
            {validate.pending ? "Checking…" : result ? "Check again" : "Check the network"}
          </Button>
          {validate.progress && (
            <div role="status" aria-live="polite" data-testid="validation-progress" className="max-w-md text-sm text-ink-soft">
              <div className="mb-1">
                Checking: {validate.progress.stage} ({validate.progress.percent} %)
              </div>
              <progress className="w-full" max={100} value={validate.progress.percent} aria-label="Validation progress" />
            </div>
          )}
          {result && preview && (
            <div className="grid gap-4 lg:grid-cols-[3fr_2fr]">
              <BasinMapLazy data={preview} highlight={shown?.geometry ? [shown.geometry] : []} height={520} />
              <div className="max-h-[520px] overflow-y-auto">
                <ReportView report={result.report} shown={shown} onShow={setShown} />
              </div>
            </div>
          )}
          {result && result.report.network.dischargers.length > 0 && (
            <div className="overflow-x-auto">
            <table className="data-table" data-testid="snapped-dischargers">
              <thead>
                <tr>
                  <th>Discharger</th>
                  <th>Permit id</th>
                  <th>Facility</th>
                  <th className="num">Snapped (m)</th>
                  <th>Reach</th>
                  <th className="num">From reach head (km)</th>
                </tr>
              </thead>
              <tbody>
                {result.report.network.dischargers.map((d) => (
                  <tr key={d.id}>
                    <td>{d.attributes.name}</td>
                    <td className="font-mono text-xs">{d.id}</td>
                    <td>{result.knownPermits.includes(d.id) ? "existing facility" : "new facility"}</td>
                    <td className="num">{d.snapDistanceM === undefined ? "—" : d.snapDistanceM.toFixed(0)}</td>
                    <td>
                      <select
                        aria-label={`Reach of ${d.attributes.name}`}
                        className="rounded border border-rule-strong bg-paper-raised px-2 py-1 text-sm"
                        value={reassign[d.id] ?? d.reachId ?? ""}
                        onChange={(e) =>
                          setReassign((r) => {
                            const next = { ...r };
                            if (e.target.value && e.target.value !== d.reachId) next[d.id] = e.target.value;
                            else delete next[d.id];
                            return next;
                          })
                        }
                      >
                        {!d.reachId && <option value="">(not placed)</option>}
                        {reachIds.map((id) => (
                          <option key={id} value={id}>
                            {id}
                            {id === d.reachId && d.assignment === "nearest" ? " (nearest)" : ""}
                          </option>
                        ))}
                      </select>
                    </td>
                    <td className="num">{d.chainageKm === undefined ? "—" : d.chainageKm.toFixed(3)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            </div>
          )}
          {Object.keys(reassign).length > 0 && <p className="text-sm text-ochre-700">Reassignments take effect when you check again.</p>}
        </section>
      )}

      {result && (
        <section className="card space-y-3">
          <h2>4. Save as a new network version</h2>
          {result.report.errors.length > 0 ? (
            <Notice tone="error">Fix the {result.report.errors.length} error(s) above (in the files, the fields or the options), then check again.</Notice>
          ) : (
            <>
              <div>
                <label htmlFor="network-note" className="field-label">
                  Note for this version (optional)
                </label>
                <input id="network-note" className="field-input" value={note} onChange={(e) => setNote(e.target.value)} maxLength={500} />
              </div>
              <label className="flex items-center gap-2 text-sm">
                <input type="checkbox" checked={accepted} onChange={(e) => setAccepted(e.target.checked)} />
                I have read the report{result.report.warnings.length ? ` and accept its ${result.report.warnings.length} warning(s)` : ""}
              </label>
              <Button disabled={!accepted || commit.isPending} onClick={save}>
                {commit.isPending ? "Saving…" : "Save network"}
              </Button>
            </>
          )}
        </section>
      )}
    </div>
  );
}

function NumberOption({ label, value, onChange }: { label: string; value: number; onChange: (v: number) => void }) {
  const id = label.replace(/\W+/g, "-").replace(/^-|-$/g, "").toLowerCase();
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <input
        id={id}
        type="number"
        min={0}
        step="any"
        className="field-input"
        value={Number.isFinite(value) ? value : ""}
        onChange={(e) => onChange(e.target.valueAsNumber)}
      />
    </div>
  );
}
