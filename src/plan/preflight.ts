/**
 * Checks that need the models, run on the validated scenario before any work, by
 * `check` and by every command that plans (README "Failure behaviour"):
 *  - every radio at every station goes through the same link preparation as
 *    `plan` (atmosphere models, antenna, noise): a model asked for outside its
 *    valid range is a problem naming the file and the field (a 60 GHz radio, a
 *    500 m dish), said once per field with the stations it concerns;
 *  - every target and every station mask is built as `plan` builds them (a sky
 *    range under 10,000 km, a horizon the mask model refuses);
 *  - with a span: an element set further than ELEMENT_SET_MAX_AGE_DAYS from any
 *    part of it is refused (SGP4 far from the epoch is meaningless, and deep-space
 *    propagation slows down with the distance: a window in 9999 would never end);
 *  - the warnings `plan` would print: element sets older than 14 days, no rain
 *    climate above the warning frequency.
 */
import { ModelRangeError, ScenarioError, type Problem } from '../errors.js';
import { makeSite } from '../geometry/earth.js';
import { prepareMask } from '../geometry/mask.js';
import { elementAgeWarning, worstElementAge } from '../geometry/targets/sgp4.js';
import { rainModelled } from '../link/atmosphere/index.js';
import type { AtmosphereTable } from '../link/atmosphere/types.js';
import type { Scenario, Span } from '../scenario/types.js';
import { makeTarget } from './contacts.js';
import { RAIN_WARNING_ABOVE_HZ, atmosphereInputFor, lowestMaskDeg, prepareRadioAtStationUnnamed } from './link.js';

/** Farthest an element set may be from any part of the span, days. */
export const ELEMENT_SET_MAX_AGE_DAYS = 365;

export interface PreflightResult {
  problems: Problem[];
  warnings: string[];
}

/** The scenario field a model's range error is about, for the message. */
function fieldOf(err: ModelRangeError, radioPath: string, stationPath: string): { side: 'radio' | 'station'; path: string } {
  const f = `${err.field} ${err.model}`.toLowerCase();
  if (/pointing/.test(f)) return { side: 'station', path: `${stationPath}.antenna.pointingErrorDeg` };
  if (/diameter|dish|aperture|beam/.test(f)) return { side: 'station', path: `${stationPath}.antenna` };
  if (/rain|cloud|liquid|vapour|pressure|temperature|nwet|height/.test(err.field.toLowerCase())) return { side: 'station', path: `${stationPath}.climate` };
  if (/freq/.test(f)) return { side: 'radio', path: `${radioPath}.frequencyMHz` };
  return { side: 'radio', path: radioPath };
}

export interface PreflightOptions {
  /** Prepare every radio at every station (the atmosphere tables: about 0.3 s on the demo). Default true. */
  links?: boolean;
}

export function preflight(scenario: Scenario, span?: Span, opts: PreflightOptions = {}): PreflightResult {
  const scFile = scenario.sources.spacecraftFile;
  const netFile = scenario.sources.networkFile;
  const problems: Problem[] = [];
  const warnings: string[] = [];
  const sites = scenario.stations.map((st, k) => {
    try {
      prepareMask(st.mask);
    } catch (err) {
      if (!(err instanceof ModelRangeError)) throw err;
      problems.push({ file: netFile, path: `stations[${k}].${st.mask.kind === 'profile' ? 'horizon' : 'maskDeg'}`, message: err.message });
    }
    try {
      return makeSite(st.id, st.latitudeDeg, st.longitudeDeg, st.heightKm);
    } catch (err) {
      if (!(err instanceof ModelRangeError)) throw err;
      problems.push({ file: netFile, path: `stations[${k}]`, message: err.message });
      return undefined;
    }
  });
  const probeSpan: Span = span ?? scenario.span ?? { startMs: Date.UTC(2026, 0, 1), endMs: Date.UTC(2026, 0, 2) };
  scenario.spacecraft.forEach((sc, i) => {
    const orbitPath = `spacecraft[${i}].orbit`;
    if (sc.orbit.kind === 'elements' && span) {
      const worst = worstElementAge(sc.orbit.sets, span);
      if (worst && worst.days > ELEMENT_SET_MAX_AGE_DAYS) {
        problems.push({
          file: scFile,
          path: orbitPath,
          message:
            `the element set nearest ${new Date(Math.floor(worst.atMs)).toISOString()} (epoch ${new Date(Math.floor(worst.set.epochMs)).toISOString()}) ` +
            `is ${worst.days.toFixed(0)} days from it; valid: an element set within ${ELEMENT_SET_MAX_AGE_DAYS} days of every part of the window ` +
            `(window from ${new Date(span.startMs).toISOString()}, ${((span.endMs - span.startMs) / 86_400_000).toFixed(3).replace(/\.?0+$/, '')} days)`,
        });
        return; // no target is built that far from its epoch
      }
      const age = elementAgeWarning(sc.orbit.sets, span);
      if (age) warnings.push(`${sc.id}: ${age}`);
    }
    try {
      makeTarget(sc, probeSpan);
    } catch (err) {
      if (!(err instanceof ModelRangeError)) throw err;
      const path = sc.orbit.kind === 'fixedSky' ? `${orbitPath}.sky.${err.field}` : orbitPath;
      problems.push({ file: scFile, path, message: err.message });
    }
  });
  // every radio at every station, through plan's own link preparation
  const tables = new Map<string, AtmosphereTable>();
  const grouped = new Map<string, { file: string; path: string; message: string; others: string[] }>();
  const warnedRain = new Set<string>();
  if (opts.links === false) return { problems, warnings };
  scenario.stations.forEach((station, k) => {
    const site = sites[k];
    if (!site || !station.receiver) return; // windows only: no link to check
    scenario.spacecraft.forEach((sc, i) => {
      sc.radios.forEach((radio, j) => {
        const radioPath = `spacecraft[${i}].radios[${j}]`;
        if (j === 0 && radio.frequencyHz > RAIN_WARNING_ABOVE_HZ && !warnedRain.has(station.id) && !rainModelled(atmosphereInputFor(station, radio, scenario.link))) {
          warnedRain.add(station.id);
          warnings.push(`${station.id}: no rain climate (rainRate001MmH, rainHeightKm); the rain term is not modelled above ${RAIN_WARNING_ABOVE_HZ / 1e9} GHz`);
        }
        try {
          prepareRadioAtStationUnnamed(radio, station, site, scenario.link, lowestMaskDeg(station), tables);
        } catch (err) {
          if (!(err instanceof ModelRangeError)) throw err;
          const { side, path } = fieldOf(err, radioPath, `stations[${k}]`);
          const key = `${side}|${path}|${err.message}`;
          const other = side === 'radio' ? station.id : `${sc.id} ${radio.id}`;
          const g = grouped.get(key);
          if (g) g.others.push(other);
          else grouped.set(key, { file: side === 'radio' ? scFile : netFile, path, message: err.message, others: [other] });
        }
      });
    });
  });
  for (const g of grouped.values()) {
    const n = g.others.length;
    const at = n > 3 ? `${g.others.slice(0, 3).join(', ')} and ${n - 3} more` : g.others.join(', ');
    const what = g.file === scFile ? `at station${n > 1 ? 's' : ''} ${at}` : `for radio${n > 1 ? 's' : ''} ${at}`;
    problems.push({ file: g.file, path: g.path, message: `${g.message} (${what})` });
  }
  return { problems, warnings };
}

/**
 * preflight for a command that plans, before any work: its problems thrown together
 * (exit 2). The link part is left to the run itself (see withNamedProblems), so a
 * good scenario pays nothing for it.
 */
export function assertPreflight(scenario: Scenario, span?: Span): void {
  const { problems } = preflight(scenario, span, { links: false });
  if (problems.length > 0) throw new ScenarioError(problems);
}

/**
 * Runs `work`; when it fails on a model's range (a user's mistake found while
 * planning, on whichever thread), the link checks of preflight name the file and
 * field of every such problem, and those are thrown instead.
 */
export async function withNamedProblems<T>(scenario: Scenario, span: Span, work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (err) {
    if (!(err instanceof ScenarioError || err instanceof ModelRangeError)) throw err;
    const { problems } = preflight(scenario, span);
    throw problems.length > 0 ? new ScenarioError(problems) : err;
  }
}
