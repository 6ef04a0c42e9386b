/**
 * Contact windows for a scenario: one target per spacecraft, one site per
 * station, every window of every pair inside the span. Element-set age and
 * ended tracks (decay, SGP4 errors) become warnings, said once each; so do an
 * ephemeris file that covers only part of the span (the search runs inside its
 * coverage) and a deep-space craft near solar conjunction. Times are received times;
 * each contact also carries the transmit times of AOS and LOS and the light time.
 */
import { makeSite } from '../geometry/earth.js';
import { prepareMask, type PreparedMask } from '../geometry/mask.js';
import { findPassesWithRanges } from '../geometry/passes.js';
import { makeSgp4Target, elementAgeWarning, isSgp4Target } from '../geometry/targets/sgp4.js';
import { makeMoonTarget } from '../geometry/targets/moon.js';
import { makeFixedSkyTarget } from '../geometry/targets/fixedSky.js';
import { makeEphemerisTarget } from '../geometry/targets/ephemeris.js';
import { makeLunarSiteTarget } from '../geometry/targets/lunar.js';
import { makeLunarOrbitTarget } from '../geometry/targets/lunar-orbit.js';
import { lightTimeS } from '../geometry/light-time.js';
import { lookFrom, newLook } from '../geometry/topocentric.js';
import { SkyBodies } from '../geometry/sky-bodies.js';
import { DEFAULT_SEARCH, type Pass, type SearchOptions, type Site, type Target } from '../geometry/types.js';
import type { Scenario, Spacecraft, Span } from '../scenario/types.js';
import { isoUtc } from '../time/format.js';
import type { Contact, WarningOrigin } from './types.js';

export function makeTarget(sc: Spacecraft, span: Span): Target {
  const o = sc.orbit;
  switch (o.kind) {
    case 'elements':
      return makeSgp4Target(sc.id, o.sets);
    case 'moon':
      return makeMoonTarget(sc.id, span);
    case 'fixedSky':
      return makeFixedSkyTarget(sc.id, o.rightAscensionDeg, o.declinationDeg, o.rangeKm, span);
    case 'ephemeris':
      return makeEphemerisTarget(sc.id, o.ephemeris, span, o.grazingMarginKm);
    case 'lunarSite':
      return makeLunarSiteTarget(sc.id, o.site, span);
    case 'lunarOrbit':
      return makeLunarOrbitTarget(sc.id, o.elements, span);
  }
}

export interface Geometry {
  sites: Site[];
  masks: PreparedMask[];
  /** Targets by spacecraft id, in scenario order. */
  targets: Map<string, Target>;
  span: Span;
  /** The Sun and the Moon over the span (noise in the beam, Sun outages, Sun-Earth-probe angle); built on first use. */
  readonly sky: SkyBodies;
}

export function prepareGeometry(scenario: Scenario, span: Span): Geometry {
  const sites = scenario.stations.map((s) => makeSite(s.id, s.latitudeDeg, s.longitudeDeg, s.heightKm));
  const masks = scenario.stations.map((s) => prepareMask(s.mask));
  const targets = new Map<string, Target>();
  for (const sc of scenario.spacecraft) targets.set(sc.id, makeTarget(sc, span));
  let sky: SkyBodies | undefined;
  return {
    sites,
    masks,
    targets,
    span,
    get sky(): SkyBodies {
      return (sky ??= skyBodiesFor(span));
    },
  };
}

/** The last span's SkyBodies: a worker's batches share one span, and the tables depend on nothing else. */
let lastSky: { startMs: number; endMs: number; sky: SkyBodies } | undefined;

/**
 * SkyBodies of a span, built once for consecutive runs over the same span: its answers are
 * a function of the time alone (the memo of its last time only saves work), so sharing it
 * changes no value.
 */
export function skyBodiesFor(span: Span): SkyBodies {
  if (lastSky === undefined || lastSky.startMs !== span.startMs || lastSky.endMs !== span.endMs) {
    lastSky = { startMs: span.startMs, endMs: span.endMs, sky: new SkyBodies(span) };
  }
  return lastSky.sky;
}

export interface ContactSearch {
  contacts: Contact[];
  warnings: string[];
  /** warningOrigins[i]: the spacecraft warnings[i] is about. */
  warningOrigins: WarningOrigin[];
  propagations: number;
}

/** Every window of every spacecraft over every station, ordered by station then AOS. */
export function findContacts(scenario: Scenario, geometry: Geometry, span: Span, search: SearchOptions = DEFAULT_SEARCH): ContactSearch {
  const warnings: string[] = [];
  const warningOrigins: WarningOrigin[] = [];
  const contacts: Contact[] = [];
  let propagations = 0;
  for (const sc of scenario.spacecraft) {
    const target = geometry.targets.get(sc.id);
    if (!target) continue;
    if (sc.orbit.kind === 'elements') {
      const age = elementAgeWarning(sc.orbit.sets, span);
      if (age) {
        warnings.push(`${sc.id}: ${age}`);
        warningOrigins.push({ spacecraftId: sc.id });
      }
    }
    if (sc.orbit.kind === 'lunarOrbit') {
      const e = sc.orbit.elements.epochMs;
      const days = Math.max(Math.abs(span.startMs - e), Math.abs(span.endMs - e)) / 86_400_000;
      if (days > LUNAR_ELEMENTS_WARNING_DAYS) {
        warnings.push(`${sc.id}: its lunar elements (epoch ${isoUtc(e, 0)}) are up to ${days.toFixed(0)} days from the window; two-body motion about the Moon drifts by kilometres per day (use an OEM from flight dynamics)`);
      }
    }
    const before = target.evaluations;
    let searchSpan = span;
    const cov = target.coverage;
    if (cov !== undefined && (cov.startMs > span.startMs || cov.endMs < span.endMs)) {
      searchSpan = { startMs: Math.max(span.startMs, cov.startMs), endMs: Math.min(span.endMs, cov.endMs) };
      warnings.push(`${sc.id}: its ephemeris covers ${isoUtc(cov.startMs, 0)} .. ${isoUtc(cov.endMs, 0)} only (usable span less the light time); no contacts outside it`);
    }
    if (searchSpan.endMs > searchSpan.startMs) {
      const siteOf = new Map(geometry.sites.map((s) => [s.stationId, s]));
      const found = findPassesWithRanges(target, geometry.sites, geometry.masks, searchSpan, search);
      const ranges = isSgp4Target(target) ? found.rangesKm : undefined;
      for (const p of found.passes) contacts.push(contactOf(p, transmitTimes(target, siteOf.get(p.stationId)!, p, ranges?.get(p))));
    }
    propagations += target.evaluations - before;
    const conjunction = solarConjunctionWarning(target, () => geometry.sky, span);
    if (conjunction) warnings.push(`${sc.id}: ${conjunction}`);
    if (target.failedAtMs !== undefined) {
      warnings.push(`${sc.id}: track ends at ${isoUtc(target.failedAtMs, 0)}: ${target.failureReason ?? 'SGP4 error'}; no contacts after it`);
      warningOrigins.push({ spacecraftId: sc.id });
    }
  }
  // order: station (file order), AOS, spacecraft (file order); keys computed once
  const order = new Map(scenario.stations.map((s, i) => [s.id, i]));
  const scOrder = new Map(scenario.spacecraft.map((s, i) => [s.id, i]));
  const keyed = contacts.map((c) => ({ c, st: order.get(c.stationId) ?? 0, sc: scOrder.get(c.spacecraftId) ?? 0 }));
  keyed.sort((a, b) => a.st - b.st || a.c.aosMs - b.c.aosMs || a.sc - b.sc);
  for (let i = 0; i < keyed.length; i++) contacts[i] = keyed[i]!.c;
  return { contacts, warnings, warningOrigins, propagations };
}

/**
 * The contact of a window found by the search: its fields, the duration and the transmit
 * times, in that order. One object literal (not spreads) so that every contact has the same
 * hidden class and the stages after the search read them at one shape; the keys and values
 * are those of { ...pass, durationS, ...times } (the search sets every field of a Pass).
 */
function contactOf(p: Pass, times: Pick<Contact, 'aosTransmitMs' | 'losTransmitMs' | 'lightTimeS'>): Contact {
  return {
    spacecraftId: p.spacecraftId,
    stationId: p.stationId,
    aosMs: p.aosMs,
    losMs: p.losMs,
    tcaMs: p.tcaMs,
    maxElevationDeg: p.maxElevationDeg,
    aosAzimuthDeg: p.aosAzimuthDeg,
    losAzimuthDeg: p.losAzimuthDeg,
    aosElevationDeg: p.aosElevationDeg!,
    losElevationDeg: p.losElevationDeg!,
    aosClipped: p.aosClipped,
    losClipped: p.losClipped,
    losTrackEnded: p.losTrackEnded!,
    durationS: (p.losMs - p.aosMs) / 1000,
    aosTransmitMs: times.aosTransmitMs!,
    losTransmitMs: times.losTransmitMs!,
    lightTimeS: times.lightTimeS!,
  };
}

const ltState = new Float64Array(6);
const ltLook = newLook();

/**
 * Spacecraft transmit times of AOS and LOS and the one-way light time at TCA
 * (geometry/light-time.ts): each is the received time less the light time of the
 * station-to-craft range there (the range of a light-time corrected state).
 */
function transmitTimes(
  target: Target,
  site: Site,
  p: { aosMs: number; tcaMs: number; losMs: number },
  /** The search's slant ranges at AOS, TCA and LOS (SGP4 targets: a state is a function of the time alone). */
  searchRangesKm?: Float64Array,
): Pick<Contact, 'aosTransmitMs' | 'losTransmitMs' | 'lightTimeS'> {
  const tau = (tMs: number, j: number): number => {
    // the search's range is the one evaluated here again, unless the track has ended before tMs since
    const known = searchRangesKm?.[j];
    if (known !== undefined && !Number.isNaN(known) && (target.failedAtMs === undefined || tMs < target.failedAtMs)) return lightTimeS(known);
    if (!target.stateEcefAt(tMs, ltState)) return Number.NaN;
    return lightTimeS(lookFrom(site, ltState, ltLook).rangeKm);
  };
  const aos = tau(p.aosMs, 0);
  const los = tau(p.losMs, 2);
  return { aosTransmitMs: p.aosMs - aos * 1000, losTransmitMs: p.losMs - los * 1000, lightTimeS: tau(p.tcaMs, 1) };
}

/** Lunar two-body elements further than this from any part of the window get a warning, days (lunar-orbit.ts: km per day of drift). */
export const LUNAR_ELEMENTS_WARNING_DAYS = 14;

/** Beyond this geocentric distance a craft is in deep space, km (ITU Radio Regulations No. 1.177: 2 x 10^6 km). */
export const DEEP_SPACE_KM = 2e6;
/**
 * Sun-Earth-probe angle under which a deep-space link is warned of, deg: inside about
 * 5 deg the solar corona's scintillation and noise degrade X-band links (common
 * practice; the corona's effect itself is not modelled).
 */
export const SOLAR_CONJUNCTION_WARNING_DEG = 5;
const SEP_SAMPLE_MS = 3_600_000;

/** The warning for a deep-space target whose Sun-Earth-probe angle falls below the threshold in the span, or undefined. */
export function solarConjunctionWarning(target: Target, skyOrBuild: SkyBodies | (() => SkyBodies), span: Span): string | undefined {
  let sky = typeof skyOrBuild === 'function' ? undefined : skyOrBuild;
  const s = new Float64Array(6);
  let first = Number.NaN;
  let last = Number.NaN;
  let least = Infinity;
  let leastAt = Number.NaN;
  const from = target.coverage ? Math.max(span.startMs, target.coverage.startMs) : span.startMs;
  const to = target.coverage ? Math.min(span.endMs, target.coverage.endMs) : span.endMs;
  for (let t = from; t <= to; t += SEP_SAMPLE_MS) {
    if (!target.stateEcefAt(t, s) || Math.hypot(s[0]!, s[1]!, s[2]!) < DEEP_SPACE_KM) continue;
    sky ??= (skyOrBuild as () => SkyBodies)(); // built only for a craft in deep space
    sky.at(t);
    const sep = sky.sunEarthProbeDeg(s);
    if (sep < least) {
      least = sep;
      leastAt = t;
    }
    if (sep < SOLAR_CONJUNCTION_WARNING_DEG) {
      if (Number.isNaN(first)) first = t;
      last = t;
    }
  }
  if (Number.isNaN(first)) return undefined;
  return `Sun-Earth-probe angle below ${SOLAR_CONJUNCTION_WARNING_DEG} deg from ${isoUtc(first, 0)} to ${isoUtc(last, 0)} (least ${least.toFixed(2)} deg at ${isoUtc(leastAt, 0)}): solar conjunction, the corona's noise and scintillation (not modelled) degrade the link`;
}
