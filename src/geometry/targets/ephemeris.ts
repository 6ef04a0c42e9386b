/**
 * Ephemeris target: a trajectory from flight dynamics (a CCSDS OEM read by
 * scenario/oem.ts), interpolated as its header says and seen with light time.
 *
 * Model: every node is moved to the Earth's centre once, at construction, with
 * astronomy-engine 2.1.19 (EME2000 axes, EQJ in its terms):
 *   EARTH  as given;
 *   MOON   + GeoMoonState (geocentric Moon, ~1 arcmin: Montenbruck & Pfleger's lunar theory);
 *   EARTH-MOON BARYCENTER  + GeoEmbState;
 *   SUN    - HelioState(Earth) (VSOP87 Earth, ~1 arcsec).
 * The geocentric nodes are interpolated with the segment's method and degree
 * (geometry/interpolate-poly.ts); light time and the turn to Earth-fixed axes are
 * geometry/light-time.ts. Overlapping segments: the later one is used.
 * The Moon's sphere cuts the line of sight (occultation.ts) for every ephemeris target.
 * Coverage: the usable spans; the contact search runs inside them (plan/contacts.ts
 * says so in one warning), a state asked for outside them fails (the track ends there).
 * Units: km, km/s, UTC epoch ms.
 */
import { GeoEmbState, GeoMoonState, HelioState, Body, KM_PER_AU } from 'astronomy-engine';
import type { Ephemeris, EphemerisSegment, Span } from '../../scenario/types.js';
import { PolyInterpolator } from '../interpolate-poly.js';
import { LightTimeTarget, SPEED_OF_LIGHT_KM_S } from '../light-time.js';
import { MoonEphemeris } from './moon-ephemeris.js';
import { astroDays } from './ofDate.js';

const KM_S_PER_AU_DAY = KM_PER_AU / 86_400;
/** Scan step of the contact search, s, by geocentric distance: near-Earth (30 s), beyond 100,000 km (600 s). */
export const EPHEMERIS_SCAN_STEP_NEAR_S = 30;
export const EPHEMERIS_SCAN_STEP_FAR_S = 600;
export const EPHEMERIS_FAR_KM = 100_000;

/** A segment's nodes moved to the Earth's centre (EME2000), km and km/s. */
export function geocentricStates(seg: EphemerisSegment): Float64Array {
  const out = seg.states.slice();
  if (seg.centre === 'EARTH') return out;
  for (let k = 0; k < seg.tMs.length; k++) {
    const d = astroDays(seg.tMs[k]!);
    let c: { x: number; y: number; z: number; vx: number; vy: number; vz: number };
    let sign = 1;
    if (seg.centre === 'MOON') c = GeoMoonState(d);
    else if (seg.centre === 'EARTH-MOON BARYCENTER') c = GeoEmbState(d);
    else {
      c = HelioState(Body.Earth, d);
      sign = -1;
    }
    const b = 6 * k;
    out[b] = out[b]! + sign * c.x * KM_PER_AU;
    out[b + 1] = out[b + 1]! + sign * c.y * KM_PER_AU;
    out[b + 2] = out[b + 2]! + sign * c.z * KM_PER_AU;
    out[b + 3] = out[b + 3]! + sign * c.vx * KM_S_PER_AU_DAY;
    out[b + 4] = out[b + 4]! + sign * c.vy * KM_S_PER_AU_DAY;
    out[b + 5] = out[b + 5]! + sign * c.vz * KM_S_PER_AU_DAY;
  }
  return out;
}

interface PreparedSegment {
  startMs: number;
  stopMs: number;
  interp: PolyInterpolator;
}

export class EphemerisTarget extends LightTimeTarget {
  readonly spacecraftId: string;
  readonly scanStepS: number;
  /** Where the search may run: the usable spans, less the light time and a scan step. */
  readonly coverage: Span;
  private readonly segs: PreparedSegment[];
  private cur = 0;

  constructor(spacecraftId: string, eph: Ephemeris, span: Span, grazingMarginKm = 0) {
    super(span.startMs, span.endMs);
    this.spacecraftId = spacecraftId;
    this.occultedBy(new MoonEphemeris(span.startMs, span.endMs), grazingMarginKm);
    let maxKm = 0;
    let minKm = Infinity;
    this.segs = eph.segments.map((seg) => {
      const geo = geocentricStates(seg);
      for (let k = 0; k < seg.tMs.length; k++) {
        const r = Math.hypot(geo[6 * k]!, geo[6 * k + 1]!, geo[6 * k + 2]!);
        if (r > maxKm) maxKm = r;
        if (r < minKm) minKm = r;
      }
      return {
        startMs: seg.useableStartMs,
        stopMs: seg.useableStopMs,
        interp: new PolyInterpolator(seg.tMs, geo, seg.interpolation === 'HERMITE', seg.degree),
      };
    });
    this.scanStepS = minKm > EPHEMERIS_FAR_KM ? EPHEMERIS_SCAN_STEP_FAR_S : EPHEMERIS_SCAN_STEP_NEAR_S;
    const pad = (maxKm / SPEED_OF_LIGHT_KM_S + 2 * this.scanStepS) * 1000;
    const first = Math.min(...this.segs.map((s) => s.startMs));
    const last = Math.max(...this.segs.map((s) => s.stopMs));
    this.coverage = { startMs: first + pad, endMs: last - 2 * this.scanStepS * 1000 };
    this.failureReason = 'outside the ephemeris file\'s usable span';
  }

  protected geoEqjAt(tMs: number, out: Float64Array): boolean {
    const segs = this.segs;
    let i = this.cur;
    const s = segs[i]!;
    if (!(tMs >= s.startMs && tMs <= s.stopMs) || (i + 1 < segs.length && tMs >= segs[i + 1]!.startMs)) {
      i = -1;
      for (let j = segs.length - 1; j >= 0; j--) {
        if (tMs >= segs[j]!.startMs && tMs <= segs[j]!.stopMs) {
          i = j;
          break;
        }
      }
      if (i < 0) return false;
      this.cur = i;
    }
    segs[i]!.interp.stateAt(tMs, out);
    return true;
  }
}

export function makeEphemerisTarget(spacecraftId: string, eph: Ephemeris, span: Span, grazingMarginKm = 0): EphemerisTarget {
  return new EphemerisTarget(spacecraftId, eph, span, grazingMarginKm);
}
