import type { FontFacesSpecification, StyleSpecification } from "maplibre-gl";

/** Colours of the basin map (Sagline's palette; see tailwind.config.ts). */
export const MAP_COLOURS = {
  background: "#eef0ea",
  reach: "#2f6f73",
  node: "#7fb1ae",
  headwater: "#7b8f4a",
  outlet: "#245659",
  outfall: "#c08a2e",
  problem: "#b5523b",
  /** The selected reach or outfall: a wide violet halo, a colour no layer or DO band uses. */
  selection: "#8b5cf6",
  label: "#1d2a33",
  labelHalo: "#ffffff",
} as const;

/** Width of the selection halo, px (drawn under the line it marks). */
export const SELECTION_HALO_PX = 14;

/** The font stack every Sagline label names; `font-faces` maps it to the app's own font. */
export const LABEL_FONT = ["Sagline Sans"];

/**
 * The app's own font file (shipped in app/fonts, emitted by the bundler beside the
 * pages). MapLibre draws label glyphs from it in the browser (its `font-faces`
 * root property), so no glyph server or PBF ranges are fetched from anywhere.
 */
export function labelFontFaces(): FontFacesSpecification {
  return { [LABEL_FONT[0]]: new URL("../../app/fonts/SourceSans3-Variable.woff2", import.meta.url).href };
}

/**
 * The map's base: a plain background and nothing fetched from outside, unless
 * NEXT_PUBLIC_SAGLINE_BASEMAP_STYLE names a style URL to draw under the basin
 * (the basin's layers and labels are added on top of either; see useBaseMap).
 */
export function baseStyle(): StyleSpecification | string {
  const url = process.env.NEXT_PUBLIC_SAGLINE_BASEMAP_STYLE;
  if (url) return url;
  return {
    version: 8,
    sources: {},
    "font-faces": labelFontFaces(),
    layers: [{ id: "background", type: "background", paint: { "background-color": MAP_COLOURS.background } }],
  };
}

/** A small chevron pointing along a line, drawn in code so no sprite is fetched. */
export function arrowImage(size = 14, colour: string = MAP_COLOURS.reach): { width: number; height: number; data: Uint8Array } {
  const canvas = document.createElement("canvas");
  canvas.width = size;
  canvas.height = size;
  const ctx = canvas.getContext("2d")!;
  ctx.strokeStyle = colour;
  ctx.lineWidth = 2.2;
  ctx.lineCap = "round";
  ctx.lineJoin = "round";
  ctx.beginPath();
  ctx.moveTo(size * 0.3, size * 0.2);
  ctx.lineTo(size * 0.72, size * 0.5);
  ctx.lineTo(size * 0.3, size * 0.8);
  ctx.stroke();
  const { data } = ctx.getImageData(0, 0, size, size);
  return { width: size, height: size, data: new Uint8Array(data.buffer) };
}
