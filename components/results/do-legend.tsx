import { DotSwatch, LegendItem, LineSwatch } from "@/components/map/map-legend";
import { MAP_COLOURS } from "@/components/map/map-style";
import { DO_BAND_COLOURS, doLegend, type DoScaleOptions } from "@/lib/results/do-scale";

/** Key to the DO map: the bands relative to the criterion, then the point marks, the outlet and the selection. */
export function DoLegend({ criterionMgL, scale }: { criterionMgL: number; scale?: DoScaleOptions }) {
  return (
    <figure className="text-sm" data-testid="do-legend">
      <figcaption className="mb-1 font-semibold text-ink-soft">Dissolved oxygen</figcaption>
      <ul className="space-y-1">
        {doLegend(criterionMgL, scale).map((s) => (
          <li key={s.band} className="flex items-center gap-2">
            <span aria-hidden className="inline-flex w-8 shrink-0 items-center justify-center">
              <span
                className="inline-block h-2 w-8 rounded-full"
                style={
                  s.band === "anoxic"
                    ? { background: `repeating-linear-gradient(90deg, ${s.colour} 0 6px, #f7f6f1 6px 8px)`, outline: `2px solid ${s.colour}` }
                    : { background: s.colour }
                }
              />
            </span>
            <span>{s.label}</span>
          </li>
        ))}
        <LegendItem swatch={<DotSwatch fill="none" ring="#43535e" r={6} ringWidth={3} />}>
          critical point: a reach&apos;s sag below the criterion (larger ring), or the lowest DO in the network
        </LegendItem>
        <LegendItem swatch={<DotSwatch fill="#ffffff" ring="#1d2a33" r={4} />}>discharger outfall, labelled with the facility or its permit id</LegendItem>
        <LegendItem swatch={<DotSwatch fill={MAP_COLOURS.outlet} r={6} ringWidth={2} />}>basin outlet</LegendItem>
        <LegendItem swatch={<LineSwatch colour={DO_BAND_COLOURS.ample} halo width={5} />}>selected reach (the profile follows it)</LegendItem>
      </ul>
      <p className="mt-2 text-xs text-ink-faint">Reach ids label the lines; zoom in for their names.</p>
    </figure>
  );
}
