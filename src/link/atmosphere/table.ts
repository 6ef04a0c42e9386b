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
 * The exceedance axis (buildExceedanceLevelsTable): one value per exceedance level on one
 * such grid, coarser (LEVEL_GRID_STEP_SQRT_DEG) with slopes from the node values, for the
 * expected volume (exceedance-levels.ts).
 */

import { ModelRangeError } from '../../errors.js';
import {
  absorptionAtLevelsDb,
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
import type { AtmosphereResult, AtmosphereTable, ExceedanceLevelsTable } from './types.js';

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

/** The last lookup's elevation and its grid coordinate (a link sample looks up two tables at one elevation). */
let lastLookupDeg = Number.NaN;
let lastLookupU = Number.NaN;

/** gridCoordinate, kept from the last lookup when the elevation is the same (the same number). */
function lookupCoordinate(elevationDeg: number): number {
  if (elevationDeg !== lastLookupDeg) {
    lastLookupU = gridCoordinate(elevationDeg);
    lastLookupDeg = elevationDeg;
  }
  return lastLookupU;
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

/** Cubic Hermite interpolation in u of `channels` values per node (values and d/du slopes, node-major). */
class HermiteGrid {
  readonly minElevationDeg: number;
  protected readonly channels: number;
  private readonly u: Float64Array;
  protected readonly value: Float64Array;
  protected readonly slope: Float64Array;
  private readonly last: number;
  // basis of the last located point (no allocation per lookup)
  protected a = 0;
  protected h00 = 0;
  protected h10 = 0;
  protected h01 = 0;
  protected h11 = 0;
  /** The interval of the last lookup, tried first (samples move little): the same interval the search finds. */
  private hint = 0;

  protected readonly floor: number;

  constructor(minElevationDeg: number, channels: number, nodes: GridNodes, floorAtZero = true) {
    this.minElevationDeg = minElevationDeg;
    this.channels = channels;
    this.floor = floorAtZero ? 0 : -Infinity;
    this.u = nodes.u;
    this.value = nodes.values;
    this.slope = nodes.slopes;
    this.last = nodes.u.length - 1;
  }

  /** Finds the interval of elevationDeg and sets the Hermite basis for term(). */
  protected locate(elevationDeg: number): void {
    if (!(elevationDeg >= this.minElevationDeg && elevationDeg <= 90)) {
      throw new ModelRangeError('atmosphere table', 'elevationDeg', elevationDeg, `${this.minElevationDeg}..90 deg`);
    }
    const uq = lookupCoordinate(elevationDeg);
    const u = this.u;
    // largest i with u[i] <= uq, then the interval [i, i + 1]
    let lo = 0;
    let hi = this.last;
    if (uq >= (u[hi] as number)) lo = hi - 1;
    else {
      // the only i with u[i] <= uq < u[i + 1] (what the bisection below ends on)
      const h = this.hint;
      if ((u[h] as number) <= uq && uq < (u[h + 1] as number)) lo = h;
      else {
        while (hi - lo > 1) {
          const mid = (lo + hi) >> 1;
          if ((u[mid] as number) <= uq) lo = mid;
          else hi = mid;
        }
      }
      this.hint = lo;
    }
    const u0 = u[lo] as number;
    const h = (u[lo + 1] as number) - u0;
    const t = h > 0 ? (uq - u0) / h : 0;
    const t2 = t * t;
    const t3 = t2 * t;
    this.h00 = 2 * t3 - 3 * t2 + 1;
    this.h10 = (t3 - 2 * t2 + t) * h;
    this.h01 = -2 * t3 + 3 * t2;
    this.h11 = (t3 - t2) * h;
    this.a = lo * this.channels;
  }

  /** Hermite combination for channel c at the located point (floored at 0 unless built without). */
  protected term(c: number): number {
    const v = this.value;
    const s = this.slope;
    const i = this.a + c;
    const j = i + this.channels;
    const r = this.h00 * (v[i] as number) + this.h10 * (s[i] as number) + this.h01 * (v[j] as number) + this.h11 * (s[j] as number);
    return r > this.floor ? r : this.floor;
  }
}

class InterpolatedAtmosphere extends HermiteGrid implements AtmosphereTable {
  at(elevationDeg: number, out: AtmosphereResult): void {
    this.locate(elevationDeg);
    out.gasDb = this.term(0);
    out.rainDb = this.term(1);
    out.cloudDb = this.term(2);
    out.scintillationDb = this.term(3);
    combineTerms(out);
  }
}

class InterpolatedExceedanceLevels extends HermiteGrid implements ExceedanceLevelsTable {
  readonly levels: number;
  constructor(minElevationDeg: number, channels: number, nodes: GridNodes) {
    super(minElevationDeg, channels, nodes, false);
    this.levels = channels;
  }

  valuesAt(elevationDeg: number, out: Float64Array): void {
    this.locate(elevationDeg);
    // term(k) for every k, with the basis read once
    const v = this.value;
    const s = this.slope;
    const n = this.channels;
    const h00 = this.h00;
    const h10 = this.h10;
    const h01 = this.h01;
    const h11 = this.h11;
    const floor = this.floor;
    let i = this.a;
    for (let k = 0; k < n; k++, i++) {
      const j = i + n;
      const r = h00 * (v[i] as number) + h10 * (s[i] as number) + h01 * (v[j] as number) + h11 * (s[j] as number);
      out[k] = r > floor ? r : floor;
    }
  }
}

interface GridNodes {
  u: Float64Array;
  values: Float64Array;
  slopes: Float64Array;
}

function clampedMinDeg(minElevationDeg: number): number {
  if (Number.isNaN(minElevationDeg)) {
    throw new ModelRangeError('atmosphere table', 'minElevationDeg', minElevationDeg, 'a number (clamped to 0..90)');
  }
  const minDeg = Math.min(90, Math.max(0, minElevationDeg));
  checkElevation(minDeg);
  return minDeg;
}

/** Grid edges from minDeg to 90: every elevation where a model of any of preps switches branch. */
function gridEdges(preps: readonly AtmospherePrepared[], minDeg: number): number[] {
  const cuts: number[] = [5, 25];
  for (const prep of preps) {
    rainBranchCuts(prep, minDeg, cuts);
    cuts.push(scintillationCutoffElevationDeg(prep.scintillation));
  }
  const start = minDeg < 90 ? minDeg : 90 - 1e-6;
  const inner = [...new Set(cuts)].filter((c) => c > start + 1e-6 && c < 90 - 1e-6).sort((x, y) => x - y);
  return [start, ...inner, 90];
}

/**
 * Nodes over the edges: `channels` values per node from sampleInto(el, out) (out.length =
 * channels, overwritten), with d/du slopes by finite differences (one-sided at the edges).
 */
function buildNodes(edges: readonly number[], channels: number, sampleInto: (elevationDeg: number, out: number[]) => void): GridNodes {
  const uNodes: number[] = [];
  const values: number[] = [];
  const slopes: number[] = [];
  const f = new Array<number>(channels).fill(0);
  const fa = new Array<number>(channels).fill(0);
  const fb = new Array<number>(channels).fill(0);
  const sample = (uu: number, lowDeg: number, highDeg: number, into: number[]): void => {
    sampleInto(Math.min(highDeg, Math.max(lowDeg, elevationOfGrid(uu))), into);
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
      sample(uu, a, b, f);
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
      for (let c = 0; c < channels; c++) {
        values.push(f[c] as number);
        slopes.push(slopeOf(c));
      }
    }
  }
  for (const x of values) {
    if (!Number.isFinite(x)) throw new Error('atmosphere table: non-finite model value (bug)');
  }
  return { u: Float64Array.from(uNodes), values: Float64Array.from(values), slopes: Float64Array.from(slopes) };
}

/**
 * Precomputes the atmosphere for elevations minElevationDeg (clamped to 0..90) to 90°.
 * Validates the input as atmosphereAt does (ModelRangeError).
 */
export function buildAtmosphereTable(input: AtmosphereStationInput, minElevationDeg: number): AtmosphereTable {
  const minDeg = clampedMinDeg(minElevationDeg);
  const prep = prepareAtmosphere(input, newAtmospherePrepared());
  const r: AtmosphereResult = { gasDb: 0, rainDb: 0, cloudDb: 0, scintillationDb: 0, totalDb: 0, skyNoiseTempK: 0 };
  const nodes = buildNodes(gridEdges([prep], minDeg), CHANNELS, (el, out) => {
    evaluateTerms(prep, el, r);
    out[0] = r.gasDb;
    out[1] = r.rainDb;
    out[2] = r.cloudDb;
    out[3] = r.scintillationDb;
  });
  return new InterpolatedAtmosphere(minDeg, CHANNELS, nodes);
}

/**
 * Node spacing of the exceedance-level grid, sqrt-degrees: coarser than the atmosphere's own
 * (its values feed a year average, not a budget line), with slopes from the node values.
 * Accuracy against direct evaluation: test/link/atmosphere/exceedance-levels.test.ts.
 */
export const LEVEL_GRID_STEP_SQRT_DEG = 0.1;

/**
 * Nodes over the edges with slopes by finite differences of the node values themselves
 * (three-point, one-sided at each edge): one evaluation per node and channel.
 */
function buildNodalNodes(edges: readonly number[], channels: number, stepSqrtDeg: number, sampleInto: (elevationDeg: number, out: number[]) => void): GridNodes {
  const uNodes: number[] = [];
  const values: number[] = [];
  const slopes: number[] = [];
  for (let k = 0; k + 1 < edges.length; k++) {
    const a = edges[k] as number;
    const bEdge = edges[k + 1] as number;
    const b = k + 2 < edges.length ? bEdge - LEFT_LIMIT_OFFSET_DEG : bEdge;
    const ua = gridCoordinate(a);
    const ub = gridCoordinate(bEdge);
    const n = Math.max(2, Math.ceil((ub - ua) / stepSqrtDeg));
    const h = (ub - ua) / n;
    const seg: number[][] = [];
    for (let i = 0; i <= n; i++) {
      const uu = i === 0 ? ua : i === n ? ub : ua + ((ub - ua) * i) / n;
      const f = new Array<number>(channels).fill(0);
      sampleInto(Math.min(b, Math.max(a, elevationOfGrid(uu))), f);
      seg.push(f);
      uNodes.push(uu);
    }
    for (let i = 0; i <= n; i++) {
      const f = seg[i] as number[];
      for (let c = 0; c < channels; c++) {
        const v = (j: number): number => (seg[j] as number[])[c] as number;
        let d: number;
        if (i === 0) d = (-3 * v(0) + 4 * v(1) - v(2)) / (2 * h);
        else if (i === n) d = (3 * v(n) - 4 * v(n - 1) + v(n - 2)) / (2 * h);
        else d = (v(i + 1) - v(i - 1)) / (2 * h);
        values.push(f[c] as number);
        slopes.push(d);
      }
    }
  }
  for (const x of values) {
    if (!Number.isFinite(x)) throw new Error('exceedance-level grid: non-finite value (bug)');
  }
  return { u: Float64Array.from(uNodes), values: Float64Array.from(values), slopes: Float64Array.from(slopes) };
}

/**
 * The exceedance axis: for each of levelInputs (one station and frequency at several
 * exceedances) the absorptive attenuation AG + AR + AC (dB; P.618-14 §2.5 without the
 * scintillation term) on one elevation grid, mapped by valueOf(level, absorptionDb,
 * elevationDeg) (default: the absorption itself) and interpolated on lookup. The same
 * nodes serve every level: one search per lookup. The models run once per node and level,
 * never per sample. Validates every input as atmosphereAt does (ModelRangeError).
 */
export function buildExceedanceLevelsTable(
  levelInputs: readonly AtmosphereStationInput[],
  minElevationDeg: number,
  valueOf: (level: number, absorptionDb: number, elevationDeg: number) => number = (_l, a) => a,
): ExceedanceLevelsTable {
  const minDeg = clampedMinDeg(minElevationDeg);
  const preps = levelInputs.map((inp) => prepareAtmosphere(inp, newAtmospherePrepared()));
  // the branch points of the models do not move with p (P.618 step 7's zeta, the
  // scintillation aperture cut-off), so the first level (the one with rain) gives them all
  const absorption = new Array<number>(preps.length).fill(0);
  const nodes = buildNodalNodes(gridEdges(preps.slice(0, 1), minDeg), preps.length, LEVEL_GRID_STEP_SQRT_DEG, (el, out) => {
    absorptionAtLevelsDb(preps, el, absorption);
    for (let k = 0; k < preps.length; k++) out[k] = valueOf(k, absorption[k] as number, el);
  });
  return new InterpolatedExceedanceLevels(minDeg, preps.length, nodes);
}
