/**
 * The geocentric Moon in EME2000 axes, tabulated for a span: astronomy-engine 2.1.19
 * `GeoMoonState` (Montenbruck & Pfleger's adaptation of Brown's lunar theory, about
 * 1 arcminute, i.e. ~100 km at the Moon) every MOON_TABLE_STEP_S, cubic Hermite between
 * nodes (positions and velocities; interpolation error ~ h^4 |r''''| / 384: < 1 m at
 * 20 min for a 27.3-day orbit). Allocation-free lookups; outside the padded span the
 * lookup throws (a caller's bug).
 * Units: km, km/s, UTC epoch ms.
 */
import { GeoMoonState, KM_PER_AU } from 'astronomy-engine';
import { astroDays } from './ofDate.js';
import { hermitePackedState } from '../interpolate.js';

export const MOON_TABLE_STEP_S = 1200;
/** Padding of the table beyond the span, ms (light time, search edge samples). */
export const MOON_TABLE_PAD_MS = 86_400_000;
/** Mean radius of the Moon, km: IAU WGCCRE 2015 (Archinal et al. 2018), Table 5. */
export const MOON_MEAN_RADIUS_KM = 1737.4;
/** GM of the Moon, km^3/s^2: JPL DE430 (Folkner et al. 2014, Table 8), 4902.800066. */
export const MOON_GM_KM3_S2 = 4902.800066;

export class MoonEphemeris {
  private readonly t0Ms: number;
  private readonly n: number;
  private readonly nodes: Float64Array;

  constructor(startMs: number, endMs: number) {
    const stepMs = MOON_TABLE_STEP_S * 1000;
    this.t0Ms = startMs - MOON_TABLE_PAD_MS;
    this.n = Math.ceil((endMs + MOON_TABLE_PAD_MS - this.t0Ms) / stepMs) + 1;
    this.nodes = new Float64Array(6 * this.n);
    const kms = KM_PER_AU / 86_400;
    for (let k = 0; k < this.n; k++) {
      const s = GeoMoonState(astroDays(this.t0Ms + k * stepMs));
      this.nodes.set([s.x * KM_PER_AU, s.y * KM_PER_AU, s.z * KM_PER_AU, s.vx * kms, s.vy * kms, s.vz * kms], 6 * k);
    }
  }

  /** Geocentric EME2000 state of the Moon at tMs into out[o..o+5]. */
  stateAt(tMs: number, out: Float64Array, o = 0): void {
    const hS = MOON_TABLE_STEP_S;
    const x = (tMs - this.t0Ms) / (hS * 1000);
    const k = Math.floor(x);
    if (!(k >= 0 && k < this.n - 1)) throw new RangeError(`Moon table asked at ${tMs} ms, outside the span it was built for (a bug in the caller)`);
    hermitePackedState(this.nodes, k, x - k, hS, out, o);
  }
}
