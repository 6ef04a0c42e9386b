/**
 * Interpolation between the exceedances a map is tabulated at, linear in ln p, as
 * Rec. ITU-R P.836-6 Annex 2 and P.840-9 Annex 1 prescribe:
 *   v(p) = v(p_below) + (v(p_above) - v(p_below)) (ln p - ln p_below) / (ln p_above - ln p_below)
 * Outside the tabulated range: ModelRangeError naming the range.
 * Units: p in % of an average year.
 */

import { ModelRangeError } from '../../errors.js';

/** The tabulated exceedances around p (equal when p is tabulated) and the ln-p weight of the upper one. */
export function bracketExceedance(
  label: string,
  tabulatedPercent: readonly number[],
  exceedancePercent: number,
): { below: number; above: number; weightAbove: number } {
  const first = tabulatedPercent[0] as number;
  const last = tabulatedPercent[tabulatedPercent.length - 1] as number;
  if (!(exceedancePercent >= first && exceedancePercent <= last)) {
    throw new ModelRangeError(label, 'exceedancePercent', exceedancePercent, `${first}..${last} % (the exceedances its maps are tabulated at here)`);
  }
  let k = 0;
  while (k + 1 < tabulatedPercent.length && (tabulatedPercent[k + 1] as number) <= exceedancePercent) k++;
  const below = tabulatedPercent[k] as number;
  if (below === exceedancePercent || k + 1 >= tabulatedPercent.length) return { below, above: below, weightAbove: 0 };
  const above = tabulatedPercent[k + 1] as number;
  return { below, above, weightAbove: (Math.log(exceedancePercent) - Math.log(below)) / (Math.log(above) - Math.log(below)) };
}
