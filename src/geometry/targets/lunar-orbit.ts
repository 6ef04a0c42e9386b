/**
 * A lunar orbiter from mean Keplerian elements about the Moon (two-body).
 *
 * Model: Kepler's equation M = E - e sin E solved by Newton's method (to 1e-12 rad),
 * perifocal position and velocity (D. A. Vallado, "Fundamentals of Astrodynamics and
 * Applications", 4th ed., Algorithm 10 (COE2RV) and sec. 2.2), with GM of the Moon
 * 4902.800066 km^3/s^2 (JPL DE430). Elements are referred to the lunar equator at the
 * epoch: z = the Moon's pole (IAU WGCCRE 2015 via astronomy-engine `RotationAxis`), x =
 * the ascending node of that equator on the EME2000 equator; the frame is held fixed
 * (the pole moves ~0.1 deg per month). Geocentric position = the Moon (moon-ephemeris.ts)
 * + the orbit; light time and Earth-fixed axes: geometry/light-time.ts; the Moon's
 * sphere (plus the stated grazing height) cuts the line of sight (occultation.ts).
 * Accuracy: two-body only. The Earth's pull and the lunar gravity field (mascons) move a
 * low lunar orbit by kilometres per day and change its eccentricity over weeks: good for
 * windows, occultations and budgets over days, not for navigation; use an OEM from flight
 * dynamics (ephemeris.ts) for that.
 * Units: km, km/s, degrees, UTC epoch ms.
 */
import { Body, RotationAxis } from 'astronomy-engine';
import type { LunarElements, Span } from '../../scenario/types.js';
import { LightTimeTarget } from '../light-time.js';
import { MOON_GM_KM3_S2, MoonEphemeris } from './moon-ephemeris.js';
import { astroDays } from './ofDate.js';

const DEG = Math.PI / 180;
/** Scan samples per revolution for the contact search (occultation edges are fast). */
export const LUNAR_ORBIT_SCAN_SAMPLES_PER_REV = 120;

export class LunarOrbitTarget extends LightTimeTarget {
  readonly spacecraftId: string;
  readonly scanStepS: number;
  readonly periodS: number;
  private readonly moon: MoonEphemeris;
  /** Perifocal P and Q unit vectors in EME2000. */
  private readonly p = new Float64Array(3);
  private readonly q = new Float64Array(3);
  private readonly moonS = new Float64Array(6);
  private readonly n: number;

  constructor(
    spacecraftId: string,
    private readonly el: LunarElements,
    span: Span,
  ) {
    super(span.startMs, span.endMs);
    this.spacecraftId = spacecraftId;
    this.moon = new MoonEphemeris(span.startMs, span.endMs);
    this.occultedBy(this.moon, el.grazingMarginKm);
    this.n = Math.sqrt(MOON_GM_KM3_S2 / el.semiMajorAxisKm ** 3);
    this.periodS = (2 * Math.PI) / this.n;
    this.scanStepS = Math.min(60, this.periodS / LUNAR_ORBIT_SCAN_SAMPLES_PER_REV);
    const ax = RotationAxis(Body.Moon, astroDays(el.epochMs));
    const a0 = ax.ra * 15 * DEG;
    const d0 = ax.dec * DEG;
    const z = [Math.cos(d0) * Math.cos(a0), Math.cos(d0) * Math.sin(a0), Math.sin(d0)];
    const x = [-Math.sin(a0), Math.cos(a0), 0];
    const y = [z[1]! * x[2]! - z[2]! * x[1]!, z[2]! * x[0]! - z[0]! * x[2]!, z[0]! * x[1]! - z[1]! * x[0]!];
    const O = el.raanDeg * DEG;
    const i = el.inclinationDeg * DEG;
    const w = el.argPericenterDeg * DEG;
    // P, Q in the lunar-equator frame (Vallado eq. 2-… rotation R3(-O) R1(-i) R3(-w))
    const cO = Math.cos(O);
    const sO = Math.sin(O);
    const ci = Math.cos(i);
    const si = Math.sin(i);
    const cw = Math.cos(w);
    const sw = Math.sin(w);
    const pl = [cO * cw - sO * sw * ci, sO * cw + cO * sw * ci, sw * si];
    const ql = [-cO * sw - sO * cw * ci, -sO * sw + cO * cw * ci, cw * si];
    for (let k = 0; k < 3; k++) {
      this.p[k] = pl[0]! * x[k]! + pl[1]! * y[k]! + pl[2]! * z[k]!;
      this.q[k] = ql[0]! * x[k]! + ql[1]! * y[k]! + ql[2]! * z[k]!;
    }
  }

  /** Moon-centred EME2000 state at tMs into out[0..5] (two-body). */
  orbitStateAt(tMs: number, out: Float64Array): void {
    const { eccentricity: e, semiMajorAxisKm: a } = this.el;
    const m = this.el.meanAnomalyDeg * DEG + (this.n * (tMs - this.el.epochMs)) / 1000;
    let E = e < 0.8 ? m : Math.PI;
    for (let it = 0; it < 30; it++) {
      const dE = (E - e * Math.sin(E) - m) / (1 - e * Math.cos(E));
      E -= dE;
      if (Math.abs(dE) < 1e-12) break;
    }
    const cE = Math.cos(E);
    const sE = Math.sin(E);
    const b = a * Math.sqrt(1 - e * e);
    const xp = a * (cE - e);
    const yp = b * sE;
    const rdot = (this.n * a) / (1 - e * cE);
    const vxp = -rdot * sE;
    const vyp = (rdot * b * cE) / a;
    for (let k = 0; k < 3; k++) {
      out[k] = xp * this.p[k]! + yp * this.q[k]!;
      out[k + 3] = vxp * this.p[k]! + vyp * this.q[k]!;
    }
  }

  protected geoEqjAt(tMs: number, out: Float64Array): boolean {
    this.orbitStateAt(tMs, out);
    this.moon.stateAt(tMs, this.moonS);
    for (let k = 0; k < 6; k++) out[k] = out[k]! + this.moonS[k]!;
    return true;
  }
}

export function makeLunarOrbitTarget(spacecraftId: string, el: LunarElements, span: Span): LunarOrbitTarget {
  return new LunarOrbitTarget(spacecraftId, el, span);
}
