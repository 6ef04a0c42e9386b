/**
 * Regular latitude/longitude grids of the ITU-R digital maps and the interpolation the
 * Recommendations prescribe for them: bilinear between the four surrounding grid points
 * (Rec. ITU-R P.1144-12 Annex 1 §1b, as P.453-14, P.836-6, P.837-7, P.839-4, P.840-9 and
 * P.1510-1 call for) and bicubic (P.1144-12 Annex 1 §1c, the cubic convolution kernel with
 * a = -0.5; used by P.836-6 Annex 2 for the topography of its grid points; from memory).
 *
 * Grid: row i is latitude latFirstDeg + i latStepDeg (the step is negative where the grid
 * runs north to south), column j is longitude lonFirstDeg + j lonStepDeg. Longitudes are
 * wrapped into the grid's own range. A value is `raw[k] * scale` (scale 1 for float32 grids,
 * 1e-3 for the millesimal uint16 grids). NaN marks a cell the map has no value for.
 * Units: degrees in; the map's unit out.
 */

import { ModelRangeError } from '../../errors.js';

export interface MapGrid {
  /** What the map is, e.g. "ITU-R P.839-4 h0 map". */
  readonly label: string;
  readonly rows: number;
  readonly cols: number;
  readonly latFirstDeg: number;
  readonly latStepDeg: number;
  readonly lonFirstDeg: number;
  readonly lonStepDeg: number;
  readonly raw: Float32Array | Uint16Array;
  readonly scale: number;
}

/** Value of grid point (i, j); the column wraps around the globe. */
export function nodeValue(g: MapGrid, i: number, j: number): number {
  const period = Math.round(360 / Math.abs(g.lonStepDeg));
  const jj = ((j % period) + period) % period; // a last column that repeats the first is never needed
  const ii = Math.min(g.rows - 1, Math.max(0, i));
  return (g.raw[ii * g.cols + jj] as number) * g.scale;
}

/** Fractional row and column of a point; ModelRangeError when the latitude is off the grid. */
export function gridPosition(g: MapGrid, latDeg: number, lonDeg: number): { fi: number; fj: number } {
  const fi = (latDeg - g.latFirstDeg) / g.latStepDeg;
  if (!(fi >= -1e-9 && fi <= g.rows - 1 + 1e-9)) {
    const a = g.latFirstDeg;
    const b = g.latFirstDeg + (g.rows - 1) * g.latStepDeg;
    throw new ModelRangeError(g.label, 'latitudeDeg', latDeg, `${Math.min(a, b)}..${Math.max(a, b)} deg`);
  }
  if (!Number.isFinite(lonDeg)) throw new ModelRangeError(g.label, 'longitudeDeg', lonDeg, 'a finite longitude');
  let lon = lonDeg;
  lon = g.lonFirstDeg + ((((lon - g.lonFirstDeg) % 360) + 360) % 360);
  return { fi: Math.min(g.rows - 1, Math.max(0, fi)), fj: (lon - g.lonFirstDeg) / g.lonStepDeg };
}

/** The four grid points around a point and the bilinear weights' fractions. */
export interface Corners {
  i: number;
  j: number;
  /** Fraction of the way from row i to row i + 1, and from column j to j + 1. */
  di: number;
  dj: number;
}

export function cornersOf(g: MapGrid, latDeg: number, lonDeg: number): Corners {
  const { fi, fj } = gridPosition(g, latDeg, lonDeg);
  const i = Math.min(g.rows - 2, Math.floor(fi));
  const j = Math.floor(fj);
  return { i, j, di: fi - i, dj: fj - j };
}

/** Latitude and longitude of grid point (i, j), degrees. */
export function nodeLatDeg(g: MapGrid, i: number): number {
  return g.latFirstDeg + i * g.latStepDeg;
}
export function nodeLonDeg(g: MapGrid, j: number): number {
  return g.lonFirstDeg + j * g.lonStepDeg;
}

/**
 * Bilinear interpolation of f(i, j) over the four grid points around the point
 * (P.1144-12 Annex 1 §1b). f defaults to the grid's own values.
 */
export function bilinearOf(c: Corners, f: (i: number, j: number) => number): number {
  const { i, j, di, dj } = c;
  return (
    f(i, j) * (1 - di) * (1 - dj) +
    f(i + 1, j) * di * (1 - dj) +
    f(i, j + 1) * (1 - di) * dj +
    f(i + 1, j + 1) * di * dj
  );
}

export function bilinear(g: MapGrid, latDeg: number, lonDeg: number): number {
  return bilinearOf(cornersOf(g, latDeg, lonDeg), (i, j) => nodeValue(g, i, j));
}

/** Cubic convolution kernel, a = -0.5 (P.1144-12 Annex 1 §1c). */
function cubicKernel(x: number): number {
  const t = Math.abs(x);
  if (t <= 1) return 1.5 * t * t * t - 2.5 * t * t + 1;
  if (t < 2) return -0.5 * t * t * t + 2.5 * t * t - 4 * t + 2;
  return 0;
}

/** Bicubic interpolation over the 4 x 4 grid points around the point (P.1144-12 Annex 1 §1c). */
export function bicubic(g: MapGrid, latDeg: number, lonDeg: number): number {
  const { fi, fj } = gridPosition(g, latDeg, lonDeg);
  const i = Math.floor(fi);
  const j = Math.floor(fj);
  let sum = 0;
  for (let ii = i - 1; ii <= i + 2; ii++) {
    const wi = cubicKernel(fi - ii);
    if (wi === 0) continue;
    for (let jj = j - 1; jj <= j + 2; jj++) {
      const wj = cubicKernel(fj - jj);
      if (wj === 0) continue;
      sum += nodeValue(g, ii, jj) * wi * wj;
    }
  }
  return sum;
}
