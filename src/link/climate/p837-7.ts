/**
 * Rainfall rate: Rec. ITU-R P.837-7 (06/2017), Annex 1 (the rain rate exceeded for p % of
 * an average year from the monthly mean total rainfall MT and the monthly mean surface
 * temperature T of Rec. ITU-R P.1510-1):
 *   1. t_ii = T_ii - 273.15 (°C), month ii = 1..12
 *   2. r_ii = 0.5874 exp(0.0883 t_ii) mm/h for t_ii >= 0 °C, else 0.5874 mm/h
 *   3. P0_ii = 100 MT_ii / (24 N_ii r_ii) %; where P0_ii > 70 %: P0_ii = 70 % and
 *      r_ii = (100/70) MT_ii / (24 N_ii)  (N_ii days in the month, 28.25 for February)
 *   4. P0_annual = sum N_ii P0_ii / 365.25
 *   5. P(R > R) = sum N_ii P0_ii Q((ln R + 0.7938 - ln r_ii) / 1.26) / 365.25
 *   6. Rp is the R at which P(R > R) = p for p < P0_annual; Rp = 0 for p >= P0_annual.
 * (Steps transcribed from memory; they reproduce the ITU-R SG3 validation workbook Rev 8.3.0
 * sheet P.837-7 Rp to 1e-5, see test/link/climate/p837-7.test.ts.) Q is the complementary
 * standard normal distribution; Rp is solved by safeguarded Newton iteration in ln R to
 * 1e-12 relative (the workbook's bisection stops at 1e-3 % relative error in p).
 *
 * R0.01 at a station: the grid of R0.01 that scripts/generate-climate-maps.ts derives once
 * with this method at every point of the 0.25° MT grid (T bilinear from the 0.75° P.1510-1
 * monthly maps at that point), interpolated bilinearly at the site. Interpolating the result
 * rather than MT and T differs from the method applied at the site by up to 1.3e-3 relative
 * at the workbook's sites (test/link/climate/p837-7.test.ts), as the workbook's own 0.125°
 * R0.01 map does by up to 3.4e-4.
 * Units: MT mm, T K, R mm/h, p and P0 %.
 */

import { bilinear } from './grid.js';
import { climateMap } from './maps.js';

/** Days of each month (N_ii), February 28.25. */
export const P837_DAYS_IN_MONTH = [31, 28.25, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31] as const;
export const P837_REVISION = 'ITU-R P.837-7';

/**
 * erfc(x), Chebyshev fit with fractional error below 1.2e-7 everywhere (the erfcc of
 * Press et al., Numerical Recipes, 2nd ed., §6.2; coefficients from memory, checked here
 * by the workbook comparison).
 */
export function erfc(x: number): number {
  const z = Math.abs(x);
  const t = 1 / (1 + 0.5 * z);
  const r =
    t *
    Math.exp(
      -z * z -
        1.26551223 +
        t *
          (1.00002368 +
            t * (0.37409196 + t * (0.09678418 + t * (-0.18628806 + t * (0.27886807 + t * (-1.13520398 + t * (1.48851587 + t * (-0.82215223 + t * 0.17087277)))))))),
    );
  return x >= 0 ? r : 2 - r;
}

/** Q(x) = P(X > x) for a standard normal X. */
export function normalQ(x: number): number {
  return 0.5 * erfc(x / Math.SQRT2);
}

/** Steps 1-4 for one site: monthly r_ii (mm/h), P0_ii (%) and the annual P0 (%). */
export interface RainMonths {
  rMmH: Float64Array;
  p0Percent: Float64Array;
  p0AnnualPercent: number;
}

export function rainMonths(monthlyTotalMm: ArrayLike<number>, monthlyTemperatureK: ArrayLike<number>): RainMonths {
  const rMmH = new Float64Array(12);
  const p0Percent = new Float64Array(12);
  let annual = 0;
  for (let m = 0; m < 12; m++) {
    const n = P837_DAYS_IN_MONTH[m] as number;
    const mt = monthlyTotalMm[m] as number;
    const t = (monthlyTemperatureK[m] as number) - 273.15;
    let r = t >= 0 ? 0.5874 * Math.exp(0.0883 * t) : 0.5874;
    let p0 = (100 * mt) / (24 * n * r);
    if (p0 > 70) {
      p0 = 70;
      r = ((100 / 70) * mt) / (24 * n);
    }
    rMmH[m] = r;
    p0Percent[m] = p0;
    annual += n * p0;
  }
  return { rMmH, p0Percent, p0AnnualPercent: annual / 365.25 };
}

const LN_SPREAD = 1.26;

/** Step 5: P(R > rateMmH), % of an average year. */
export function rainExceedancePercent(months: RainMonths, rateMmH: number): number {
  const lnR = Math.log(rateMmH);
  let sum = 0;
  for (let m = 0; m < 12; m++) {
    const p0 = months.p0Percent[m] as number;
    if (p0 > 0) sum += (P837_DAYS_IN_MONTH[m] as number) * p0 * normalQ((lnR + 0.7938 - Math.log(months.rMmH[m] as number)) / LN_SPREAD);
  }
  return sum / 365.25;
}

/** d P / d ln R of step 5 (for the Newton step). */
function exceedanceSlope(months: RainMonths, lnR: number): number {
  let sum = 0;
  for (let m = 0; m < 12; m++) {
    const p0 = months.p0Percent[m] as number;
    if (p0 > 0) {
      const z = (lnR + 0.7938 - Math.log(months.rMmH[m] as number)) / LN_SPREAD;
      sum -= ((P837_DAYS_IN_MONTH[m] as number) * p0 * Math.exp(-0.5 * z * z)) / (Math.sqrt(2 * Math.PI) * LN_SPREAD);
    }
  }
  return sum / 365.25;
}

/** Step 6: the rain rate exceeded for exceedancePercent % of an average year, mm/h. */
export function rainRateExceededMmH(months: RainMonths, exceedancePercent: number): number {
  if (!(exceedancePercent < months.p0AnnualPercent)) return 0;
  const target = Math.log(exceedancePercent);
  // g(lnR) = ln P(R > R) - ln p, decreasing in lnR; bracket, then Newton kept inside the bracket.
  let lo = Math.log(1e-6);
  let hi = Math.log(2000);
  const g = (x: number): number => Math.log(rainExceedancePercent(months, Math.exp(x))) - target;
  if (g(hi) > 0) return Math.exp(hi);
  let x = 0.5 * (lo + hi);
  for (let k = 0; k < 100; k++) {
    const pr = rainExceedancePercent(months, Math.exp(x));
    const gx = Math.log(pr) - target;
    if (gx > 0) lo = x;
    else hi = x;
    const slope = exceedanceSlope(months, x) / pr;
    let next = slope < 0 ? x - gx / slope : 0.5 * (lo + hi);
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - x) < 1e-13 || hi - lo < 1e-13) return Math.exp(next);
    x = next;
  }
  return Math.exp(x);
}

/** R0.01 by the Annex 1 method from the twelve monthly MT (mm) and T (K) of one site. */
export function rainRate001FromMonthlyMmH(monthlyTotalMm: ArrayLike<number>, monthlyTemperatureK: ArrayLike<number>): number {
  return rainRateExceededMmH(rainMonths(monthlyTotalMm, monthlyTemperatureK), 0.01);
}

export const R001_SOURCE = `${P837_REVISION} Annex 1 (R0.01 from the monthly MT maps and ITU-R P.1510-1 monthly T, 0.25 deg grid, bilinear)`;

/** R0.01 at a site from the shipped derived grid, mm/h. */
export function rainRate001MmH(latitudeDeg: number, longitudeDeg: number): number {
  return Math.max(0, bilinear(climateMap('r001'), latitudeDeg, longitudeDeg));
}
