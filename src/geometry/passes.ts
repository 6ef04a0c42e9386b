/**
 * Contact-window search: every window of one target over many ground sites in a span.
 *
 * Method (our own, built from standard pieces): the target is propagated ONCE per scan
 * step and that state serves every site. Per site the visibility function is
 *   g(t) = elevation(t) - mask(azimuth(t))   (deg; visible when g > 0).
 * - AOS/LOS: a sign change of g between two scan samples is refined with Brent's root
 *   finder (roots.ts) to `edgeToleranceS`; the returned edge is the visible side of the
 *   final bracket (g(AOS) > 0 and g(AOS - tol) <= 0, likewise for LOS).
 * - Short passes: three samples with g <= 0 whose middle one is a local maximum are
 *   refined with Brent's maximiser; if the maximum of g is > 0 a pass is added with its
 *   AOS and LOS refined on each side. Symmetrically, a local minimum between three
 *   visible samples is refined and, if it dips below the mask, splits the window.
 * - Peak: the visible sample of highest elevation is refined by Brent's maximiser on
 *   elevation within its neighbouring samples to `peakToleranceS`; the window edges are
 *   also candidates (clipped windows). `tcaMs` is the time of maximum elevation.
 * - The scan runs one step before the span and one after, so features at the span edges
 *   are seen; windows are then cut to the span and marked aosClipped/losClipped. An
 *   always-visible target gives one window spanning the whole span.
 * - When the target's state fails (SGP4 decay), the track end is bisected to
 *   `edgeToleranceS` and open windows end there (losTrackEnded).
 * Limits: a window (or a gap inside one) is found if g has a single extremum within two
 * scan steps around it; narrower double features of a terrain mask can be merged.
 * Span is [startMs, endMs]. Units: ms for times, s for steps and tolerances, degrees.
 */
import { ModelRangeError } from '../errors.js';
import type { Mask, Span } from '../scenario/types.js';
import { maskElevationDeg, prepareMask, type PreparedMask } from './mask.js';
import { brentBoundary, brentMax, type MaxResult } from './roots.js';
import { elevationFrom, lookFrom, newLook } from './topocentric.js';
import { elevationBoundsDeg, lineDeviationKm } from './reach.js';
import { sgp4SmoothOver } from './targets/sgp4.js';
import {
  DEFAULT_PEAK_TOLERANCE_S,
  DEFAULT_SEARCH,
  type Pass,
  type SearchOptions,
  type Site,
  type Target,
} from './types.js';

const MODEL = 'geometry/passes';
/** g assigned to an instant where the target has no state (treated as not visible). */
const NO_STATE_G = -1000;

/** Accept either a scenario Mask or one already prepared. */
export function asPreparedMask(mask: Mask | PreparedMask): PreparedMask {
  return 'bucket' in mask ? mask : prepareMask(mask as Mask);
}

export function checkSearchInputs(sites: readonly Site[], masks: readonly unknown[], span: Span, stepS: number): void {
  if (sites.length !== masks.length) throw new Error(`${MODEL}: ${sites.length} sites but ${masks.length} masks (a bug in the caller)`);
  if (!(Number.isFinite(span.startMs) && Number.isFinite(span.endMs) && span.endMs > span.startMs)) {
    throw new ModelRangeError(MODEL, 'span.endMs - span.startMs', span.endMs - span.startMs, '> 0 ms');
  }
  if (!(Number.isFinite(stepS) && stepS > 0)) throw new ModelRangeError(MODEL, 'scanStepS', stepS, '> 0 s');
}

/**
 * All windows of `target` over `sites` (masks[i] belongs to sites[i]) inside `span`,
 * ordered by AOS (then by site order). Failures of the target's state are recorded on
 * the target (failedAtMs, failureReason); windows end there.
 */
export function findPasses(
  target: Target,
  sites: readonly Site[],
  masks: readonly (Mask | PreparedMask)[],
  span: Span,
  opts: SearchOptions = DEFAULT_SEARCH,
): Pass[] {
  return findPassesWithRanges(target, sites, masks, span, opts).passes;
}

/** findPasses with the slant ranges the search evaluated at each window's AOS, TCA and LOS. */
export interface PassesWithRanges {
  passes: Pass[];
  /**
   * Per pass: [AOS, TCA, LOS] slant range, km, from lookFrom of the target's state at exactly
   * that time (the search's own evaluation); NaN where the search has none at hand.
   */
  rangesKm: Map<Pass, Float64Array>;
}

export function findPassesWithRanges(
  target: Target,
  sites: readonly Site[],
  masks: readonly (Mask | PreparedMask)[],
  span: Span,
  opts: SearchOptions = DEFAULT_SEARCH,
): PassesWithRanges {
  const stepS = opts.scanStepS ?? target.scanStepS;
  checkSearchInputs(sites, masks, span, stepS);
  if (!(opts.edgeToleranceS > 0)) throw new ModelRangeError(MODEL, 'edgeToleranceS', opts.edgeToleranceS, '> 0 s');
  const search = new PassSearch(target, sites, masks.map(asPreparedMask), span, stepS, opts);
  const passes = search.run();
  return { passes, rangesKm: search.rangesKm };
}

class PassSearch {
  private readonly nSites: number;
  private readonly times: Float64Array;
  private readonly startMs: number;
  private readonly endMs: number;
  private readonly edgeTolS: number;
  private readonly peakTolS: number;
  private readonly maxIter: number;
  private readonly passes: Pass[] = [];
  // scan scratch and refinement scratch are separate: refinement runs mid-scan
  private readonly scanState = new Float64Array(6);
  private readonly scanLook = newLook();
  private readonly refState = new Float64Array(6);
  private readonly refLook = newLook();
  private readonly maxOut: MaxResult = { x: 0, f: 0 };
  // memo of refinement evaluations (to read az/el at a solver's answer), keyed by
  // time AND site: the same instant (a span edge) is evaluated for several sites
  private readonly memoT: Float64Array;
  private readonly memoSite: Int32Array;
  private readonly memoAz: Float64Array;
  private readonly memoEl: Float64Array;
  private readonly memoRange: Float64Array;
  /**
   * lazyLook: the memo's azimuth and range are made when read (lookAt, memoRangeAt) from the
   * position kept in memoPos, the elevation alone at each evaluation (a constant mask and no
   * further condition of sight: g needs no azimuth). memoLooked[m]: slot m's azimuth and range are made.
   */
  private readonly lazyLook: boolean;
  private readonly memoPos: Float64Array;
  private readonly memoLooked: Uint8Array;
  private readonly lookState = new Float64Array(6);
  /** Slant ranges at AOS, TCA and LOS of each pass (findPassesWithRanges). */
  readonly rangesKm = new Map<Pass, Float64Array>();
  private readonly aosRange: Float64Array;
  private memoN = 0;
  // the function the solvers see
  private curSite = 0;
  private refMs = 0;
  private lastEl = 0;
  private readonly gOfS: (s: number) => number;
  private readonly elOfS: (s: number) => number;
  // per-site ring of the last two samples and the open-window state
  private readonly gm1: Float64Array;
  private readonly gm2: Float64Array;
  private readonly elm1: Float64Array;
  private readonly elm2: Float64Array;
  private readonly open: Uint8Array;
  private readonly aosRaw: Float64Array;
  private readonly aosAz: Float64Array;
  private readonly aosEl: Float64Array;
  private readonly bestEl: Float64Array;
  private readonly bestK: Int32Array;
  /** The target has a further condition of sight (lunar limb, site mask, occultation). */
  private readonly sight: boolean;
  private readonly gNow: Float64Array;
  private readonly elNow: Float64Array;
  /** Lowest and highest elevation of each site's mask, deg. */
  private readonly maskLowDeg: Float64Array;
  private readonly maskHighDeg: Float64Array;
  /** The scan state at the previous sample, and whether bounds hold about it (for sample reachK). */
  private readonly prevState = new Float64Array(6);
  private reachK = -1;
  private reachDevKm = Number.NaN;
  private reachTauS = 0;
  private readonly elBounds = new Float64Array(2);

  constructor(
    private readonly target: Target,
    private readonly sites: readonly Site[],
    private readonly masks: readonly PreparedMask[],
    span: Span,
    stepS: number,
    opts: SearchOptions,
  ) {
    this.nSites = sites.length;
    this.sight = typeof target.sightMarginDeg === 'function';
    this.startMs = span.startMs;
    this.endMs = span.endMs;
    this.edgeTolS = opts.edgeToleranceS;
    this.peakTolS = opts.peakToleranceS ?? DEFAULT_PEAK_TOLERANCE_S;
    this.maxIter = opts.maxIterations;
    // grid: start - h, start, start + h, ..., end, end + h (end is always a sample)
    const hMs = stepS * 1000;
    const inner = Math.ceil((span.endMs - span.startMs) / hMs);
    const t: number[] = [span.startMs - hMs];
    for (let k = 0; k < inner; k++) t.push(span.startMs + k * hMs);
    t.push(span.endMs, span.endMs + hMs);
    this.times = Float64Array.from(t);
    const memoSize = 2 * this.maxIter + 8;
    this.memoT = new Float64Array(memoSize);
    this.memoSite = new Int32Array(memoSize);
    this.memoAz = new Float64Array(memoSize);
    this.memoEl = new Float64Array(memoSize);
    this.memoRange = new Float64Array(memoSize);
    this.lazyLook = !this.sight && masks.every((m) => m.kind === 'constant');
    this.memoPos = new Float64Array(this.lazyLook ? 3 * memoSize : 0);
    this.memoLooked = new Uint8Array(memoSize);
    const n = this.nSites;
    this.gNow = new Float64Array(n);
    this.elNow = new Float64Array(n);
    this.gm1 = new Float64Array(n);
    this.gm2 = new Float64Array(n);
    this.elm1 = new Float64Array(n);
    this.elm2 = new Float64Array(n);
    this.open = new Uint8Array(n);
    this.aosRaw = new Float64Array(n);
    this.aosAz = new Float64Array(n);
    this.aosEl = new Float64Array(n);
    this.bestEl = new Float64Array(n);
    this.bestK = new Int32Array(n);
    this.aosRange = new Float64Array(n);
    this.maskLowDeg = new Float64Array(n);
    this.maskHighDeg = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const m = masks[i]!;
      this.maskLowDeg[i] = m.kind === 'constant' ? m.elevationDeg : Math.min(...m.elevationDeg);
      this.maskHighDeg[i] = m.kind === 'constant' ? m.elevationDeg : Math.max(...m.elevationDeg);
    }
    this.gOfS = (s: number) => this.gAt(this.refMs + s * 1000);
    this.elOfS = (s: number) => {
      this.gAt(this.refMs + s * 1000);
      return this.lastEl;
    };
  }

  /** g of the current site at tMs (one propagation), remembered in the memo. */
  private gAt(tMs: number): number {
    const m = this.memoN % this.memoT.length;
    this.memoN++;
    this.memoT[m] = tMs;
    this.memoSite[m] = this.curSite;
    if (!this.target.stateEcefAt(tMs, this.refState)) {
      this.memoAz[m] = 0;
      this.memoEl[m] = NO_STATE_G;
      this.memoRange[m] = Number.NaN;
      this.memoLooked[m] = 1;
      this.lastEl = NO_STATE_G;
      return NO_STATE_G;
    }
    const site = this.sites[this.curSite]!;
    if (this.lazyLook) {
      // elevationFrom: the same number as lookFrom's elevation; azimuth and range when read
      const el = elevationFrom(site, this.refState);
      this.memoEl[m] = el;
      this.memoLooked[m] = 0;
      const p = 3 * m;
      this.memoPos[p] = this.refState[0]!;
      this.memoPos[p + 1] = this.refState[1]!;
      this.memoPos[p + 2] = this.refState[2]!;
      this.lastEl = el;
      return el - (this.masks[this.curSite] as PreparedMask & { kind: 'constant' }).elevationDeg;
    }
    const look = lookFrom(site, this.refState, this.refLook);
    this.memoAz[m] = look.azimuthDeg;
    this.memoEl[m] = look.elevationDeg;
    this.memoRange[m] = look.rangeKm;
    this.memoLooked[m] = 1;
    this.lastEl = look.elevationDeg;
    const g = look.elevationDeg - maskElevationDeg(this.masks[this.curSite]!, look.azimuthDeg);
    return this.sight ? Math.min(g, this.target.sightMarginDeg!(site.ecefKm)) : g;
  }

  /** Make memo slot m's azimuth and range from its position (lookFrom's numbers), once. */
  private completeLook(m: number): void {
    if (this.memoLooked[m]) return;
    const s = this.lookState;
    const p = 3 * m;
    s[0] = this.memoPos[p]!;
    s[1] = this.memoPos[p + 1]!;
    s[2] = this.memoPos[p + 2]!;
    const look = lookFrom(this.sites[this.memoSite[m]!]!, s, this.refLook);
    this.memoAz[m] = look.azimuthDeg;
    this.memoRange[m] = look.rangeKm;
    this.memoLooked[m] = 1;
  }

  /** The memo slot of the current site's evaluation at tMs (the latest), or -1. */
  private memoIndex(tMs: number): number {
    const size = this.memoT.length;
    const first = Math.max(0, this.memoN - size);
    const site = this.curSite;
    for (let j = this.memoN - 1; j >= first; j--) {
      const m = j % size;
      if (this.memoT[m] === tMs && this.memoSite[m] === site) return m;
    }
    return -1;
  }

  /** Azimuth/elevation at tMs for the current site: from the memo, else one evaluation. */
  private lookAt(tMs: number): void {
    let m = this.memoIndex(tMs);
    if (m < 0) {
      this.gAt(tMs);
      m = (this.memoN - 1) % this.memoT.length;
    }
    this.completeLook(m);
    this.refLook.azimuthDeg = this.memoAz[m]!;
    this.refLook.elevationDeg = this.memoEl[m]!;
    this.refLook.rangeKm = this.memoRange[m]!;
  }

  /** Slant range at tMs for the current site if the memo holds that evaluation, else NaN. */
  private memoRangeAt(tMs: number): number {
    const m = this.memoIndex(tMs);
    if (m < 0) return Number.NaN;
    this.completeLook(m);
    return this.memoRange[m]!;
  }

  /** Visible-side time of the g crossing between (aMs, ga) and (bMs, gb). */
  private boundary(aMs: number, ga: number, bMs: number, gb: number): number {
    this.refMs = aMs;
    const s = brentBoundary(this.gOfS, 0, ga, (bMs - aMs) / 1000, gb, this.edgeTolS, this.maxIter);
    return aMs + s * 1000;
  }

  /** Maximum (sign = 1) or minimum (sign = -1) of g on [aMs, bMs] from (x0Ms, g0). */
  private extremumG(aMs: number, bMs: number, x0Ms: number, g0: number, sign: 1 | -1): MaxResult {
    this.refMs = aMs;
    const f = sign === 1 ? this.gOfS : (s: number) => -this.gOfS(s);
    const r = brentMax(f, 0, (bMs - aMs) / 1000, (x0Ms - aMs) / 1000, sign * g0, this.edgeTolS, this.maxIter, this.maxOut);
    r.x = aMs + r.x * 1000;
    r.f *= sign;
    return r;
  }

  run(): Pass[] {
    const times = this.times;
    const n = this.nSites;
    let last = times.length - 1;
    let trackEnded = false;
    for (let k = 0; k < times.length; k++) {
      let t = times[k]!;
      if (!this.target.stateEcefAt(t, this.scanState)) {
        if (k === 0) return this.passes; // no state at the first sample: no track at all
        const end = this.trackEnd(times[k - 1]!, t);
        if (end === undefined) {
          last = k - 1;
          trackEnded = true;
          break;
        }
        t = end;
        times[k] = end;
        last = k;
        trackEnded = true;
      }
      // every site's g from this one state first: a refinement below moves the target's state
      for (let i = 0; i < n; i++) {
        const mask = this.masks[i]!;
        let el: number;
        let g: number;
        if (mask.kind === 'constant') {
          // no azimuth needed: the elevation alone (the same number as lookFrom's)
          el = elevationFrom(this.sites[i]!, this.scanState);
          g = el - mask.elevationDeg;
        } else {
          const look = lookFrom(this.sites[i]!, this.scanState, this.scanLook);
          el = look.elevationDeg;
          g = el - maskElevationDeg(mask, look.azimuthDeg);
        }
        if (this.sight) g = Math.min(g, this.target.sightMarginDeg!(this.sites[i]!.ecefKm));
        this.gNow[i] = g;
        this.elNow[i] = el;
      }
      for (let i = 0; i < n; i++) {
        const g = this.gNow[i]!;
        this.curSite = i;
        this.sample(i, k, t, g);
        this.gm2[i] = this.gm1[i]!;
        this.elm2[i] = this.elm1[i]!;
        this.gm1[i] = g;
        this.elm1[i] = this.elNow[i]!;
      }
      this.prevState.set(this.scanState);
      if (trackEnded) break;
    }
    // close windows still open at the last sample (span end, or the track's end)
    for (let i = 0; i < n; i++) {
      if (!this.open[i]) continue;
      this.curSite = i;
      if (last >= 1) this.fold(i, last - 1, this.gm2[i]!, this.elm2[i]!);
      this.fold(i, last, this.gm1[i]!, this.elm1[i]!);
      this.emit(i, times[last]!, Number.NaN, Number.NaN, trackEnded);
    }
    this.passes.sort((a, b) => a.aosMs - b.aosMs);
    return this.passes;
  }

  /** Last time with a state between a good time and a failing one (bisection). */
  private trackEnd(goodMs: number, badMs: number): number | undefined {
    const tolMs = this.edgeTolS * 1000;
    let lo = goodMs;
    let hi = badMs;
    for (let it = 0; hi - lo > tolMs; it++) {
      if (it >= this.maxIter) throw new Error(`${MODEL}: track-end bisection exceeded ${this.maxIter} iterations`);
      const mid = 0.5 * (lo + hi);
      if (this.target.stateEcefAt(mid, this.scanState)) lo = mid;
      else hi = mid;
    }
    return this.target.stateEcefAt(lo, this.scanState) ? lo : undefined;
  }

  /** Count sample k (value g, elevation el) towards the peak of site i's open window. */
  private fold(i: number, k: number, g: number, el: number): void {
    const t = this.times[k]!;
    if (!(g > 0) || t < this.aosRaw[i]! || t < this.startMs || t > this.endMs) return;
    if (el > this.bestEl[i]!) {
      this.bestEl[i] = el;
      this.bestK[i] = k;
    }
  }

  private openWindow(i: number, aosMs: number): void {
    this.open[i] = 1;
    this.aosRaw[i] = aosMs;
    if (aosMs >= this.startMs && aosMs < this.endMs) {
      this.lookAt(aosMs);
      this.aosAz[i] = this.refLook.azimuthDeg;
      this.aosEl[i] = this.refLook.elevationDeg;
      this.aosRange[i] = this.refLook.rangeKm;
    }
    this.bestEl[i] = Number.NEGATIVE_INFINITY;
    this.bestK[i] = -1;
  }

  private sample(i: number, k: number, t: number, g: number): void {
    if (k === 0) {
      if (g > 0) this.openWindow(i, Number.NEGATIVE_INFINITY);
      return;
    }
    const times = this.times;
    const tPrev = times[k - 1]!;
    const gPrev = this.gm1[i]!;
    const gPrev2 = this.gm2[i]!;
    if (this.open[i]) {
      if (k >= 2) this.fold(i, k - 2, gPrev2, this.elm2[i]!);
      if (!(g > 0)) {
        // LOS in (tPrev, t]
        this.fold(i, k - 1, gPrev, this.elm1[i]!);
        if (t <= this.startMs) this.open[i] = 0; // ended before the span
        else if (tPrev >= this.endMs) this.emit(i, Number.POSITIVE_INFINITY, Number.NaN, Number.NaN, false);
        else this.emitAt(i, this.boundary(tPrev, gPrev, t, g), false);
      } else if (k >= 2 && gPrev2 > 0 && gPrev < gPrev2 && gPrev <= g && !this.surelyAboveMask(i, k)) {
        // a dip inside the window: does it go below the mask between samples?
        const tPrev2 = times[k - 2]!;
        const r = this.extremumG(tPrev2, t, tPrev, gPrev, -1);
        if (!(r.f > 0)) {
          const tMin = r.x;
          const gMin = r.f;
          const los = this.boundary(tPrev2, gPrev2, tMin, gMin);
          if (tPrev < los) this.fold(i, k - 1, gPrev, this.elm1[i]!);
          this.emitAt(i, los, false);
          this.openWindow(i, this.boundary(tMin, gMin, t, g));
        }
      }
      return;
    }
    if (g > 0) {
      // AOS in (tPrev, t]
      if (t <= this.startMs) this.openWindow(i, Number.NEGATIVE_INFINITY); // rose before the span
      else if (tPrev >= this.endMs) this.openWindow(i, Number.POSITIVE_INFINITY); // rises after it
      else this.openWindow(i, this.boundary(tPrev, gPrev, t, g));
    } else if (k >= 2 && gPrev > gPrev2 && gPrev >= g && !(gPrev > 0) && !(gPrev2 > 0) && !this.surelyBelowMask(i, k)) {
      // a peak between samples that are all below the mask: a short window?
      const tPrev2 = times[k - 2]!;
      const r = this.extremumG(tPrev2, t, tPrev, gPrev, 1);
      if (r.f > 0) {
        const tMax = r.x;
        const gMax = r.f;
        const aos = this.boundary(tPrev2, gPrev2, tMax, gMax);
        const los = this.boundary(tMax, gMax, t, g);
        this.openWindow(i, aos);
        this.emitAt(i, los, false);
      }
    }
  }

  /**
   * Bounds of site i's elevation (reach.ts elevationBoundsDeg) over [times[k-2], times[k]]
   * from the target's state at times[k-1], into elBounds; false when none holds (not a
   * one-set SGP4 track there, a track that has failed, a degenerate geometry).
   */
  private elevationBounds(i: number, k: number): boolean {
    if (this.reachK !== k) {
      this.reachK = k;
      const t0 = this.times[k - 2]!;
      const t1 = this.times[k - 1]!;
      const t2 = this.times[k]!;
      this.reachTauS = Math.max(t1 - t0, t2 - t1) / 1000;
      this.reachDevKm =
        this.target.failedAtMs === undefined && sgp4SmoothOver(this.target, t0, t2) ? lineDeviationKm(this.prevState, this.reachTauS) : Number.NaN;
    }
    return this.reachDevKm >= 0 && elevationBoundsDeg(this.sites[i]!, this.prevState, this.reachTauS, this.elBounds, this.reachDevKm);
  }

  /**
   * True when g cannot rise above 0 on [times[k-2], times[k]] (site i): then the short-window
   * maximiser's best g, a value of g there, is <= 0 and it would add nothing.
   */
  private surelyBelowMask(i: number, k: number): boolean {
    return this.elevationBounds(i, k) && this.elBounds[1]! - this.maskLowDeg[i]! + 1e-9 <= 0;
  }

  /** True when g cannot fall to 0 on [times[k-2], times[k]] (site i): the dip's minimiser would not split the window. */
  private surelyAboveMask(i: number, k: number): boolean {
    return this.elevationBounds(i, k) && this.elBounds[0]! - this.maskHighDeg[i]! - 1e-9 > 0;
  }

  /** Close site i's window at losMs (look read from the memo or evaluated). */
  private emitAt(i: number, losMs: number, trackEnded: boolean): void {
    this.lookAt(losMs);
    this.emit(i, losMs, this.refLook.azimuthDeg, this.refLook.elevationDeg, trackEnded, this.refLook.rangeKm);
  }

  /** Cut site i's open window [aosRaw, losMs] to the span, refine its peak, record it. */
  private emit(i: number, losRawMs: number, losAzIn: number, losElIn: number, trackEnded: boolean, losRangeIn = Number.NaN): void {
    this.open[i] = 0;
    const aosRaw = this.aosRaw[i]!;
    if (losRawMs <= this.startMs || aosRaw >= this.endMs) return;
    let aosMs = aosRaw;
    let aosAz = this.aosAz[i]!;
    let aosEl = this.aosEl[i]!;
    let aosRange = this.aosRange[i]!;
    let aosClipped = false;
    if (aosMs < this.startMs) {
      aosMs = this.startMs;
      aosClipped = true;
      this.lookAt(aosMs);
      aosAz = this.refLook.azimuthDeg;
      aosEl = this.refLook.elevationDeg;
      aosRange = this.refLook.rangeKm;
    }
    let losMs = losRawMs;
    let losAz = losAzIn;
    let losEl = losElIn;
    let losRange = losRangeIn;
    let losClipped = false;
    if (losMs > this.endMs) {
      losMs = this.endMs;
      losClipped = true;
      trackEnded = false;
    }
    if (losClipped || Number.isNaN(losAz)) {
      this.lookAt(losMs);
      losAz = this.refLook.azimuthDeg;
      losEl = this.refLook.elevationDeg;
      losRange = this.refLook.rangeKm;
    }
    // peak: refine around the best sample, or over the whole (short) window
    let lo = aosMs;
    let hi = losMs;
    let x0: number;
    let e0: number;
    const k = this.bestK[i]!;
    if (k >= 0) {
      x0 = this.times[k]!;
      e0 = this.bestEl[i]!;
      if (k >= 1) lo = Math.max(lo, this.times[k - 1]!);
      if (k + 1 < this.times.length) hi = Math.min(hi, this.times[k + 1]!);
    } else {
      x0 = 0.5 * (aosMs + losMs);
      this.refMs = x0;
      e0 = this.elOfS(0);
    }
    this.refMs = lo;
    const r = brentMax(this.elOfS, 0, (hi - lo) / 1000, (x0 - lo) / 1000, e0, this.peakTolS, this.maxIter, this.maxOut);
    let tcaMs = lo + r.x * 1000;
    let maxEl = r.f;
    let tcaRange = this.memoRangeAt(tcaMs);
    if (aosEl > maxEl) {
      maxEl = aosEl;
      tcaMs = aosMs;
      tcaRange = aosRange;
    }
    if (losEl > maxEl) {
      maxEl = losEl;
      tcaMs = losMs;
      tcaRange = losRange;
    }
    const pass: Pass = {
      spacecraftId: this.target.spacecraftId,
      stationId: this.sites[i]!.stationId,
      aosMs,
      losMs,
      tcaMs,
      maxElevationDeg: maxEl,
      aosAzimuthDeg: aosAz,
      losAzimuthDeg: losAz,
      aosElevationDeg: aosEl,
      losElevationDeg: losEl,
      aosClipped,
      losClipped,
      losTrackEnded: trackEnded,
    };
    this.passes.push(pass);
    this.rangesKm.set(pass, Float64Array.of(aosRange, tcaRange, losRange));
  }
}
