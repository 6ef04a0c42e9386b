/**
 * AtmosphereTable: the atmosphere of one station, frequency and exceedance precomputed on an
 * elevation grid and interpolated on lookup (see types.ts for the contract).
 *
 * Grid: nodes uniform in u = sqrt(el) - sqrt(90 - el) (el in degrees), which is dense at both
 * ends of the range, where the models behave like square roots: near the horizon
 * (sqrt(sin el) in P.618 step 7) and near the zenith (sqrt(LG) with LG ~ cos el in P.618
 * step 6). In u these become smooth. Inverse: el = ((u + sqrt(180 - u^2))/2)^2.
 * GRID_STEP_SQRT_DEG between nodes (0.02: ~0.1° spacing at 45°, ~0.01° at 1° and at 89°). The range is cut at every elevation where a model switches branch, so no
 * interval straddles a step or kink: 5° (P.676/P.840 low-elevation path, P.618 Ls, the
 * scintillation clamp), 25° (P.618 step 10 beta), the elevation where P.618 step 7 switches
 * its LR branch (zeta = el, found by bisection), and the elevation above which the
 * scintillation aperture factor is zero (x = 7). Each term is stored with its derivative
 * d/du (finite differences, one-sided at cut points) and interpolated by cubic Hermite
 * polynomials in u. totalDb and skyNoiseTempK are recombined from the interpolated terms.
 * Accuracy: test/link/atmosphere/table.test.ts sweeps densely against direct evaluation
 * (target 0.01 dB).
 */

import { ModelRangeError } from '../../errors.js';
import {
  checkElevation,
  combineTerms,
  evaluateTerms,
  newAtmospherePrepared,
  prepareAtmosphere,
  type AtmospherePrepared,
  type AtmosphereStationInput,
} from './prepare.js';
import { newRainDetail, rainAttenuationDetail } from './p618-rain.js';
import { scintillationCutoffElevationDeg } from './p618-scintillation.js';
import type { AtmosphereResult, AtmosphereTable } from './types.js';

/** Node spacing in the grid coordinate u (sqrt-degrees). */
export const GRID_STEP_SQRT_DEG = 0.02;
const CHANNELS = 4; // gas, rain, cloud, scintillation
const DERIVATIVE_STEP_SQRT_DEG = 1e-5;
/** Offset below a cut point where the left-hand limit is sampled, degrees. */
const LEFT_LIMIT_OFFSET_DEG = 1e-9;
const KINK_SCAN_STEP_DEG = 0.25;

/** Grid coordinate u(el) = sqrt(el) - sqrt(90 - el), el in 0..90 degrees. */
function gridCoordinate(elevationDeg: number): number {
  return Math.sqrt(elevationDeg) - Math.sqrt(90 - elevationDeg);
}

/** Inverse of gridCoordinate. */
function elevationOfGrid(u: number): number {
  const a = (u + Math.sqrt(180 - u * u)) / 2;
  return a * a;
}

function rainBranchCuts(prep: AtmospherePrepared, minDeg: number, cuts: number[]): void {
  if (!prep.rainModelled) return;
  const d = newRainDetail();
  const sign = (el: number): boolean => {
    rainAttenuationDetail(prep.rain, el, d);
    return d.attenuationDb > 0 && d.zetaDeg > el;
  };
  let prevEl = minDeg;
  let prev = sign(prevEl);
  for (let el = minDeg + KINK_SCAN_STEP_DEG; el <= 90 + 1e-12; el += KINK_SCAN_STEP_DEG) {
    const e = Math.min(el, 90);
    const cur = sign(e);
    if (cur !== prev) {
      let lo = prevEl;
      let hi = e;
      for (let i = 0; i < 60; i++) {
        const mid = 0.5 * (lo + hi);
        if (sign(mid) === prev) lo = mid;
        else hi = mid;
      }
      cuts.push(hi);
    }
    prev = cur;
    prevEl = e;
  }
}

class InterpolatedAtmosphere implements AtmosphereTable {
  readonly minElevationDeg: number;
  private readonly u: Float64Array;
  private readonly value: Float64Array;
  private readonly slope: Float64Array;
  private readonly last: number;

  constructor(minElevationDeg: number, u: Float64Array, value: Float64Array, slope: Float64Array) {
    this.minElevationDeg = minElevationDeg;
    this.u = u;
    this.value = value;
    this.slope = slope;
    this.last = u.length - 1;
  }

  at(elevationDeg: number, out: AtmosphereResult): void {
    if (!(elevationDeg >= this.minElevationDeg && elevationDeg <= 90)) {
      throw new ModelRangeError('atmosphere table', 'elevationDeg', elevationDeg, `${this.minElevationDeg}..90 deg`);
    }
    const uq = gridCoordinate(elevationDeg);
    const u = this.u;
    // largest i with u[i] <= uq, then the interval [i, i + 1]
    let lo = 0;
    let hi = this.last;
    if (uq >= (u[hi] as number)) lo = hi - 1;
    else {
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if ((u[mid] as number) <= uq) lo = mid;
        else hi = mid;
      }
    }
    const u0 = u[lo] as number;
    const h = (u[lo + 1] as number) - u0;
    const t = h > 0 ? (uq - u0) / h : 0;
    const t2 = t * t;
    const t3 = t2 * t;
    const h00 = 2 * t3 - 3 * t2 + 1;
    const h10 = (t3 - 2 * t2 + t) * h;
    const h01 = -2 * t3 + 3 * t2;
    const h11 = (t3 - t2) * h;
    const a = lo * CHANNELS;
    out.gasDb = this.term(a, 0, h00, h10, h01, h11);
    out.rainDb = this.term(a, 1, h00, h10, h01, h11);
    out.cloudDb = this.term(a, 2, h00, h10, h01, h11);
    out.scintillationDb = this.term(a, 3, h00, h10, h01, h11);
    combineTerms(out);
  }

  /** Hermite combination for channel c of the interval starting at flat index a (>= 0). */
  private term(a: number, c: number, h00: number, h10: number, h01: number, h11: number): number {
    const v = this.value;
    const s = this.slope;
    const i = a + c;
    const j = i + CHANNELS;
    const r = h00 * (v[i] as number) + h10 * (s[i] as number) + h01 * (v[j] as number) + h11 * (s[j] as number);
    return r > 0 ? r : 0;
  }
}

/**
 * Precomputes the atmosphere for elevations minElevationDeg (clamped to 0..90) to 90°.
 * Validates the input as atmosphereAt does (ModelRangeError).
 */
export function buildAtmosphereTable(input: AtmosphereStationInput, minElevationDeg: number): AtmosphereTable {
  if (Number.isNaN(minElevationDeg)) {
    throw new ModelRangeError('atmosphere table', 'minElevationDeg', minElevationDeg, 'a number (clamped to 0..90)');
  }
  const minDeg = Math.min(90, Math.max(0, minElevationDeg));
  const prep = prepareAtmosphere(input, newAtmospherePrepared());
  checkElevation(minDeg);

  const cuts: number[] = [5, 25];
  rainBranchCuts(prep, minDeg, cuts);
  cuts.push(scintillationCutoffElevationDeg(prep.scintillation));
  const start = minDeg < 90 ? minDeg : 90 - 1e-6;
  const edges = [start, ...cuts.filter((c) => c > start + 1e-6 && c < 90 - 1e-6).sort((x, y) => x - y), 90];

  const uNodes: number[] = [];
  const values: number[] = [];
  const slopes: number[] = [];
  const r: AtmosphereResult = { gasDb: 0, rainDb: 0, cloudDb: 0, scintillationDb: 0, totalDb: 0, skyNoiseTempK: 0 };
  const sample = (uu: number, lowDeg: number, highDeg: number, into: number[]): void => {
    const el = Math.min(highDeg, Math.max(lowDeg, elevationOfGrid(uu)));
    evaluateTerms(prep, el, r);
    into.push(r.gasDb, r.rainDb, r.cloudDb, r.scintillationDb);
  };
  for (let k = 0; k + 1 < edges.length; k++) {
    const a = edges[k] as number;
    const bEdge = edges[k + 1] as number;
    const b = k + 2 < edges.length ? bEdge - LEFT_LIMIT_OFFSET_DEG : bEdge; // left-hand limit at a cut
    const ua = gridCoordinate(a);
    const ub = gridCoordinate(bEdge);
    const n = Math.max(2, Math.ceil((ub - ua) / GRID_STEP_SQRT_DEG));
    const dh = DERIVATIVE_STEP_SQRT_DEG;
    for (let i = 0; i <= n; i++) {
      const uu = i === 0 ? ua : i === n ? ub : ua + ((ub - ua) * i) / n;
      const f: number[] = [];
      sample(uu, a, b, f);
      const fa: number[] = [];
      const fb: number[] = [];
      let slopeOf: (c: number) => number;
      if (i === 0) {
        sample(uu + dh, a, b, fa);
        sample(uu + 2 * dh, a, b, fb);
        slopeOf = (c) => (-3 * (f[c] as number) + 4 * (fa[c] as number) - (fb[c] as number)) / (2 * dh);
      } else if (i === n) {
        sample(uu - dh, a, b, fa);
        sample(uu - 2 * dh, a, b, fb);
        slopeOf = (c) => (3 * (f[c] as number) - 4 * (fa[c] as number) + (fb[c] as number)) / (2 * dh);
      } else {
        sample(uu + dh, a, b, fa);
        sample(uu - dh, a, b, fb);
        slopeOf = (c) => ((fa[c] as number) - (fb[c] as number)) / (2 * dh);
      }
      uNodes.push(uu);
      for (let c = 0; c < CHANNELS; c++) {
        values.push(f[c] as number);
        slopes.push(slopeOf(c));
      }
    }
  }
  for (const x of values) {
    if (!Number.isFinite(x)) throw new Error('atmosphere table: non-finite model value (bug)');
  }
  return new InterpolatedAtmosphere(minDeg, Float64Array.from(uNodes), Float64Array.from(values), Float64Array.from(slopes));
}
