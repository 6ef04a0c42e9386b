/**
 * Surface water vapour density (and, by the same procedure, total columnar content) at a
 * station: Rec. ITU-R P.836-6 (12/2017), Annex 2.
 *   a) the tabulated exceedances p_below <= p <= p_above around the required p;
 *   b) at each of the four grid points around the station (1.125° grid), the map value
 *      X_i(p) and the scale height VSCH_i(p) for both exceedances;
 *   c) the altitude alt_i of each grid point from the P.836-6 topography (0.5°), bicubic
 *      (Rec. ITU-R P.1144-12);
 *   d) X_i'(p) = X_i(p) exp(-(alt - alt_i) / VSCH_i(p)), alt the station height (km);
 *   e) bilinear interpolation of the four X_i' at the station;
 *   f) linear interpolation in ln p between p_below and p_above.
 * (Procedure from memory; it reproduces the ITU-R SG3 validation workbook Rev 8.3.0 sheet
 * P.836-6 WV to 4e-8, test/link/climate/p836-6.test.ts.) A cell without a value (the maps
 * have none near the North Pole) is a ModelRangeError.
 * Units: degrees, km, %; rho g/m^3, V kg/m^2, VSCH km.
 */

import { ModelRangeError } from '../../errors.js';
import { bicubic, bilinearOf, cornersOf, nodeLatDeg, nodeLonDeg, nodeValue, type MapGrid } from './grid.js';
import { bracketExceedance } from './exceedance.js';
import { climateMap, SHIPPED_EXCEEDANCES_PERCENT } from './maps.js';

export interface P836Level {
  exceedancePercent: number;
  value: MapGrid;
  scaleHeight: MapGrid;
}

function atLevel(level: P836Level, topo: MapGrid, latDeg: number, lonDeg: number, heightKm: number): number {
  const g = level.value;
  return bilinearOf(cornersOf(g, latDeg, lonDeg), (i, j) => {
    const altKm = bicubic(topo, nodeLatDeg(g, i), nodeLonDeg(g, j));
    return nodeValue(g, i, j) * Math.exp(-(heightKm - altKm) / nodeValue(level.scaleHeight, i, j));
  });
}

/** Steps a-f for one quantity given its maps (levels sorted by exceedance). */
export function waterVapourAtSite(
  label: string,
  levels: readonly P836Level[],
  topo: MapGrid,
  latDeg: number,
  lonDeg: number,
  exceedancePercent: number,
  heightKm: number,
): number {
  const ps = levels.map((l) => l.exceedancePercent);
  const b = bracketExceedance(label, ps, exceedancePercent);
  const level = (p: number): P836Level => levels[ps.indexOf(p)] as P836Level;
  const vb = atLevel(level(b.below), topo, latDeg, lonDeg, heightKm);
  const v = b.weightAbove === 0 ? vb : vb + (atLevel(level(b.above), topo, latDeg, lonDeg, heightKm) - vb) * b.weightAbove;
  if (!Number.isFinite(v)) {
    throw new ModelRangeError(label, 'site latitudeDeg', latDeg, `a site its map has values around (none at ${latDeg} N ${lonDeg} E)`);
  }
  return v;
}

export const P836_REVISION = 'ITU-R P.836-6';

/** Surface water vapour density exceeded for p % (5..10 % shipped) at the station height, g/m^3. */
export function surfaceWaterVapourDensityGM3(latDeg: number, lonDeg: number, exceedancePercent: number, heightKm: number): number {
  const levels: P836Level[] = SHIPPED_EXCEEDANCES_PERCENT.map((p) => ({
    exceedancePercent: p,
    value: climateMap(p === 5 ? 'rho5' : 'rho10'),
    scaleHeight: climateMap(p === 5 ? 'vsch5' : 'vsch10'),
  }));
  return waterVapourAtSite(`${P836_REVISION} rho`, levels, climateMap('topo'), latDeg, lonDeg, exceedancePercent, heightKm);
}
