import type { ReactNode } from "react";
import { MAP_COLOURS } from "./map-style";

/** One entry of a map's key: a small drawing of the mark, then what it means. */
export function LegendItem({ swatch, children }: { swatch: ReactNode; children: ReactNode }) {
  return (
    <li className="flex items-center gap-2">
      <span aria-hidden className="inline-flex w-8 shrink-0 items-center justify-center">
        {swatch}
      </span>
      <span>{children}</span>
    </li>
  );
}

/** A line swatch as the map draws it; `halo` adds the selection's wide violet band beneath. */
export function LineSwatch({ colour, halo = false, width = 3 }: { colour: string; halo?: boolean; width?: number }) {
  return (
    <svg width="32" height="14" viewBox="0 0 32 14">
      {halo && <line x1="4" y1="7" x2="28" y2="7" stroke={MAP_COLOURS.selection} strokeOpacity={0.6} strokeWidth={12} strokeLinecap="round" />}
      <line x1="4" y1="7" x2="28" y2="7" stroke={colour} strokeWidth={width} strokeLinecap="round" />
    </svg>
  );
}

/** A dot swatch: fill, ring colour and radius as the map draws them. */
export function DotSwatch({ fill, ring = "#ffffff", r = 5, ringWidth = 1.5 }: { fill: string; ring?: string; r?: number; ringWidth?: number }) {
  const size = 2 * (r + ringWidth) + 2;
  return (
    <svg width={size} height={size} viewBox={`0 0 ${size} ${size}`}>
      <circle cx={size / 2} cy={size / 2} r={r} fill={fill} stroke={ring} strokeWidth={ringWidth} />
    </svg>
  );
}

/**
 * Key to the basin map (network, import preview and review pages): an entry for each kind
 * of mark the map has (`shown`: feature kinds, node kinds for nodes).
 */
export function BasinLegend({ shown, problems = false }: { shown: ReadonlySet<string>; problems?: boolean }) {
  return (
    <figure className="text-xs text-ink-soft" data-testid="map-legend">
      <figcaption className="sr-only">Map key</figcaption>
      <ul className="flex flex-wrap gap-x-5 gap-y-1">
        <LegendItem swatch={<LineSwatch colour={MAP_COLOURS.reach} />}>reach (chevrons point downstream), labelled with its id</LegendItem>
        {shown.has("outfall") && (
          <LegendItem swatch={<DotSwatch fill={MAP_COLOURS.outfall} ring="#ffffff" r={5} ringWidth={2} />}>outfall, labelled with the facility</LegendItem>
        )}
        {shown.has("outlet") && <LegendItem swatch={<DotSwatch fill={MAP_COLOURS.outlet} r={6} />}>basin outlet</LegendItem>}
        {shown.has("headwater") && <LegendItem swatch={<DotSwatch fill={MAP_COLOURS.headwater} r={3.5} />}>headwater</LegendItem>}
        {(shown.has("junction") || shown.has("confluence")) && <LegendItem swatch={<DotSwatch fill={MAP_COLOURS.node} r={3.5} />}>confluence or junction</LegendItem>}
        <LegendItem swatch={<LineSwatch colour={MAP_COLOURS.reach} halo />}>selected</LegendItem>
        {problems && <LegendItem swatch={<LineSwatch colour={MAP_COLOURS.problem} width={8} />}>problem to look at</LegendItem>}
      </ul>
    </figure>
  );
}
