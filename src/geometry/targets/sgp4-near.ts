/**
 * SGP4 for near-Earth element sets (satrec.method 'n', periods under 225 min), writing the
 * TEME state into a Float64Array instead of returning new objects: the contact search
 * propagates a million times a run, and satellite.js 7.1.0's `sgp4` allocates four objects
 * per call.
 *
 * Model: SGP4 as revised in D. A. Vallado, P. Crawford, R. Hujsak, T. S. Kelso,
 * "Revisiting Spacetrack Report #3", AIAA 2006-6753 (2006), WGS-72 constants. This is
 * satellite.js 7.1.0's `sgp4` (dist/propagation/sgp4.js, MIT licence) with its deep-space
 * branches removed and its outputs written in place: the same operations in the same
 * order on the same constants (satellite.js `constants`), so the same numbers bit for bit
 * (test/geometry/sgp4-near.test.ts). It sets satrec.t, satrec.error and satrec.tempa as
 * satellite.js does. Deep-space sets (method 'd') are not handled here.
 * Units: minutes since epoch in; km, km/s out.
 *
 * satellite.js's licence, which covers the arithmetic copied here:
 *
 * MIT License
 *
 * Copyright (C) 2013 Shashwat Kandadai, UCSC Jack Baskin School of Engineering
 *
 * Permission is hereby granted, free of charge, to any person obtaining a copy
 * of this software and associated documentation files (the "Software"), to deal
 * in the Software without restriction, including without limitation the rights
 * to use, copy, modify, merge, publish, distribute, sublicense, and/or sell
 * copies of the Software, and to permit persons to whom the Software is
 * furnished to do so, subject to the following conditions:
 *
 * The above copyright notice and this permission notice shall be included in all
 * copies or substantial portions of the Software.
 *
 * THE SOFTWARE IS PROVIDED "AS IS", WITHOUT WARRANTY OF ANY KIND, EXPRESS OR
 * IMPLIED, INCLUDING BUT NOT LIMITED TO THE WARRANTIES OF MERCHANTABILITY,
 * FITNESS FOR A PARTICULAR PURPOSE AND NONINFRINGEMENT. IN NO EVENT SHALL THE
 * AUTHORS OR COPYRIGHT HOLDERS BE LIABLE FOR ANY CLAIM, DAMAGES OR OTHER
 * LIABILITY, WHETHER IN AN ACTION OF CONTRACT, TORT OR OTHERWISE, ARISING FROM,
 * OUT OF OR IN CONNECTION WITH THE SOFTWARE OR THE USE OR OTHER DEALINGS IN THE
 * SOFTWARE.
 */
import { constants, type SatRec } from 'satellite.js';

const { earthRadius, j2, j3oj2, twoPi, vkmpersec, x2o3, xke } = constants;

/** satellite.js SatRecError codes. */
const ERR_NONE = 0;
const ERR_MEAN_ECCENTRICITY = 1;
const ERR_MEAN_MOTION = 2;
const ERR_SEMI_LATUS_RECTUM = 4;
const ERR_DECAYED = 6;

/**
 * The terms of satellite.js's near-Earth `sgp4` that depend on the satrec alone, worked out
 * once per element set by the very expressions `sgp4` evaluates on every call (so the same
 * numbers): (xke / no)^(2/3) and the sine and cosine of the inclination.
 */
export interface NearEarthTerms {
  /** (xke / satrec.no) ** x2o3. */
  readonly xkeOverNoPowX2o3: number;
  /** Math.sin(satrec.inclo), Math.cos(satrec.inclo). */
  readonly sinInclo: number;
  readonly cosInclo: number;
}

/** The satrec-only terms of sgp4NearEarthInto for `satrec` (to pass on every call of a track). */
export function nearEarthTerms(satrec: SatRec): NearEarthTerms {
  return { xkeOverNoPowX2o3: (xke / satrec.no) ** x2o3, sinInclo: Math.sin(satrec.inclo), cosInclo: Math.cos(satrec.inclo) };
}

/**
 * Propagate a near-Earth satrec (method 'n') to tsince minutes from its epoch: TEME position
 * (km) into out[0..2], velocity (km/s) into out[3..5]. Returns 0, or the SGP4 error code
 * (satrec.error is set likewise; out is then left as it was). `terms`: nearEarthTerms(satrec),
 * made once per satrec by a caller that propagates it often.
 */
export function sgp4NearEarthInto(satrec: SatRec, tsince: number, out: Float64Array, terms: NearEarthTerms = nearEarthTerms(satrec)): number {
  let argpm: number;
  let mm: number;
  let nm: number;
  let nodem: number;
  let tempa: number;
  let tempe: number;
  let templ: number;
  sgp4SecularInto(satrec, tsince, secular);
  argpm = secular[0]!;
  mm = secular[1]!;
  nodem = secular[2]!;
  tempa = secular[3]!;
  tempe = secular[4]!;
  templ = secular[5]!;
  nm = satrec.no;
  let em = satrec.ecco;
  const inclm = satrec.inclo;
  if (nm <= 0.0) {
    satrec.error = ERR_MEAN_MOTION;
    return ERR_MEAN_MOTION;
  }
  // nm is satrec.no here: (xke / nm) ** x2o3 is the satrec's own term
  const am = terms.xkeOverNoPowX2o3 * tempa * tempa;
  nm = xke / am ** 1.5;
  em -= tempe;
  if (em >= 1.0 || em < -0.001) {
    satrec.error = ERR_MEAN_ECCENTRICITY;
    return ERR_MEAN_ECCENTRICITY;
  }
  if (em < 1.0e-6) {
    em = 1.0e-6;
  }
  mm += satrec.no * templ;
  let xlm = mm + argpm + nodem;
  nodem %= twoPi;
  argpm %= twoPi;
  xlm %= twoPi;
  mm = (xlm - argpm - nodem) % twoPi;
  // inclm is satrec.inclo: its sine and cosine are the satrec's own terms
  const sinim = terms.sinInclo;
  const cosim = terms.cosInclo;
  const ep = em;
  const xincp = inclm;
  const argpp = argpm;
  const nodep = nodem;
  const mp = mm;
  const sinip = sinim;
  const cosip = cosim;
  return sgp4PeriodicsInto(satrec, ep, argpp, nodep, mp, xincp, sinip, cosip, am, nm, out);
}

/** Scratch of sgp4SecularInto for the two propagators (one thread runs one at a time). */
export const secular = new Float64Array(6);

/**
 * The start of satellite.js's `sgp4` that its near-Earth and deep-space paths share: sets
 * satrec.t, satrec.error and satrec.tempa, and writes the secular gravity and drag terms at
 * tsince minutes into out: argpm, mm, nodem, tempa, tempe, templ.
 */
export function sgp4SecularInto(satrec: SatRec, tsince: number, out: Float64Array): void {
  let argpm: number;
  let mm: number;
  let nodem: number;
  let tempa: number;
  let tempe: number;
  let templ: number;
  satrec.t = tsince;
  satrec.error = ERR_NONE;
  const xmdf = satrec.mo + satrec.mdot * satrec.t;
  const argpdf = satrec.argpo + satrec.argpdot * satrec.t;
  const nodedf = satrec.nodeo + satrec.nodedot * satrec.t;
  argpm = argpdf;
  mm = xmdf;
  const t2 = satrec.t * satrec.t;
  nodem = nodedf + satrec.nodecf * t2;
  tempa = 1.0 - satrec.cc1 * satrec.t;
  tempe = satrec.bstar * satrec.cc4 * satrec.t;
  templ = satrec.t2cof * t2;
  if (satrec.isimp !== 1) {
    const delomg = satrec.omgcof * satrec.t;
    const delmtemp = 1.0 + satrec.eta * Math.cos(xmdf);
    const delm = satrec.xmcof * (delmtemp * delmtemp * delmtemp - satrec.delmo);
    const temp = delomg + delm;
    mm = xmdf + temp;
    argpm = argpdf - temp;
    const t3 = t2 * satrec.t;
    const t4 = t3 * satrec.t;
    tempa = tempa - satrec.d2 * t2 - satrec.d3 * t3 - satrec.d4 * t4;
    tempe += satrec.bstar * satrec.cc5 * (Math.sin(mm) - satrec.sinmao);
    templ = templ + satrec.t3cof * t3 + t4 * (satrec.t4cof + satrec.t * satrec.t5cof);
  }
  satrec.tempa = tempa;
  out[0] = argpm;
  out[1] = mm;
  out[2] = nodem;
  out[3] = tempa;
  out[4] = tempe;
  out[5] = templ;
}

/**
 * The end of satellite.js's `sgp4` that its near-Earth and deep-space paths share, from
 * the long-period terms on: Kepler's equation, the short-period periodics and the TEME
 * state into out[0..5] (km, km/s). The caller has set satrec.aycof, xlcof, con41, x1mth2
 * and x7thm1 for the inclination xincp (sinip, cosip). Returns the SatRecError code.
 */
export function sgp4PeriodicsInto(
  satrec: SatRec,
  ep: number,
  argpp: number,
  nodep: number,
  mp: number,
  xincp: number,
  sinip: number,
  cosip: number,
  am: number,
  nm: number,
  out: Float64Array,
): number {
  const axnl = ep * Math.cos(argpp);
  let temp = 1.0 / (am * (1.0 - ep * ep));
  const aynl = ep * Math.sin(argpp) + temp * satrec.aycof;
  const xl = mp + argpp + nodep + temp * satrec.xlcof * axnl;
  const u = (xl - nodep) % twoPi;
  let eo1 = u;
  let tem5 = 9999.9;
  let sineo1 = 0;
  let coseo1 = 0;
  let ktr = 1;
  while (Math.abs(tem5) >= 1.0e-12 && ktr <= 10) {
    sineo1 = Math.sin(eo1);
    coseo1 = Math.cos(eo1);
    tem5 = 1.0 - coseo1 * axnl - sineo1 * aynl;
    tem5 = (u - aynl * coseo1 + axnl * sineo1 - eo1) / tem5;
    if (Math.abs(tem5) >= 0.95) {
      if (tem5 > 0.0) {
        tem5 = 0.95;
      } else {
        tem5 = -0.95;
      }
    }
    eo1 += tem5;
    ktr += 1;
  }
  const ecose = axnl * coseo1 + aynl * sineo1;
  const esine = axnl * sineo1 - aynl * coseo1;
  const el2 = axnl * axnl + aynl * aynl;
  const pl = am * (1.0 - el2);
  if (pl < 0.0) {
    satrec.error = ERR_SEMI_LATUS_RECTUM;
    return ERR_SEMI_LATUS_RECTUM;
  }
  const rl = am * (1.0 - ecose);
  const rdotl = (Math.sqrt(am) * esine) / rl;
  const rvdotl = Math.sqrt(pl) / rl;
  const betal = Math.sqrt(1.0 - el2);
  temp = esine / (1.0 + betal);
  const sinu = (am / rl) * (sineo1 - aynl - axnl * temp);
  const cosu = (am / rl) * (coseo1 - axnl + aynl * temp);
  let su = Math.atan2(sinu, cosu);
  const sin2u = (cosu + cosu) * sinu;
  const cos2u = 1.0 - 2.0 * sinu * sinu;
  temp = 1.0 / pl;
  const temp1 = 0.5 * j2 * temp;
  const temp2 = temp1 * temp;
  const mrt = rl * (1.0 - 1.5 * temp2 * betal * satrec.con41) + 0.5 * temp1 * satrec.x1mth2 * cos2u;
  if (mrt < 1.0) {
    satrec.error = ERR_DECAYED;
    return ERR_DECAYED;
  }
  su -= 0.25 * temp2 * satrec.x7thm1 * sin2u;
  const xnode = nodep + 1.5 * temp2 * cosip * sin2u;
  const xinc = xincp + 1.5 * temp2 * cosip * sinip * cos2u;
  const mvt = rdotl - (nm * temp1 * satrec.x1mth2 * sin2u) / xke;
  const rvdot = rvdotl + (nm * temp1 * (satrec.x1mth2 * cos2u + 1.5 * satrec.con41)) / xke;
  const sinsu = Math.sin(su);
  const cossu = Math.cos(su);
  const snod = Math.sin(xnode);
  const cnod = Math.cos(xnode);
  const sini = Math.sin(xinc);
  const cosi = Math.cos(xinc);
  const xmx = -snod * cosi;
  const xmy = cnod * cosi;
  const ux = xmx * sinsu + cnod * cossu;
  const uy = xmy * sinsu + snod * cossu;
  const uz = sini * sinsu;
  const vx = xmx * cossu - cnod * sinsu;
  const vy = xmy * cossu - snod * sinsu;
  const vz = sini * cossu;
  out[0] = mrt * ux * earthRadius;
  out[1] = mrt * uy * earthRadius;
  out[2] = mrt * uz * earthRadius;
  out[3] = (mvt * ux + rvdot * vx) * vkmpersec;
  out[4] = (mvt * uy + rvdot * vy) * vkmpersec;
  out[5] = (mvt * uz + rvdot * vz) * vkmpersec;
  return ERR_NONE;
}
