"use client";
import { formatTime } from "@/lib/format/zoned-time";
import { useBasinZone } from "@/components/layout/basin-zone";
import Link from "next/link";
import { useMemo, useState } from "react";
import { BasinMapLazy } from "@/components/map/basin-map-lazy";
import { CsvButton, downloadCsv, SortableTable } from "@/components/tables/sortable-table";
import { Notice } from "@/components/ui/notice";
import type { UnitSystem } from "@/lib/domain";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import { ApiError } from "@/lib/queries/fetcher";
import { useEditMutation, useNetworkQuery, useNetworksQuery } from "@/lib/queries/networks";
import { outfallColumns, reachColumns } from "./network-columns";

export function NetworkView({
  basinId,
  basinSlug,
  unitSystem,
  canImport,
  savedVersion,
}: {
  basinId: string;
  basinSlug: string;
  unitSystem: UnitSystem;
  canImport: boolean;
  /** The version the import wizard has just saved, confirmed at the top. */
  savedVersion?: number;
}) {
  const versions = useNetworksQuery(basinId);
  const zone = useBasinZone();
  const [networkId, setNetworkId] = useState("latest");
  const network = useNetworkQuery(basinId, networkId, (versions.data?.length ?? 0) > 0);
  const [selected, setSelected] = useState<string | null>(null);
  const edit = useEditMutation(basinId);
  const current = network.data && versions.data && network.data.id === versions.data[0]?.id ? network.data.id : null;
  const editable = canImport && current !== null;
  const reaches = useMemo(() => {
    if (!editable) return reachColumns(unitSystem);
    return reachColumns(unitSystem, (rowId, field, value) => saveEdit(edit.mutateAsync, current!, "reaches", rowId, field, value));
  }, [unitSystem, editable, current, edit.mutateAsync]);
  const outfalls = useMemo(() => {
    if (!editable) return outfallColumns(unitSystem);
    return outfallColumns(unitSystem, (rowId, field, value) => saveEdit(edit.mutateAsync, current!, "outfalls", rowId, field, value));
  }, [unitSystem, editable, current, edit.mutateAsync]);

  if (versions.isPending) return <p className="text-ink-faint">Loading the network…</p>;
  if (versions.error) return <Notice tone="error">{versions.error.message}</Notice>;
  if (versions.data.length === 0) {
    return (
      <div className="card">
        <h2 className="mb-2">No network yet</h2>
        <p className="mb-4 text-ink-soft">
          Import the reach lines (zipped shapefile or GeoJSON) and the discharger locations (shapefile, GeoJSON or CSV).
        </p>
        {canImport && (
          <Link href={`/basins/${basinId}/network/import`} className="font-semibold">
            Import a network →
          </Link>
        )}
      </div>
    );
  }
  const n = network.data;
  const stem = `${basinSlug}-network-v${n?.version ?? ""}`;
  const saved = savedVersion === undefined ? undefined : versions.data.find((v) => v.version === savedVersion);
  return (
    <div className="space-y-6">
      {saved && (
        <Notice tone="success" title={`Network version ${saved.version} is saved`}>
          <span data-testid="network-saved">
            {saved.reachCount} reaches and {saved.outfallCount} outfalls, {saved.totalLengthKm.toFixed(2)} km in all. New scenarios and runs use
            it; runs and plans made before keep the version they used.
          </span>
        </Notice>
      )}
      <div className="flex flex-wrap items-end gap-4">
        <div>
          <label htmlFor="network-version" className="field-label">
            Network version
          </label>
          <select
            id="network-version"
            className="field-input w-auto"
            value={networkId}
            onChange={(e) => {
              setSelected(null);
              setNetworkId(e.target.value);
            }}
          >
            <option value="latest">Latest (v{versions.data[0].version})</option>
            {versions.data.map((v) => (
              <option key={v.id} value={v.id}>
                v{v.version} — {formatTime(new Date(v.createdAt), zone)}
                {v.createdBy ? ` by ${v.createdBy}` : ""}
              </option>
            ))}
          </select>
        </div>
        {canImport && (
          <Link
            href={`/basins/${basinId}/network/import`}
            className="ml-auto rounded-md bg-tarn-600 px-4 py-2 text-sm font-medium text-white no-underline hover:bg-tarn-700 hover:no-underline"
          >
            Import a new version
          </Link>
        )}
      </div>
      {network.error && <Notice tone="error">{network.error.message}</Notice>}
      {n && (
        <>
          <dl className="grid grid-cols-2 gap-4 sm:grid-cols-4" data-testid="network-summary">
            <Stat label="Version" value={`v${n.version}`} />
            <Stat label="Reaches" value={String(n.reachCount)} />
            <Stat label={`Total length (${unitLabel("length", unitSystem)})`} value={formatIn("length", n.totalLengthKm, unitSystem)} />
            <Stat label="Outfalls" value={String(n.outfallCount)} />
          </dl>
          {n.note && <p className="text-sm text-ink-soft">{n.note}</p>}
          {n.warnings.length > 0 && (
            <Notice tone="warning" title={`${n.warnings.length} warning(s) accepted when this version was saved`}>
              <ul className="list-disc pl-5">
                {n.warnings.map((w, i) => (
                  <li key={i}>{w.message}</li>
                ))}
              </ul>
            </Notice>
          )}
          <BasinMapLazy
            data={n.geojson}
            selectedId={selected}
            onSelect={(s) => setSelected(`${s.kind}:${s.id}`)}
          />
          {editable && (
            <p className="text-sm text-ink-soft">
              Click a value in the tables to correct it in this version; every change is recorded. Earlier versions are
              read-only.
            </p>
          )}
          <section className="card">
            <div className="mb-3 flex items-center justify-between">
              <h2>Reaches</h2>
              <CsvButton onClick={() => downloadCsv(`${stem}-reaches.csv`, n.reaches, reaches.csv, [`${basinSlug} network v${n.version}`])} />
            </div>
            <SortableTable
              rows={n.reaches}
              columns={reaches.columns}
              rowId={(r) => `reach:${r.id}`}
              selectedId={selected}
              onRowClick={(r) => setSelected(`reach:${r.id}`)}
              testId="reach-table"
              initialSort={[{ id: "id", desc: false }]}
            />
          </section>
          <section className="card">
            <div className="mb-3 flex items-center justify-between">
              <h2>Dischargers</h2>
              <CsvButton
                onClick={() => downloadCsv(`${stem}-dischargers.csv`, n.outfalls, outfalls.csv, [`${basinSlug} network v${n.version}`])}
              />
            </div>
            <SortableTable
              rows={n.outfalls}
              columns={outfalls.columns}
              rowId={(o) => `outfall:${o.permitId}`}
              selectedId={selected}
              onRowClick={(o) => setSelected(`outfall:${o.permitId}`)}
              testId="outfall-table"
            />
          </section>
        </>
      )}
    </div>
  );
}

async function saveEdit(
  mutate: (v: { networkId: string; table: "reaches" | "outfalls"; rowId: string; patch: Record<string, unknown> }) => Promise<unknown>,
  networkId: string,
  table: "reaches" | "outfalls",
  rowId: string,
  field: string,
  value: unknown,
): Promise<string | null> {
  try {
    await mutate({ networkId, table, rowId, patch: { [field]: value } });
    return null;
  } catch (e) {
    return e instanceof ApiError ? (e.details?.[0]?.message ?? e.message) : String(e);
  }
}

function Stat({ label, value }: { label: string; value: string }) {
  return (
    <div className="card py-3">
      <dt className="text-xs text-ink-faint">{label}</dt>
      <dd className="text-xl font-semibold tabular-nums">{value}</dd>
    </div>
  );
}
