/**
 * SGP4 target: a spacecraft flown from mean element sets (TLE or CCSDS OMM).
 *
 * Model: SGP4/SDP4 as revised in D. A. Vallado, P. Crawford, R. Hujsak, T. S. Kelso,
 * "Revisiting Spacetrack Report #3", AIAA 2006-6753 (2006), WGS-72 constants, improved
 * mode 'i', implemented by satellite.js 7.1.0 (`twoline2satrec`, `json2satrec`, `sgp4`).
 * Output TEME, rotated to ECEF by frames.ts. OMM fields: CCSDS 502.0-B (Orbit Data
 * Messages), section 4 (OMM), mean element theory SGP4.
 * Valid range: SGP4 is a mean-element theory; accuracy ~1 km at epoch growing by a few km
 * per day, so element sets are used near their epoch (see `elementAgeWarning`).
 * Units: time in UTC epoch ms, minutes since epoch for SGP4; km, km/s.
 *
 * Notes on satellite.js behaviour:
 * - `json2satrec` parses EPOCH with `new Date(EPOCH + 'Z')`: a day-of-year epoch
 *   ("2020-287T...") or one with an explicit offset is mishandled, and the epoch is cut to
 *   whole milliseconds. We feed it a normalised "YYYY-MM-DDTHH:MM:SS.ffffff" string and
 *   measure minutes since epoch from the exact epoch (`ElementSet.epochMs`), so the
 *   sub-millisecond cut only touches epoch-dependent initialisation terms (negligible).
 * - `sgp4` returns null and writes `satrec.error` (1, 2, 3, 4, 6) on failure; this module
 *   turns that into an explicit status code, and the first failure ends the track.
 */
import { json2satrec, sgp4, twoline2satrec, type SatRec } from 'satellite.js';
import { ScenarioError } from '../../errors.js';
import type { ElementSet, OmmElements, Span } from '../../scenario/types.js';
import { gmstRadAt, JULIAN_DATE_UNIX_EPOCH, temeToEcef } from '../frames.js';
import type { Target } from '../types.js';
import { nearEarthTerms, sgp4NearEarthInto, type NearEarthTerms } from './sgp4-near.js';
import { newDeepSpaceTrack, sgp4DeepSpaceInto, type DeepSpaceTrack } from './sgp4-deep.js';

/** Status of one SGP4 call: 0 ok, otherwise satellite.js SatRecError code (or -1). */
export const SGP4_OK = 0;
/** Our code for a null result without an error code, or a non-finite state. */
export const SGP4_NON_FINITE = -1;

const SGP4_ERROR_TEXT: Readonly<Record<number, string>> = {
  1: 'mean eccentricity out of range 0 <= e < 1',
  2: 'mean motion below zero',
  3: 'perturbed eccentricity out of range 0 <= e < 1',
  4: 'semi-latus rectum below zero',
  6: 'orbit decayed (position below the Earth surface)',
  [SGP4_NON_FINITE]: 'non-finite state',
};

/** Words for an SGP4 error code (AIAA 2006-6753 / satellite.js SatRecError). */
export function sgp4ErrorText(code: number): string {
  return SGP4_ERROR_TEXT[code] ?? 'unknown SGP4 error';
}

/**
 * The per-minute entry point: propagate `satrec` to `tsinceMin` minutes since its epoch,
 * write the TEME state into outTeme[0..5] (km, km/s) and return the status
 * (SGP4_OK = 0, or the SGP4 error code). Does not go through a Date. `terms`: the
 * satrec's nearEarthTerms (sgp4-near.ts) when the caller keeps them (a track), else made here;
 * `deep`: a deep-space satrec's DeepSpaceTrack (sgp4-deep.ts) kept by the caller, without
 * which a deep-space set goes through satellite.js's `sgp4` itself.
 */
export function propagateTemeMinutes(satrec: SatRec, tsinceMin: number, outTeme: Float64Array, terms?: NearEarthTerms, deep?: DeepSpaceTrack): number {
  if (satrec.method === 'n' || deep !== undefined) {
    // satellite.js's own arithmetic, without its result objects (sgp4-near.ts, sgp4-deep.ts)
    const code =
      satrec.method === 'n' ? sgp4NearEarthInto(satrec, tsinceMin, outTeme, terms ?? nearEarthTerms(satrec)) : sgp4DeepSpaceInto(satrec, tsinceMin, outTeme, deep!);
    if (code !== SGP4_OK) return code;
    for (let i = 0; i < 6; i++) if (!Number.isFinite(outTeme[i]!)) return SGP4_NON_FINITE;
    return SGP4_OK;
  }
  const pv = sgp4(satrec, tsinceMin);
  if (pv === null) return satrec.error !== 0 ? satrec.error : SGP4_NON_FINITE;
  const p = pv.position;
  const v = pv.velocity;
  outTeme[0] = p.x;
  outTeme[1] = p.y;
  outTeme[2] = p.z;
  outTeme[3] = v.x;
  outTeme[4] = v.y;
  outTeme[5] = v.z;
  for (let i = 0; i < 6; i++) if (!Number.isFinite(outTeme[i]!)) return SGP4_NON_FINITE;
  return SGP4_OK;
}

const CALENDAR_RE =
  /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2}):(\d{2})(?:\.(\d+))?(Z|[+-]\d{2}:?\d{2})?$/;
const DAY_OF_YEAR_RE = /^(\d{4})-(\d{3})T(\d{2}):(\d{2}):(\d{2})(?:\.(\d+))?(Z|[+-]\d{2}:?\d{2})?$/;

/**
 * Normalise an OMM EPOCH (ISO 8601 calendar or day-of-year form, optional "Z" or
 * "+hh:mm" offset) to UTC "YYYY-MM-DDTHH:MM:SS.ffffff", the form `json2satrec` reads
 * correctly. Returns undefined when the string is not one of those forms.
 */
export function normaliseOmmEpoch(epochIso: string): { iso: string; epochMs: number } | undefined {
  let year: number, month0: number, day: number, h: string, mi: string, s: string;
  let frac: string | undefined, zone: string | undefined;
  const cal = CALENDAR_RE.exec(epochIso.trim());
  if (cal) {
    year = Number(cal[1]);
    month0 = Number(cal[2]) - 1;
    day = Number(cal[3]);
    [h, mi, s, frac, zone] = [cal[4]!, cal[5]!, cal[6]!, cal[7], cal[8]];
  } else {
    const doy = DAY_OF_YEAR_RE.exec(epochIso.trim());
    if (!doy) return undefined;
    year = Number(doy[1]);
    month0 = 0;
    day = Number(doy[2]);
    [h, mi, s, frac, zone] = [doy[3]!, doy[4]!, doy[5]!, doy[6], doy[7]];
  }
  let offsetMin = 0;
  if (zone !== undefined && zone !== 'Z') {
    const sign = zone[0] === '-' ? -1 : 1;
    const digits = zone.slice(1).replace(':', '');
    offsetMin = sign * (Number(digits.slice(0, 2)) * 60 + Number(digits.slice(2, 4)));
  }
  const wholeMs = Date.UTC(year, month0, day, Number(h), Number(mi), Number(s)) - offsetMin * 60_000;
  if (!Number.isFinite(wholeMs)) return undefined;
  const micro = (frac ?? '').padEnd(6, '0').slice(0, 6);
  const iso = `${new Date(wholeMs).toISOString().slice(0, 19)}.${micro}`;
  return { iso, epochMs: wholeMs + Number(micro) / 1000 };
}

function ommToJson(omm: OmmElements, epochIso: string): Parameters<typeof json2satrec>[0] {
  return {
    OBJECT_NAME: omm.objectName,
    OBJECT_ID: omm.objectId,
    EPOCH: epochIso,
    MEAN_MOTION: omm.meanMotionRevPerDay,
    ECCENTRICITY: omm.eccentricity,
    INCLINATION: omm.inclinationDeg,
    RA_OF_ASC_NODE: omm.raanDeg,
    ARG_OF_PERICENTER: omm.argPericenterDeg,
    MEAN_ANOMALY: omm.meanAnomalyDeg,
    NORAD_CAT_ID: omm.noradCatId,
    ELEMENT_SET_NO: omm.elementSetNo,
    REV_AT_EPOCH: omm.revAtEpoch,
    BSTAR: omm.bstarPerEarthRadii,
    MEAN_MOTION_DOT: omm.meanMotionDotRevPerDay2,
    MEAN_MOTION_DDOT: omm.meanMotionDdotRevPerDay3,
  };
}

const MS_PER_DAY = 86_400_000;
/** Largest accepted gap between ElementSet.epochMs and the satrec's own epoch: covers
 * json2satrec's cut to whole ms and the ~40 us resolution of a Julian-date double. */
const EPOCH_AGREEMENT_MS = 2;

/**
 * Build the satrec of one element set. TLE: `twoline2satrec` on columns 1..69 (no
 * checksum validation at this layer: scenario/ validates). OMM: `json2satrec` on a
 * normalised epoch. An initialisation error stays in `satrec.error` and makes every
 * propagation of that set fail (the track then ends where the set is first used).
 */
export function satrecFromElementSet(set: ElementSet): SatRec {
  let satrec: SatRec;
  if (set.tle !== undefined) {
    satrec = twoline2satrec(set.tle.line1.slice(0, 69), set.tle.line2.slice(0, 69));
  } else if (set.omm !== undefined) {
    const norm = normaliseOmmEpoch(set.omm.epochIso);
    if (norm === undefined) {
      throw new ScenarioError([
        { file: set.origin, path: 'omm.epochIso', message: `"${set.omm.epochIso}" is not an ISO 8601 UTC epoch (YYYY-MM-DDTHH:MM:SS[.ffffff] or YYYY-DDDTHH:MM:SS)` },
      ]);
    }
    satrec = json2satrec(ommToJson(set.omm, norm.iso), 'i');
  } else {
    throw new ScenarioError([{ file: set.origin, path: '', message: 'element set has neither TLE lines nor OMM elements' }]);
  }
  const satrecEpochMs = (satrec.jdsatepoch - JULIAN_DATE_UNIX_EPOCH) * MS_PER_DAY;
  if (!(Math.abs(satrecEpochMs - set.epochMs) <= EPOCH_AGREEMENT_MS)) {
    throw new ScenarioError([
      { file: set.origin, path: 'epochMs', message: `epoch ${set.epochMs} ms disagrees with the elements' own epoch ${satrecEpochMs.toFixed(3)} ms` },
    ]);
  }
  return satrec;
}

/**
 * Scan-step knob of the contact search for SGP4 targets: the step is the time the orbit
 * takes to sweep 1/SGP4_SCAN_SAMPLES_PER_REV of a revolution at perigee angular rate,
 *   stepS = periodS * (1 - e^2)^1.5 / (1 + e)^2 / SGP4_SCAN_SAMPLES_PER_REV,
 * clamped to [SGP4_SCAN_MIN_STEP_S, SGP4_SCAN_MAX_STEP_S]. (Perigee angular rate is
 * n (1 + e)^2 / (1 - e^2)^1.5: Kepler's second law.) For a 95-min LEO that is ~95 s, much
 * less than the shortest pass that rises 1 deg above the mask is long; passes that peak
 * between two scan points are still caught by the search's peak detection.
 */
export const SGP4_SCAN_SAMPLES_PER_REV = 60;
export const SGP4_SCAN_MIN_STEP_S = 10;
export const SGP4_SCAN_MAX_STEP_S = 600;

export function sgp4ScanStepS(meanMotionRevPerDay: number, eccentricity: number): number {
  const periodS = 86_400 / meanMotionRevPerDay;
  const e2 = eccentricity * eccentricity;
  const perigeeFactor = Math.pow(1 - e2, 1.5) / ((1 + eccentricity) * (1 + eccentricity));
  const stepS = (periodS * perigeeFactor) / SGP4_SCAN_SAMPLES_PER_REV;
  if (!Number.isFinite(stepS)) return SGP4_SCAN_MIN_STEP_S;
  return Math.min(SGP4_SCAN_MAX_STEP_S, Math.max(SGP4_SCAN_MIN_STEP_S, stepS));
}

const RAD_PER_MIN_TO_REV_PER_DAY = 1440 / (2 * Math.PI);

class Sgp4Target implements Target {
  readonly spacecraftId: string;
  readonly scanStepS: number;
  evaluations = 0;
  failedAtMs: number | undefined = undefined;
  failureReason: string | undefined = undefined;
  private readonly satrecs: SatRec[];
  /** nearEarthTerms of each near-Earth satrec (undefined for deep-space ones), made once. */
  private readonly terms: (NearEarthTerms | undefined)[];
  /** The integrator's kept steps of each deep-space satrec (undefined for near-Earth ones). */
  private readonly deep: (DeepSpaceTrack | undefined)[];
  private readonly sets: ElementSet[];
  private readonly epochsMs: Float64Array;
  /** switchMs[i]: from this time on set i+1 is nearer than set i. */
  private readonly switchMs: Float64Array;
  private current = 0;
  private readonly teme = new Float64Array(6);
  private readonly rTeme: Float64Array;
  private readonly vTeme: Float64Array;

  constructor(spacecraftId: string, sets: ElementSet[]) {
    this.spacecraftId = spacecraftId;
    this.sets = [...sets].sort((a, b) => a.epochMs - b.epochMs);
    this.satrecs = this.sets.map(satrecFromElementSet);
    this.terms = this.satrecs.map((r) => (r.method === 'n' ? nearEarthTerms(r) : undefined));
    this.deep = this.satrecs.map((r) => (r.method === 'd' ? newDeepSpaceTrack() : undefined));
    this.epochsMs = Float64Array.from(this.sets, (s) => s.epochMs);
    this.switchMs = new Float64Array(Math.max(0, this.sets.length - 1));
    for (let i = 0; i + 1 < this.sets.length; i++) {
      this.switchMs[i] = 0.5 * (this.epochsMs[i]! + this.epochsMs[i + 1]!);
    }
    let step = SGP4_SCAN_MAX_STEP_S;
    for (const r of this.satrecs) step = Math.min(step, sgp4ScanStepS(r.no * RAD_PER_MIN_TO_REV_PER_DAY, r.ecco));
    this.scanStepS = step;
    this.rTeme = this.teme.subarray(0, 3);
    this.vTeme = this.teme.subarray(3, 6);
  }

  /** True when one element set serves all of [aMs, bMs] (no switch to a nearer set inside). */
  oneSetOver(aMs: number, bMs: number): boolean {
    for (let i = 0; i < this.switchMs.length; i++) {
      const s = this.switchMs[i]!;
      if (s > aMs && s <= bMs) return false;
    }
    return true;
  }

  stateEcefAt(tMs: number, out: Float64Array): boolean {
    if (this.failedAtMs !== undefined && tMs >= this.failedAtMs) return false;
    let i = this.current;
    while (i > 0 && tMs < this.switchMs[i - 1]!) i--;
    while (i < this.switchMs.length && tMs >= this.switchMs[i]!) i++;
    this.current = i;
    this.evaluations++;
    const code = propagateTemeMinutes(this.satrecs[i]!, (tMs - this.epochsMs[i]!) / 60_000, this.teme, this.terms[i], this.deep[i]);
    if (code !== SGP4_OK) {
      if (this.failedAtMs === undefined || tMs < this.failedAtMs) {
        this.failedAtMs = tMs;
        this.failureReason =
          `${this.sets[i]!.origin}: SGP4 error ${code} (${sgp4ErrorText(code)}) at ` +
          `${new Date(Math.floor(tMs)).toISOString()}; the track of ${this.spacecraftId} ends there`;
      }
      return false;
    }
    temeToEcef(this.rTeme, this.vTeme, gmstRadAt(tMs), out);
    return true;
  }
}

/** True when `target` is an SGP4 target: its state is a function of the time alone, until its track ends. */
export function isSgp4Target(target: Target): boolean {
  return target instanceof Sgp4Target;
}

/**
 * True when `target` is an SGP4 target whose states over [aMs, bMs] come from one element
 * set: a smooth orbit there, whose acceleration is the Earth's gravity (plus small
 * perturbations) in inertial axes. False for every other target.
 */
export function sgp4SmoothOver(target: Target, aMs: number, bMs: number): boolean {
  return target instanceof Sgp4Target && target.oneSetOver(aMs, bMs);
}

/**
 * A Target flown from one or more element sets of one spacecraft. At each time the set
 * whose epoch is nearest is used. Throws ScenarioError when `sets` is empty or a set is
 * unreadable.
 */
export function makeSgp4Target(spacecraftId: string, sets: ElementSet[]): Target {
  if (sets.length === 0) {
    throw new ScenarioError([{ file: spacecraftId, path: 'orbit.sets', message: 'no element set given (need at least one TLE or OMM)' }]);
  }
  return new Sgp4Target(spacecraftId, sets);
}

/** Element-set age limit for the warning, days (common practice for SGP4 planning). */
export const ELEMENT_AGE_LIMIT_DAYS = 14;

/**
 * One warning message when, at some time in the span, the nearest element set's epoch is
 * more than ELEMENT_AGE_LIMIT_DAYS away; undefined otherwise.
 */
export function elementAgeWarning(sets: ElementSet[], span: Span): string | undefined {
  const worst = worstElementAge(sets, span);
  if (worst === undefined || worst.days <= ELEMENT_AGE_LIMIT_DAYS) return undefined;
  return (
    `${worst.set.origin}: element set epoch ${new Date(Math.floor(worst.set.epochMs)).toISOString()} is ` +
    `${worst.days.toFixed(1)} days from ${new Date(Math.floor(worst.atMs)).toISOString()} in the span ` +
    `(limit ${ELEMENT_AGE_LIMIT_DAYS} days); SGP4 errors grow by kilometres per day`
  );
}

/**
 * The largest distance, days, from a time in the span to the element set nearest it
 * (the set used there), with that set and time; undefined without sets.
 */
export function worstElementAge(sets: ElementSet[], span: Span): { days: number; set: ElementSet; atMs: number } | undefined {
  if (sets.length === 0) return undefined;
  const sorted = [...sets].sort((a, b) => a.epochMs - b.epochMs);
  // The worst time is a span end or a midpoint between consecutive epochs inside the span.
  const probes = [span.startMs, span.endMs];
  for (let i = 0; i + 1 < sorted.length; i++) {
    const mid = 0.5 * (sorted[i]!.epochMs + sorted[i + 1]!.epochMs);
    if (mid > span.startMs && mid < span.endMs) probes.push(mid);
  }
  let worstDays = 0;
  let worstSet = sorted[0]!;
  let worstAt = span.startMs;
  for (const t of probes) {
    let best = sorted[0]!;
    for (const s of sorted) if (Math.abs(s.epochMs - t) < Math.abs(best.epochMs - t)) best = s;
    const days = Math.abs(best.epochMs - t) / MS_PER_DAY;
    if (days > worstDays) {
      worstDays = days;
      worstSet = best;
      worstAt = t;
    }
  }
  return { days: worstDays, set: worstSet, atMs: worstAt };
}
