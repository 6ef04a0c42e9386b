/**
 * Total columnar cloud liquid water at a station: Rec. ITU-R P.840-9 (08/2023), Annex 1:
 * the 0.25° maps of L exceeded for the tabulated p, bilinear at the station, linear in ln p
 * between the tabulated exceedances around the required p (from memory; it reproduces the
 * ITU-R SG3 validation workbook Rev 8.3.0 sheet P840_9_L to 4e-8,
 * test/link/climate/p840-9.test.ts). Units: degrees, %; L kg/m^2.
 */

import { bilinear, type MapGrid } from './grid.js';
import { bracketExceedance } from './exceedance.js';
import { climateMap, SHIPPED_EXCEEDANCES_PERCENT } from './maps.js';
import { ModelRangeError } from '../../errors.js';

export const P840_REVISION = 'ITU-R P.840-9';

export interface P840Level {
  exceedancePercent: number;
  value: MapGrid;
}

export function liquidWaterAtSite(label: string, levels: readonly P840Level[], latDeg: number, lonDeg: number, exceedancePercent: number): number {
  const ps = levels.map((l) => l.exceedancePercent);
  const b = bracketExceedance(label, ps, exceedancePercent);
  const at = (p: number): number => bilinear((levels[ps.indexOf(p)] as P840Level).value, latDeg, lonDeg);
  const lb = at(b.below);
  const l = b.weightAbove === 0 ? lb : lb + (at(b.above) - lb) * b.weightAbove;
  if (!Number.isFinite(l)) throw new ModelRangeError(label, 'site latitudeDeg', latDeg, `a site its map has values around (none at ${latDeg} N ${lonDeg} E)`);
  return l;
}

/** L exceeded for p % (5..10 % shipped), kg/m^2. */
export function cloudLiquidWaterKgM2(latDeg: number, lonDeg: number, exceedancePercent: number): number {
  const levels: P840Level[] = SHIPPED_EXCEEDANCES_PERCENT.map((p) => ({ exceedancePercent: p, value: climateMap(p === 5 ? 'l5' : 'l10') }));
  return liquidWaterAtSite(`${P840_REVISION} L`, levels, latDeg, lonDeg, exceedancePercent);
}
