/**
 * Expected volume over an average year: the exceedances the absorption is tabulated at
 * and the quadrature weights over the exceedance distribution.
 *
 * Distribution: the absorptive attenuation A(p) = AG(p) + AR(p) + AC(p) exceeded for p % of
 * an average year, Rec. ITU-R P.618-14 §2.5 Eq. (65) for p <= 5 % and Eq. (66) (no rain term)
 * for 5 % < p, with AG and AC held at their 5 % values for p < 5 % (Eqs. 67, 68). The
 * scintillation term is left out: it is a fast, zero-mean fluctuation (fades balanced by
 * enhancements, §2.4.1), which removes no energy over a year; it stays in the volume at the
 * chosen availability.
 * The expected value of a quantity V(p) that does not decrease with p (a volume: less
 * absorption, more rate) over p uniform on 0..100 %:
 *   E = (1/100) [ 0.001 V(0.001) + sum_k (V_k + V_k+1)/2 (p_k+1 - p_k) + (100 - 10) V(10) ]
 * (trapezoid between the levels; below 0.001 %, the lowest exceedance P.618 covers, V(0.001)
 * is held; above 10 %, the highest exceedance the shipped gas and cloud maps cover, the
 * absorption is held at its 10 % value, so that part is a lower bound). Because V is
 * monotone in p, the trapezoid's error over the tabulated range is at most
 *   (1/100) [ 0.001 V(0.001) + sum_k (V_k+1 - V_k)(p_k+1 - p_k)/2 ]   (expectedVolumeBound).
 * Levels: a 1-3 series from 0.001 % to 1 %, then 2, 3 and 5 %, then 5 % without rain (Eq. 66 starts
 * there, a step in A(p)) and 10 %.
 */

export interface ExceedanceLevel {
  exceedancePercent: number;
  /** False above 5 % (Eq. 66) and for the level just above 5 %. */
  rain: boolean;
}

export const EXPECTED_VOLUME_LEVELS: readonly ExceedanceLevel[] = [
  ...[0.001, 0.003, 0.01, 0.03, 0.1, 0.3, 1, 2, 3, 5].map((p) => ({ exceedancePercent: p, rain: true })),
  { exceedancePercent: 5, rain: false },
  { exceedancePercent: 10, rain: false },
];

/** Weight of each level's value in the expected value (they sum to 1). */
export function expectationWeights(levels: readonly ExceedanceLevel[]): Float64Array {
  const n = levels.length;
  const w = new Float64Array(n);
  const p = levels.map((l) => l.exceedancePercent);
  w[0]! += p[0]!;
  for (let k = 0; k + 1 < n; k++) {
    const dp = p[k + 1]! - p[k]!;
    w[k]! += dp / 2;
    w[k + 1]! += dp / 2;
  }
  w[n - 1]! += 100 - p[n - 1]!;
  for (let k = 0; k < n; k++) w[k]! /= 100;
  return w;
}

/** The bound on the quadrature error of the expected value from the level values (see the head). */
export function expectedValueBound(levels: readonly ExceedanceLevel[], values: ArrayLike<number>): number {
  let b = (levels[0]!.exceedancePercent * (values[0] as number)) / 100;
  for (let k = 0; k + 1 < levels.length; k++) {
    const dp = levels[k + 1]!.exceedancePercent - levels[k]!.exceedancePercent;
    b += (Math.abs((values[k + 1] as number) - (values[k] as number)) * dp) / 2 / 100;
  }
  return b;
}
