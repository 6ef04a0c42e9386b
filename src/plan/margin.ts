/**
 * Worst-case elevation margin per station and spacecraft (data radio = radios[0]).
 *
 * Rules:
 * - Check elevation ("mask elevation"): the lowest elevation at which the station takes
 *   data: max(lowest point of the horizon mask, LinkSettings.minDataElevationDeg, 0).
 *   For an azimuth profile the lowest point is used: somewhere on the horizon the
 *   spacecraft can be that low, and the check must hold there.
 * - A target that never rises or sets over the station in the span (every contact of
 *   the pair is cut by both span edges: a geostationary craft) never comes down to the
 *   mask: its check elevation is the lowest elevation it actually reaches, sampled every
 *   ALWAYS_VISIBLE_SAMPLE_S over the span (if above the mask).
 * - Worst range: the target's largest geocentric distance over the span (for an SGP4
 *   orbit its apogee as flown; for the Moon its farthest distance; for a fixed-sky
 *   craft its fixed range), found by sampling every MAX_RADIUS_SAMPLE_S and refining
 *   the best sample by golden-section search; the slant range at the check elevation
 *   follows from the plane triangle Earth centre - station - spacecraft (law of
 *   cosines, spherical geometry):
 *       r^2 = R^2 + rho^2 + 2 R rho sin(e)  =>  rho = sqrt(r^2 - R^2 cos^2 e) - R sin e
 *   with R the station's geocentric distance (WGS-84, src/geometry/earth.ts) and e the
 *   elevation taken from the geocentric vertical (the angle at the station is 90 deg + e).
 *   Plane trigonometry; the usual slant-range relation of satellite-link texts (common
 *   practice). The geodetic-minus-
 *   geocentric vertical (at most 0.19 deg) is neglected: ~0.03 dB in free-space loss
 *   for a LEO at 5 deg. Valid for r >= R.
 * - The budget there: prepareRadioAtStation (atmosphere at the scenario's availability,
 *   table from 0 deg) + evaluateLink at (elevation, worst range, range rate 0). Its
 *   closure margin is net of the radio's required margin (src/link/budget.ts). For a
 *   lunar target the Moon's noise is added as if its disc were centred in the beam (the
 *   worst case, worstMoonTempK); the Sun is left out (its outages are listed by plan). The row
 *   PASSES when it is >= 0. For adaptive coding it is the margin above the most robust
 *   entry's threshold (not above the entry in use, which is about 0 by construction);
 *   it is >= 0 exactly when some MODCOD closes with the required margin.
 * - Usable data mask: the lowest elevation e* such that the margin is >= 0 at every
 *   elevation from e* to 90 deg at the same worst-case range model rho(e; r_max): a
 *   downward scan every USABLE_SCAN_STEP_DEG, then bisection to USABLE_TOLERANCE_DEG.
 *   null when the link does not close even at 90 deg; USABLE_FLOOR_DEG when it closes
 *   down to the horizon.
 * - Worst margin seen: the lowest ContactLink.worstMarginDb of the pair's contacts in the
 *   plan (null when the pair had no contact with a link in the span).
 * - Result: 'pass' / 'fail' by the margin at the check elevation; a pair with no contact
 *   in the span (the spacecraft never rises over that station's mask) is 'not visible':
 *   neither pass nor fail, and it does not set the exit code. A spacecraft with no orbit
 *   state in the span fails (a gate must not pass silently). A pair whose station has no
 *   feed covering the radio's frequency has no link to check: 'no feed', neither pass nor fail.
 * Pure: no I/O.
 */
import { ModelRangeError } from '../errors.js';
import { lookFrom, newLook } from '../geometry/topocentric.js';
import { slantRangeKm } from '../geometry/slant.js';
import { knownNodeRadiusKm } from '../geometry/interpolate.js';
import type { Look, Site, Target } from '../geometry/types.js';
import { evaluateLink } from '../link/budget.js';
import { discAntennaTempK } from '../link/body-noise.js';
import { MOON_MEAN_RADIUS_KM } from '../geometry/targets/moon-ephemeris.js';
import { newLinkSample, type LinkSample, type PreparedLink } from '../link/types.js';
import type { LinkSettings, Scenario, Span, Station } from '../scenario/types.js';
import { prepareGeometry, type Geometry } from './contacts.js';
import { linkKey, lowestMaskDeg, prepareRadioAtStation, radioHeardAt } from './link.js';
import type { Contact, PlanResult } from './types.js';
import type { AtmosphereTable } from '../link/atmosphere/types.js';

/** Sampling step of the largest-distance search, s (a LEO period is ~5,700 s). */
export const MAX_RADIUS_SAMPLE_S = 60;
/** Golden-section tolerance of the largest-distance refinement, s. */
export const MAX_RADIUS_TOLERANCE_S = 0.01;
export const USABLE_SCAN_STEP_DEG = 0.5;
/** Sampling step for the lowest elevation of an always-visible target, s. */
export const ALWAYS_VISIBLE_SAMPLE_S = 300;
export const USABLE_TOLERANCE_DEG = 1e-4;
/** Lowest elevation the usable-mask search goes to, deg (the geometric horizon). */
export const USABLE_FLOOR_DEG = 0;

const DEG_TO_RAD = Math.PI / 180;

export interface MarginRow {
  station: string;
  spacecraft: string;
  radioId: string;
  /** The check elevation (see the head comment), deg. */
  maskElevationDeg: number;
  /** Largest geocentric distance of the target over the span, km, and when. */
  maxRadiusKm: number;
  maxRadiusAtMs: number;
  /** Slant range at the check elevation for that distance, km. */
  worstRangeKm: number;
  /** Margin at (check elevation, worst range), net of the required margin, dB. */
  maskMarginDb: number;
  /** What carries data there ('' when the link does not close). */
  maskModcod: string;
  maskRateBps: number;
  /** Lowest elevation from which the link closes up to 90 deg, deg; null: never. */
  usableMaskDeg: number | null;
  /** Lowest margin of the pair's contacts in the plan, dB; null: no contact. */
  worstSeenMarginDb: number | null;
  contacts: number;
  /** True only when result is 'pass'. */
  pass: boolean;
  result: MarginResult;
}

export type MarginResult = 'pass' | 'fail' | 'not visible' | 'no feed';

/** True when no row fails ('not visible' rows neither pass nor fail). */
export function marginGatePasses(rows: readonly MarginRow[]): boolean {
  return rows.every((r) => r.result !== 'fail');
}

export interface MarginOptions {
  radiusSampleS?: number;
  toleranceDeg?: number;
  /** Atmosphere tables kept across calls (keyed by their inputs: a worker's batches share them). */
  tables?: Map<string, AtmosphereTable>;
}

/** Slant range (km) at elevation e of a target at geocentric distance r from a station at R. */
export function slantRangeAtElevationKm(stationRadiusKm: number, targetRadiusKm: number, elevationDeg: number): number {
  if (!(elevationDeg >= -90 && elevationDeg <= 90)) throw new ModelRangeError('plan/margin slant range', 'elevationDeg', elevationDeg, '-90..90');
  if (targetRadiusKm === stationRadiusKm) return elevationDeg >= 0 ? 0 : 2 * stationRadiusKm * Math.sin(-elevationDeg * DEG_TO_RAD);
  return slantRangeKm(stationRadiusKm, targetRadiusKm, elevationDeg);
}

/**
 * Largest geocentric distance of `target` over `span`: samples every `sampleS`, then a
 * golden-section search around the best sample. undefined when no state exists.
 */
export function maxGeocentricRadiusKm(target: Target, span: Span, sampleS = MAX_RADIUS_SAMPLE_S): { radiusKm: number; atMs: number } | undefined {
  const state = new Float64Array(6);
  const radius = (tMs: number): number => (target.stateEcefAt(tMs, state) ? Math.hypot(state[0]!, state[1]!, state[2]!) : -Infinity);
  const stepMs = sampleS * 1000;
  let bestMs = Number.NaN;
  let best = -Infinity;
  for (let tMs = span.startMs; tMs <= span.endMs; tMs += stepMs) {
    // a sample the link stage's interpolator already propagated gives the same distance (geometry/interpolate.ts)
    const r = knownNodeRadiusKm(target, span.startMs, stepMs, tMs) ?? radius(tMs);
    if (r > best) {
      best = r;
      bestMs = tMs;
    }
  }
  const rEnd = radius(span.endMs);
  if (rEnd > best) {
    best = rEnd;
    bestMs = span.endMs;
  }
  if (!Number.isFinite(best)) return undefined;
  // golden-section maximisation on [best - step, best + step] clipped to the span
  let a = Math.max(span.startMs, bestMs - stepMs);
  let b = Math.min(span.endMs, bestMs + stepMs);
  const g = (Math.sqrt(5) - 1) / 2;
  let x1 = b - g * (b - a);
  let x2 = a + g * (b - a);
  let f1 = radius(x1);
  let f2 = radius(x2);
  for (let i = 0; i < 200 && b - a > MAX_RADIUS_TOLERANCE_S * 1000; i++) {
    if (f1 >= f2) {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - g * (b - a);
      f1 = radius(x1);
    } else {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + g * (b - a);
      f2 = radius(x2);
    }
  }
  const mid = 0.5 * (a + b);
  const rMid = radius(mid);
  return rMid > best ? { radiusKm: rMid, atMs: mid } : { radiusKm: best, atMs: bestMs };
}

/** The elevation the check is made at: max(lowest mask point (>= 0), minimum data elevation). */
export function checkElevationDeg(station: Station, settings: LinkSettings): number {
  return Math.max(lowestMaskDeg(station), settings.minDataElevationDeg);
}

/** Evaluates `link` at elevation e and the slant range of a target at distance r, into `out`. */
export function marginAtElevation(
  link: PreparedLink,
  stationRadiusKm: number,
  targetRadiusKm: number,
  elevationDeg: number,
  look: Look,
  out: LinkSample,
  lunar = false,
  /** Also the reference columns (Shannon capacity, Doppler): evaluateLink's `full`. */
  full = true,
): number {
  look.azimuthDeg = 0;
  look.elevationDeg = elevationDeg;
  look.rangeKm = slantRangeAtElevationKm(stationRadiusKm, targetRadiusKm, elevationDeg);
  look.rangeRateKmS = 0;
  evaluateLink(link, look, out, full, lunar ? worstMoonTempK(link, look.rangeKm) : 0);
  return out.closureMarginDb;
}

/**
 * A lunar target's Moon noise in the worst case: the Moon's disc centred in the beam
 * (link/body-noise.ts), at the distance of the check, K.
 */
export function worstMoonTempK(link: PreparedLink, rangeKm: number): number {
  const radiusDeg = (Math.asin(Math.min(1, MOON_MEAN_RADIUS_KM / rangeKm)) * 180) / Math.PI;
  return discAntennaTempK(link.moonBrightnessK, radiusDeg, 0, link.rxBeamwidthDeg);
}

/** Usable data mask (see the head comment): deg, or null when the link never closes. */
export function usableMaskDeg(link: PreparedLink, stationRadiusKm: number, targetRadiusKm: number, toleranceDeg = USABLE_TOLERANCE_DEG, lunar = false): number | null {
  const look = newLook();
  const s = newLinkSample();
  const closes = (e: number) => marginAtElevation(link, stationRadiusKm, targetRadiusKm, e, look, s, lunar, false) >= 0;
  if (!closes(90)) return null;
  let hi = 90;
  for (let k = 1; ; k++) {
    const e = Math.max(USABLE_FLOOR_DEG, 90 - k * USABLE_SCAN_STEP_DEG);
    if (!closes(e)) {
      let lo = e;
      for (let i = 0; i < 100 && hi - lo > toleranceDeg; i++) {
        const mid = 0.5 * (lo + hi);
        if (closes(mid)) hi = mid;
        else lo = mid;
      }
      return hi;
    }
    hi = e;
    if (e <= USABLE_FLOOR_DEG) return USABLE_FLOOR_DEG;
  }
}

function modcodName(link: PreparedLink, s: LinkSample): string {
  if (s.closureMarginDb < 0) return '';
  if (link.codingKind === 'fixed') return link.codingName;
  return link.modcodTable[s.modcodIndex]?.name ?? '';
}

/** Lowest elevation of the target seen from the site over the span, deg (sampled). */
function lowestElevationDeg(target: Target, site: Site, span: Span, look: Look): number {
  const state = new Float64Array(6);
  let lowest = Infinity;
  for (let t = span.startMs; t <= span.endMs; t += ALWAYS_VISIBLE_SAMPLE_S * 1000) {
    if (!target.stateEcefAt(t, state)) continue;
    lookFrom(site, state, look);
    if (look.elevationDeg < lowest) lowest = look.elevationDeg;
  }
  return lowest;
}

/**
 * One row per station and spacecraft with a data radio (station order, then spacecraft
 * order), for the plan's scenario and span. Pure; the HTML report may call it.
 */
export function marginRows(scenario: Scenario, plan: PlanResult, opts: MarginOptions = {}, prepared?: Geometry): MarginRow[] {
  const geometry = prepared ?? prepareGeometry(scenario, plan.span);
  const radii = new Map<string, { radiusKm: number; atMs: number } | undefined>();
  for (const sc of scenario.spacecraft) {
    const target = geometry.targets.get(sc.id);
    if (sc.radios[0] && target) radii.set(sc.id, maxGeocentricRadiusKm(target, plan.span, opts.radiusSampleS));
  }
  const rows: MarginRow[] = [];
  const look = newLook();
  const sample = newLinkSample();
  // contacts of each pair, in plan order, gathered in one pass; atmosphere tables shared
  const byPair = new Map<string, Contact[]>();
  for (const c of plan.contacts) {
    const key = linkKey(c.spacecraftId, c.stationId);
    const list = byPair.get(key);
    if (list) list.push(c);
    else byPair.set(key, [c]);
  }
  const tables = opts.tables ?? new Map<string, AtmosphereTable>();
  scenario.stations.forEach((station, i) => {
    const site = geometry.sites[i]!;
    const stationRadiusKm = Math.hypot(site.ecefKm[0], site.ecefKm[1], site.ecefKm[2]);
    const maskCheckDeg = checkElevationDeg(station, scenario.link);
    for (const sc of scenario.spacecraft) {
      const radio = sc.radios[0];
      const far = radii.get(sc.id);
      if (!radio) continue;
      if (!far) {
        // No orbit state anywhere in the span (e.g. decayed before it): nothing can be
        // checked, and a gate must not pass silently.
        rows.push({
          station: station.id,
          spacecraft: sc.id,
          radioId: radio.id,
          maskElevationDeg: maskCheckDeg,
          maxRadiusKm: Number.NaN,
          maxRadiusAtMs: Number.NaN,
          worstRangeKm: Number.NaN,
          maskMarginDb: Number.NaN,
          maskModcod: 'no orbit state in the span',
          maskRateBps: 0,
          usableMaskDeg: null,
          worstSeenMarginDb: null,
          contacts: 0,
          pass: false,
          result: 'fail',
        });
        continue;
      }
      const contacts = byPair.get(linkKey(sc.id, station.id)) ?? [];
      if (!radioHeardAt(station, radio)) {
        rows.push({
          station: station.id,
          spacecraft: sc.id,
          radioId: radio.id,
          maskElevationDeg: maskCheckDeg,
          maxRadiusKm: far.radiusKm,
          maxRadiusAtMs: far.atMs,
          worstRangeKm: Number.NaN,
          maskMarginDb: Number.NaN,
          maskModcod: 'no feed covers the radio',
          maskRateBps: 0,
          usableMaskDeg: null,
          worstSeenMarginDb: null,
          contacts: contacts.length,
          pass: false,
          result: 'no feed',
        });
        continue;
      }
      let elevationDeg = maskCheckDeg;
      const target = geometry.targets.get(sc.id);
      if (target && contacts.length > 0 && contacts.every((c) => c.aosClipped && c.losClipped)) {
        elevationDeg = Math.max(maskCheckDeg, lowestElevationDeg(target, site, plan.span, look));
      }
      const link = prepareRadioAtStation(radio, station, site, scenario.link, USABLE_FLOOR_DEG, tables);
      const lunar = sc.orbit.kind === 'moon' || sc.orbit.kind === 'lunarSite' || sc.orbit.kind === 'lunarOrbit';
      const maskMarginDb = marginAtElevation(link, stationRadiusKm, far.radiusKm, elevationDeg, look, sample, lunar);
      let worstSeen: number | null = null;
      for (const c of contacts) {
        if (c.link && (worstSeen === null || c.link.worstMarginDb < worstSeen)) worstSeen = c.link.worstMarginDb;
      }
      rows.push({
        station: station.id,
        spacecraft: sc.id,
        radioId: radio.id,
        maskElevationDeg: elevationDeg,
        maxRadiusKm: far.radiusKm,
        maxRadiusAtMs: far.atMs,
        worstRangeKm: look.rangeKm,
        maskMarginDb,
        maskModcod: modcodName(link, sample),
        maskRateBps: sample.rateBps,
        usableMaskDeg: usableMaskDeg(link, stationRadiusKm, far.radiusKm, opts.toleranceDeg, lunar),
        worstSeenMarginDb: worstSeen,
        contacts: contacts.length,
        pass: contacts.length > 0 && maskMarginDb >= 0,
        result: contacts.length === 0 ? 'not visible' : maskMarginDb >= 0 ? 'pass' : 'fail',
      });
    }
  });
  return rows;
}
