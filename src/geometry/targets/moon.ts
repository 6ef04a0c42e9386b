/**
 * Moon target: the centre of the Moon, for lunar missions whose geometry is the Moon's.
 *
 * Model: astronomy-engine 2.1.19 `GeoMoonState` (geocentric Moon, EQJ, from the
 * Improved Lunar Ephemeris / Brown's theory as adapted by Montenbruck and Pfleger,
 * "Astronomy on the Personal Computer"; good to about 1 arcminute), sampled every
 * MOON_NODE_STEP_S and rotated to the true equator of date (ofDate.ts). Between nodes the
 * position is a cubic Hermite interpolant of the node positions and velocities
 * (interpolation error ~ h^4/384 |r''''| ~ 1e-6 km at 20 min nodes: the Moon's geocentric
 * motion has a 27.3-day period). Each call rotates by GAST (GMST + sampled equation of
 * the equinoxes) into Earth-fixed axes, with the omega x r velocity term (frames.ts).
 * Geometric position: no light-time (~1.3 s, ~1.3 km along the lunar orbit) and no
 * aberration (~20 arcsec).
 * Valid range: the span given at construction, padded by MOON_PAD_MS on each side;
 * astronomy-engine's lunar theory holds for centuries around 2000.
 * Units: km, km/s, UTC epoch ms.
 */
import { astronomyLib } from '../../lazy.js';
import type { Span } from '../../scenario/types.js';
import { gmstRadAt, inertialOfDateToEcef } from '../frames.js';
import type { Target } from '../types.js';
import { hermitePackedState } from '../interpolate.js';
import { astroDays, eqjToEqdMatrix, rotate3, siderealOffsetRad } from './ofDate.js';

/** Node spacing of the sampled lunar ephemeris, s (knob; 10-30 min all give < 1 m). */
export const MOON_NODE_STEP_S = 1200;
/** Scan step the contact search uses for the Moon, s: lunar passes last ~10-14 h. */
export const MOON_SCAN_STEP_S = 600;
/** Padding of the sampled interval beyond the span, ms (room for the search's edge samples). */
export const MOON_PAD_MS = 86_400_000;

const SECONDS_PER_DAY = 86_400;

class MoonTarget implements Target {
  readonly spacecraftId: string;
  readonly scanStepS = MOON_SCAN_STEP_S;
  evaluations = 0;
  readonly failedAtMs: number | undefined = undefined;
  readonly failureReason: string | undefined = undefined;
  private readonly t0Ms: number;
  private readonly nodeCount: number;
  /** Per node: x y z (km) vx vy vz (km/s) in the true equator of date. */
  private readonly nodes: Float64Array;
  private readonly offsetRad: Float64Array;
  /** Position and velocity of date, km and km/s; r and v are views of it. */
  private readonly rv = new Float64Array(6);
  private readonly r = this.rv.subarray(0, 3);
  private readonly v = this.rv.subarray(3, 6);

  constructor(spacecraftId: string, span: Span) {
    this.spacecraftId = spacecraftId;
    const stepMs = MOON_NODE_STEP_S * 1000;
    this.t0Ms = span.startMs - MOON_PAD_MS;
    this.nodeCount = Math.ceil((span.endMs + MOON_PAD_MS - this.t0Ms) / stepMs) + 1;
    this.nodes = new Float64Array(6 * this.nodeCount);
    this.offsetRad = new Float64Array(this.nodeCount);
    const m = new Float64Array(9);
    const tmp = new Float64Array(3);
    const { GeoMoonState, KM_PER_AU } = astronomyLib();
    for (let k = 0; k < this.nodeCount; k++) {
      const tMs = this.t0Ms + k * stepMs;
      const s = GeoMoonState(astroDays(tMs));
      eqjToEqdMatrix(tMs, m);
      tmp[0] = s.x * KM_PER_AU;
      tmp[1] = s.y * KM_PER_AU;
      tmp[2] = s.z * KM_PER_AU;
      rotate3(m, tmp, this.nodes, 6 * k);
      const kmPerAuDayToKmS = KM_PER_AU / SECONDS_PER_DAY;
      tmp[0] = s.vx * kmPerAuDayToKmS;
      tmp[1] = s.vy * kmPerAuDayToKmS;
      tmp[2] = s.vz * kmPerAuDayToKmS;
      rotate3(m, tmp, this.nodes, 6 * k + 3);
      this.offsetRad[k] = siderealOffsetRad(tMs);
    }
  }

  stateEcefAt(tMs: number, out: Float64Array): boolean {
    const hS = MOON_NODE_STEP_S;
    const x = (tMs - this.t0Ms) / (hS * 1000);
    const k = Math.floor(x);
    if (!(k >= 0 && k < this.nodeCount - 1)) {
      throw new RangeError(
        `Moon target ${this.spacecraftId} asked at ${tMs} ms, outside the sampled interval it was built for (a bug in the caller)`,
      );
    }
    this.evaluations++;
    const s = x - k;
    hermitePackedState(this.nodes, k, s, hS, this.rv, 0);
    const offset = this.offsetRad[k]! + s * (this.offsetRad[k + 1]! - this.offsetRad[k]!);
    inertialOfDateToEcef(this.r, this.v, gmstRadAt(tMs) + offset, out);
    return true;
  }
}

/** A Target at the Moon's centre, valid over `span` (padded by MOON_PAD_MS). */
export function makeMoonTarget(spacecraftId: string, span: Span): Target {
  return new MoonTarget(spacecraftId, span);
}
