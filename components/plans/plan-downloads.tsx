/**
 * Plain download links for a plan: the PDF report, the allocation table (CSV) and three
 * GeoJSON layers — reaches with results, the DO pieces the map is coloured by, and the
 * dischargers with their allocations (docs/exports.md). Each content has one file name.
 */
export function PlanDownloads({ basinId, planId, published }: { basinId: string; planId: string; published: boolean }) {
  const base = `/api/basins/${basinId}/plans/${planId}`;
  const links = [
    { href: `${base}/report`, label: "Report (PDF)" },
    { href: `${base}/csv`, label: "Allocations (CSV)" },
    { href: `${base}/geojson`, label: "Reaches with results (GeoJSON)" },
    { href: `${base}/geojson?layer=dischargers`, label: "Dischargers with allocations (GeoJSON)" },
    { href: `${base}/geojson?layer=pieces`, label: "DO along each reach, in pieces (GeoJSON)" },
  ];
  return (
    <section className="card space-y-2" aria-labelledby="plan-downloads" data-testid="plan-downloads">
      <h2 id="plan-downloads">Downloads</h2>
      <div className="flex flex-wrap gap-3">
        {links.map((l) => (
          <a key={l.href} className="rounded-md border border-rule-strong px-3 py-1.5 text-sm" href={l.href} download>
            {l.label}
          </a>
        ))}
      </div>
      <p className="text-xs text-ink-faint">
        Every download carries the planning caution.
        {published ? "" : " This plan is not published: files are marked as a draft, and each download is recorded in the basin's audit trail."}
      </p>
    </section>
  );
}
