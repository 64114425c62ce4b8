import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import proj4 from "proj4";

let loadedFrom: string | undefined | null = null;
const names: string[] = [];

/**
 * Loads the NTv2 shift grids (*.gsb) of `dir` into proj4js, once per folder, so that datums
 * whose definition names a grid (DHDN's BETA2007.gsb, NTF's ntf_r93.gsb, NAD27's NTv2_0.gsb …)
 * are shifted by it instead of being refused. The folder is SAGLINE_DATUM_GRID_DIR; Debian's
 * proj-data package puts the grids it ships in /usr/share/proj. No folder, no grids: a datum
 * that needs one is then refused by name or, for NAD27, shifted by EPSG's published parameters.
 * Returns the names of the grids loaded.
 */
export function loadDatumGrids(dir: string | undefined = process.env.SAGLINE_DATUM_GRID_DIR): readonly string[] {
  if (loadedFrom === dir || !dir) return names;
  loadedFrom = dir;
  let files: string[];
  try {
    files = readdirSync(dir).filter((f) => /\.gsb$/i.test(f));
  } catch {
    return names;
  }
  for (const file of files) {
    const bytes = readFileSync(join(dir, file));
    // proj4js keeps grids by the name a definition's +nadgrids gives, i.e. the file name.
    proj4.nadgrid(file, bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
    if (!names.includes(file)) names.push(file);
  }
  return names;
}
