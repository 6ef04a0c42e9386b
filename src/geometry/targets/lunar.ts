/**
 * A transmitter on the lunar surface, at selenographic latitude, longitude (east
 * positive) and height above the mean radius, with its own horizon mask on the Moon.
 *
 * Frame: the Moon's body-fixed frame of the IAU WGCCRE 2015 rotation model (Archinal et
 * al., Celest. Mech. Dyn. Astr. 130:22 (2018), Table 2: pole alpha0, delta0 and prime
 * meridian W with the E1..E13 libration terms), as computed by astronomy-engine 2.1.19
 * `RotationAxis(Body.Moon)`; it approximates the Mean Earth / polar axis frame of lunar
 * maps to ~0.1 km. alpha0, delta0 and W are tabulated every LUNAR_AXIS_STEP_S and taken
 * linear between nodes (their fastest terms have periods of days: error < 1e-5 deg).
 * Body axes in EME2000: z = pole (cos d0 cos a0, cos d0 sin a0, sin d0); x = the prime
 * meridian, W along the body equator from its ascending node N = (-sin a0, cos a0, 0):
 * x = cos W N + sin W (z x N), y = z x x. The site is a point of the sphere of mean
 * radius 1737.4 km (+ height), its up the radial direction, azimuth from lunar north.
 * Position = geocentric Moon (moon-ephemeris.ts) + the site vector; velocity adds
 * dW/dt z x site. Light time and Earth-fixed axes: geometry/light-time.ts.
 *
 * Sight: a contact needs the station to see the site above the station's mask (the
 * contact search), the site not behind the Moon's limb, and the station above the site's
 * own mask. Both lunar conditions are the station's elevation in the site's sky,
 *   g = min(el - mask(az), el + dip),  dip = acos(R / (R + h))  (the geometric horizon),
 * deg (> 0: sight). Libration moves the Earth in a near-polar site's sky by several
 * degrees over a month, so windows open and close with it.
 * Units: degrees, km, km/s, UTC epoch ms.
 */
import { Body, RotationAxis } from 'astronomy-engine';
import type { LunarSite, Span } from '../../scenario/types.js';
import { LightTimeTarget } from '../light-time.js';
import { maskElevationDeg, prepareMask, type PreparedMask } from '../mask.js';
import { MOON_MEAN_RADIUS_KM, MoonEphemeris } from './moon-ephemeris.js';
import { astroDays } from './ofDate.js';

export const LUNAR_AXIS_STEP_S = 3600;
/** Scan step of the contact search for a lunar site, s (windows last days; libration edges are slow). */
export const LUNAR_SITE_SCAN_STEP_S = 600;
const DEG = Math.PI / 180;

/** The Moon's orientation (alpha0, delta0, W in rad) tabulated over a span. */
export class LunarAxes {
  private readonly t0Ms: number;
  private readonly n: number;
  private readonly v: Float64Array;

  constructor(startMs: number, endMs: number) {
    const stepMs = LUNAR_AXIS_STEP_S * 1000;
    this.t0Ms = startMs - 2 * 86_400_000;
    this.n = Math.ceil((endMs + 2 * 86_400_000 - this.t0Ms) / stepMs) + 1;
    this.v = new Float64Array(3 * this.n);
    let prevW = Number.NaN;
    for (let k = 0; k < this.n; k++) {
      const a = RotationAxis(Body.Moon, astroDays(this.t0Ms + k * stepMs));
      let w = a.spin * DEG;
      if (prevW === prevW) while (w < prevW) w += 2 * Math.PI; // unwrap: W grows 13.2 deg/day
      prevW = w;
      this.v[3 * k] = a.ra * 15 * DEG;
      this.v[3 * k + 1] = a.dec * DEG;
      this.v[3 * k + 2] = w;
    }
  }

  /**
   * Body axes at tMs into axes[0..8] (rows x, y, z in EME2000); returns dW/dt, rad/s.
   */
  at(tMs: number, axes: Float64Array): number {
    const stepMs = LUNAR_AXIS_STEP_S * 1000;
    const x = (tMs - this.t0Ms) / stepMs;
    const k = Math.min(this.n - 2, Math.max(0, Math.floor(x)));
    const s = x - k;
    const t = this.v;
    const a0 = t[3 * k]! + s * (t[3 * k + 3]! - t[3 * k]!);
    const d0 = t[3 * k + 1]! + s * (t[3 * k + 4]! - t[3 * k + 1]!);
    const w = t[3 * k + 2]! + s * (t[3 * k + 5]! - t[3 * k + 2]!);
    const wDot = (t[3 * k + 5]! - t[3 * k + 2]!) / LUNAR_AXIS_STEP_S;
    const ca = Math.cos(a0);
    const sa = Math.sin(a0);
    const cd = Math.cos(d0);
    const sd = Math.sin(d0);
    const zx = cd * ca;
    const zy = cd * sa;
    const zz = sd;
    const nx = -sa;
    const ny = ca;
    // z x N (N has no z component)
    const qx = -zz * ny;
    const qy = zz * nx;
    const qz = zx * ny - zy * nx;
    const cw = Math.cos(w);
    const sw = Math.sin(w);
    const xx = cw * nx + sw * qx;
    const xy = cw * ny + sw * qy;
    const xz = sw * qz;
    axes[0] = xx;
    axes[1] = xy;
    axes[2] = xz;
    axes[3] = zy * xz - zz * xy;
    axes[4] = zz * xx - zx * xz;
    axes[5] = zx * xy - zy * xx;
    axes[6] = zx;
    axes[7] = zy;
    axes[8] = zz;
    return wDot;
  }
}

/** A direction in the site's sky: azimuth from lunar north through east, elevation, deg. */
export interface LunarSky {
  azimuthDeg: number;
  elevationDeg: number;
}

export class LunarSiteTarget extends LightTimeTarget {
  readonly spacecraftId: string;
  readonly scanStepS = LUNAR_SITE_SCAN_STEP_S;
  private readonly moon: MoonEphemeris;
  private readonly axes: LunarAxes;
  private readonly mask: PreparedMask;
  private readonly dipDeg: number;
  /** Site in body axes: position (km), east, north, up. */
  private readonly pBody: Float64Array;
  private readonly eBody: Float64Array;
  private readonly nBody: Float64Array;
  private readonly ax = new Float64Array(9);
  private readonly moonS = new Float64Array(6);
  private readonly eqj = new Float64Array(9);
  private readonly ecef = new Float64Array(9);
  private readonly vec = new Float64Array(3);
  private readonly siteEcef = new Float64Array(3);
  private axesAtMs = Number.NaN;
  private readonly sky: LunarSky = { azimuthDeg: 0, elevationDeg: 0 };

  constructor(spacecraftId: string, site: LunarSite, span: Span) {
    super(span.startMs, span.endMs);
    this.spacecraftId = spacecraftId;
    this.moon = new MoonEphemeris(span.startMs, span.endMs);
    this.axes = new LunarAxes(span.startMs, span.endMs);
    this.mask = prepareMask(site.mask);
    const rKm = MOON_MEAN_RADIUS_KM + site.heightKm;
    this.dipDeg = Math.acos(MOON_MEAN_RADIUS_KM / rKm) / DEG;
    const la = site.latitudeDeg * DEG;
    const lo = site.longitudeDeg * DEG;
    this.pBody = Float64Array.of(rKm * Math.cos(la) * Math.cos(lo), rKm * Math.cos(la) * Math.sin(lo), rKm * Math.sin(la));
    this.eBody = Float64Array.of(-Math.sin(lo), Math.cos(lo), 0);
    this.nBody = Float64Array.of(-Math.sin(la) * Math.cos(lo), -Math.sin(la) * Math.sin(lo), Math.cos(la));
  }

  /** Body-axes vector b into EME2000 with axes rows (x, y, z), out[o..o+2]. */
  private toEqj(b: Float64Array, out: Float64Array, o: number): void {
    const a = this.ax;
    out[o] = b[0]! * a[0]! + b[1]! * a[3]! + b[2]! * a[6]!;
    out[o + 1] = b[0]! * a[1]! + b[1]! * a[4]! + b[2]! * a[7]!;
    out[o + 2] = b[0]! * a[2]! + b[1]! * a[5]! + b[2]! * a[8]!;
  }

  protected geoEqjAt(tMs: number, out: Float64Array): boolean {
    this.moon.stateAt(tMs, this.moonS);
    const wDot = this.axes.at(tMs, this.ax);
    this.toEqj(this.pBody, this.vec, 0);
    const px = this.vec[0]!;
    const py = this.vec[1]!;
    const pz = this.vec[2]!;
    const zx = this.ax[6]!;
    const zy = this.ax[7]!;
    const zz = this.ax[8]!;
    out[0] = this.moonS[0]! + px;
    out[1] = this.moonS[1]! + py;
    out[2] = this.moonS[2]! + pz;
    out[3] = this.moonS[3]! + wDot * (zy * pz - zz * py);
    out[4] = this.moonS[4]! + wDot * (zz * px - zx * pz);
    out[5] = this.moonS[5]! + wDot * (zx * py - zy * px);
    return true;
  }

  /** The site's east, north, up and position in ECEF at the last state (once per state). */
  private siteAxesEcef(): void {
    if (this.axesAtMs === this.lastTransmitMs) return;
    this.axes.at(this.lastTransmitMs, this.ax);
    this.moon.stateAt(this.lastTransmitMs, this.moonS);
    this.toEqj(this.eBody, this.eqj, 0);
    this.toEqj(this.nBody, this.eqj, 3);
    this.toEqj(this.pBody, this.eqj, 6);
    for (let i = 0; i < 3; i++) {
      this.eqjToEcef(this.eqj, this.ecef, 3 * i, 3 * i);
    }
    for (let i = 0; i < 3; i++) this.vec[i] = this.moonS[i]! + this.eqj[6 + i]!;
    this.eqjToEcef(this.vec, this.siteEcef);
    // up is the radial direction: normalise the rotated site vector
    const r = Math.hypot(this.ecef[6]!, this.ecef[7]!, this.ecef[8]!);
    for (let i = 6; i < 9; i++) this.ecef[i] = this.ecef[i]! / r;
    this.axesAtMs = this.lastTransmitMs;
  }

  /** Where a point (ECEF km) lies in the site's sky at the last state, written into and returned as one reused object. */
  skyOf(pointEcefKm: ArrayLike<number>): LunarSky {
    this.siteAxesEcef();
    const dx = pointEcefKm[0]! - this.siteEcef[0]!;
    const dy = pointEcefKm[1]! - this.siteEcef[1]!;
    const dz = pointEcefKm[2]! - this.siteEcef[2]!;
    const e = this.ecef;
    const east = e[0]! * dx + e[1]! * dy + e[2]! * dz;
    const north = e[3]! * dx + e[4]! * dy + e[5]! * dz;
    const up = e[6]! * dx + e[7]! * dy + e[8]! * dz;
    let az = Math.atan2(east, north) / DEG;
    if (az < 0) az += 360;
    this.sky.azimuthDeg = az;
    this.sky.elevationDeg = Math.atan2(up, Math.hypot(east, north)) / DEG;
    return this.sky;
  }

  override sightMarginDeg(stationEcefKm: ArrayLike<number>): number {
    const sky = this.skyOf(stationEcefKm);
    const el = sky.elevationDeg;
    return Math.min(el - maskElevationDeg(this.mask, sky.azimuthDeg), el + this.dipDeg);
  }
}

export function makeLunarSiteTarget(spacecraftId: string, site: LunarSite, span: Span): LunarSiteTarget {
  return new LunarSiteTarget(spacecraftId, site, span);
}
