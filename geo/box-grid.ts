import type { LngLat } from "./types";

const CELL_DEGREES = 0.01;
/** Lines whose box would cover more cells than this are kept in one list and always checked. */
const MAX_CELLS_PER_LINE = 4096;

type Box = [number, number, number, number];

/**
 * A bucket grid over line bounding boxes (each grown by a margin), answering "which lines may
 * pass within the margin of this point". Cells are 0.01° (about 1 km) square.
 */
export class BoxGrid {
  private readonly cells = new Map<string, number[]>();
  private readonly wide: number[] = [];
  private readonly boxes: Box[];

  constructor(lines: ReadonlyArray<readonly LngLat[]>, marginDegrees: number) {
    this.boxes = lines.map((coords) => {
      let [minLon, minLat, maxLon, maxLat] = [Infinity, Infinity, -Infinity, -Infinity];
      for (const [lon, lat] of coords) {
        minLon = Math.min(minLon, lon);
        maxLon = Math.max(maxLon, lon);
        minLat = Math.min(minLat, lat);
        maxLat = Math.max(maxLat, lat);
      }
      const lonMargin = marginDegrees / Math.max(Math.cos((Math.max(Math.abs(minLat), Math.abs(maxLat)) * Math.PI) / 180), 1e-3);
      return [minLon - lonMargin, minLat - marginDegrees, maxLon + lonMargin, maxLat + marginDegrees];
    });
    this.boxes.forEach(([x0, y0, x1, y1], i) => {
      const [cx0, cy0, cx1, cy1] = [this.cell(x0), this.cell(y0), this.cell(x1), this.cell(y1)];
      if ((cx1 - cx0 + 1) * (cy1 - cy0 + 1) > MAX_CELLS_PER_LINE) {
        this.wide.push(i);
        return;
      }
      for (let x = cx0; x <= cx1; x++) {
        for (let y = cy0; y <= cy1; y++) {
          const key = `${x},${y}`;
          const bucket = this.cells.get(key);
          if (bucket) bucket.push(i);
          else this.cells.set(key, [i]);
        }
      }
    });
  }

  private cell = (deg: number) => Math.floor(deg / CELL_DEGREES);

  /** Indexes of lines whose grown box contains `p`. */
  near(p: LngLat): number[] {
    const bucket = this.cells.get(`${this.cell(p[0])},${this.cell(p[1])}`) ?? [];
    return [...bucket, ...this.wide].filter((i) => {
      const [x0, y0, x1, y1] = this.boxes[i];
      return p[0] >= x0 && p[0] <= x1 && p[1] >= y0 && p[1] <= y1;
    });
  }
}
