/**
 * SGP4 for deep-space element sets (satrec.method 'd', periods of 225 min and more: SDP4's
 * lunar-solar terms and the 12-h and 24-h resonances), writing the TEME state into a
 * Float64Array: satellite.js 7.1.0's `sgp4` builds option and result objects per call and, for
 * a resonant orbit, integrates the resonance from the epoch in 720-min steps on every call
 * (it never keeps the integrator's state: satrec.atime stays 0), some 280 sines a call a week
 * from the epoch.
 *
 * Model: SGP4/SDP4 as revised in D. A. Vallado, P. Crawford, R. Hujsak, T. S. Kelso,
 * "Revisiting Spacetrack Report #3", AIAA 2006-6753 (2006), WGS-72 constants. This is
 * satellite.js 7.1.0's `sgp4` (dist/propagation/sgp4.js) on its method 'd' branches, with its
 * `dspace` (dspace.js) and `dpper` (dpper.js, init 'n') written in: the same operations in the
 * same order on the same constants, so the same numbers bit for bit
 * (test/geometry/sgp4-deep.test.ts). One change of work, not of numbers: the integrator's
 * states after n steps from the epoch (and the rates there) are the same for every time of
 * the same sign, since each step is a function of the previous state alone, so they are kept
 * per satrec (`DeepSpaceTrack`) and a call steps through the kept ones, computing only
 * those not yet made. It sets satrec.t, satrec.error, satrec.tempa and the long- and
 * short-period coefficients (aycof, xlcof, con41, x1mth2, x7thm1) as satellite.js does.
 * A satrec whose atime is not 0 (satellite.js never sets one) is left to satellite.js.
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
import { constants, sgp4, type SatRec } from 'satellite.js';
import { secular, sgp4PeriodicsInto, sgp4SecularInto } from './sgp4-near.js';

const { earthRadius, j2, j3oj2, pi, twoPi, vkmpersec, x2o3, xke } = constants;

/** satellite.js SatRecError codes. */
const ERR_NONE = 0;
const ERR_MEAN_ECCENTRICITY = 1;
const ERR_MEAN_MOTION = 2;
const ERR_PERTURBED_ECCENTRICITY = 3;
const ERR_SEMI_LATUS_RECTUM = 4;
const ERR_DECAYED = 6;

// dspace's constants
const fasx2 = 0.13130908;
const fasx4 = 2.8843198;
const fasx6 = 0.37448087;
const g22 = 5.7686396;
const g32 = 0.95240898;
const g44 = 1.8014998;
const g52 = 1.050833;
const g54 = 4.4108898;
const rptim = 4.37526908801129966e-3;
const stepp = 720.0;
const stepn = -720.0;
const step2 = 259200.0;
// dpper's constants
const zns = 1.19459e-5;
const zes = 0.01675;
const znl = 1.5835218e-4;
const zel = 0.0549;

/** The resonance integrator's states from the epoch, one way in time: step n's time, xli, xni and the rates there. */
class IntegratorSteps {
  atime: number[] = [];
  xli: number[] = [];
  xni: number[] = [];
  /** Rates at step n (NaN: not yet made). */
  xndt: number[] = [];
  xldot: number[] = [];
  xnddt: number[] = [];
}

/** What a deep-space track keeps between calls: its integrator's steps after the epoch and before it. */
export interface DeepSpaceTrack {
  readonly forward: IntegratorSteps;
  readonly backward: IntegratorSteps;
}

/** A fresh DeepSpaceTrack for one satrec. */
export function newDeepSpaceTrack(): DeepSpaceTrack {
  return { forward: new IntegratorSteps(), backward: new IntegratorSteps() };
}

// dspace's and dpper's results of the current call (single-threaded, never held across calls)
let rEm = 0;
let rArgpm = 0;
let rInclm = 0;
let rMm = 0;
let rNodem = 0;
let rNm = 0;
let pEp = 0;
let pInclp = 0;
let pNodep = 0;
let pArgpp = 0;
let pMp = 0;

/** The rates of satellite.js dspace's loop body at step n of `s` into s.xndt/xldot/xnddt[n]. */
function ratesAt(satrec: SatRec, s: IntegratorSteps, n: number): void {
  const irez = satrec.irez;
  const xli = s.xli[n]!;
  const xni = s.xni[n]!;
  const atime = s.atime[n]!;
  let xndt: number;
  let xldot: number;
  let xnddt: number;
  if (irez !== 2) {
    const del1 = satrec.del1;
    const del2 = satrec.del2;
    const del3 = satrec.del3;
    xndt = del1 * Math.sin(xli - fasx2) + del2 * Math.sin(2.0 * (xli - fasx4)) + del3 * Math.sin(3.0 * (xli - fasx6));
    xldot = xni + satrec.xfact;
    xnddt = del1 * Math.cos(xli - fasx2) + 2.0 * del2 * Math.cos(2.0 * (xli - fasx4)) + 3.0 * del3 * Math.cos(3.0 * (xli - fasx6));
    xnddt *= xldot;
  } else {
    const xomi = satrec.argpo + satrec.argpdot * atime;
    const x2omi = xomi + xomi;
    const x2li = xli + xli;
    xndt =
      satrec.d2201 * Math.sin(x2omi + xli - g22) +
      satrec.d2211 * Math.sin(xli - g22) +
      satrec.d3210 * Math.sin(xomi + xli - g32) +
      satrec.d3222 * Math.sin(-xomi + xli - g32) +
      satrec.d4410 * Math.sin(x2omi + x2li - g44) +
      satrec.d4422 * Math.sin(x2li - g44) +
      satrec.d5220 * Math.sin(xomi + xli - g52) +
      satrec.d5232 * Math.sin(-xomi + xli - g52) +
      satrec.d5421 * Math.sin(xomi + x2li - g54) +
      satrec.d5433 * Math.sin(-xomi + x2li - g54);
    xldot = xni + satrec.xfact;
    xnddt =
      satrec.d2201 * Math.cos(x2omi + xli - g22) +
      satrec.d2211 * Math.cos(xli - g22) +
      satrec.d3210 * Math.cos(xomi + xli - g32) +
      satrec.d3222 * Math.cos(-xomi + xli - g32) +
      satrec.d5220 * Math.cos(xomi + xli - g52) +
      satrec.d5232 * Math.cos(-xomi + xli - g52) +
      2.0 *
        (satrec.d4410 * Math.cos(x2omi + x2li - g44) +
          satrec.d4422 * Math.cos(x2li - g44) +
          satrec.d5421 * Math.cos(xomi + x2li - g54) +
          satrec.d5433 * Math.cos(-xomi + x2li - g54));
    xnddt *= xldot;
  }
  s.xndt[n] = xndt;
  s.xldot[n] = xldot;
  s.xnddt[n] = xnddt;
}

/** satellite.js dspace for a restarted integrator (atime 0), results into rEm..rNm. */
function dspaceInto(satrec: SatRec, track: DeepSpaceTrack, t: number, tc: number, em: number, argpm: number, inclm: number, mm: number, nodem: number, nm: number): void {
  const irez = satrec.irez;
  const no = satrec.no;
  const theta = (satrec.gsto + tc * rptim) % twoPi;
  em += satrec.dedt * t;
  inclm += satrec.didt * t;
  argpm += satrec.domdt * t;
  nodem += satrec.dnodt * t;
  mm += satrec.dmdt * t;
  if (irez !== 0) {
    // restarted: atime 0, xni no, xli xlamo (the caller has checked satellite.js's restart condition)
    let delt: number;
    if (t > 0.0) delt = stepp;
    else delt = stepn;
    const s = delt === stepp ? track.forward : track.backward;
    if (s.atime.length === 0) {
      s.atime.push(0.0);
      s.xni.push(no);
      s.xli.push(satrec.xlamo);
    }
    let n = 0;
    let ft = 0.0;
    for (;;) {
      if (s.xndt.length <= n) ratesAt(satrec, s, n);
      const atime = s.atime[n]!;
      if (Math.abs(t - atime) >= stepp) {
        if (s.atime.length <= n + 1) {
          // satellite.js: xli += xldot * delt + xndt * step2 (the sum of both terms added)
          s.xli.push(s.xli[n]! + (s.xldot[n]! * delt + s.xndt[n]! * step2));
          s.xni.push(s.xni[n]! + (s.xndt[n]! * delt + s.xnddt[n]! * step2));
          s.atime.push(atime + delt);
        }
        n++;
      } else {
        ft = t - atime;
        break;
      }
    }
    const xli = s.xli[n]!;
    const xni = s.xni[n]!;
    const xndt = s.xndt[n]!;
    const xldot = s.xldot[n]!;
    const xnddt = s.xnddt[n]!;
    nm = xni + xndt * ft + xnddt * ft * ft * 0.5;
    const xl = xli + xldot * ft + xndt * ft * ft * 0.5;
    let dndt: number;
    if (irez !== 1) {
      mm = xl - 2.0 * nodem + 2.0 * theta;
      dndt = nm - no;
    } else {
      mm = xl - nodem - argpm + theta;
      dndt = nm - no;
    }
    nm = no + dndt;
  }
  rEm = em;
  rArgpm = argpm;
  rInclm = inclm;
  rMm = mm;
  rNodem = nodem;
  rNm = nm;
}

/** satellite.js dpper with init 'n', results into pEp..pMp. */
function dpperInto(satrec: SatRec, ep: number, inclp: number, nodep: number, argpp: number, mp: number): void {
  const t = satrec.t;
  const opsmode = satrec.operationmode;
  let zm = satrec.zmos + zns * t;
  let zf = zm + 2.0 * zes * Math.sin(zm);
  let sinzf = Math.sin(zf);
  let f2 = 0.5 * sinzf * sinzf - 0.25;
  let f3 = -0.5 * sinzf * Math.cos(zf);
  const ses = satrec.se2 * f2 + satrec.se3 * f3;
  const sis = satrec.si2 * f2 + satrec.si3 * f3;
  const sls = satrec.sl2 * f2 + satrec.sl3 * f3 + satrec.sl4 * sinzf;
  const sghs = satrec.sgh2 * f2 + satrec.sgh3 * f3 + satrec.sgh4 * sinzf;
  const shs = satrec.sh2 * f2 + satrec.sh3 * f3;
  zm = satrec.zmol + znl * t;
  zf = zm + 2.0 * zel * Math.sin(zm);
  sinzf = Math.sin(zf);
  f2 = 0.5 * sinzf * sinzf - 0.25;
  f3 = -0.5 * sinzf * Math.cos(zf);
  const sel = satrec.ee2 * f2 + satrec.e3 * f3;
  const sil = satrec.xi2 * f2 + satrec.xi3 * f3;
  const sll = satrec.xl2 * f2 + satrec.xl3 * f3 + satrec.xl4 * sinzf;
  const sghl = satrec.xgh2 * f2 + satrec.xgh3 * f3 + satrec.xgh4 * sinzf;
  const shll = satrec.xh2 * f2 + satrec.xh3 * f3;
  let pe = ses + sel;
  let pinc = sis + sil;
  let pl = sls + sll;
  let pgh = sghs + sghl;
  let ph = shs + shll;
  // init 'n'
  pe -= satrec.peo;
  pinc -= satrec.pinco;
  pl -= satrec.plo;
  pgh -= satrec.pgho;
  ph -= satrec.pho;
  inclp += pinc;
  ep += pe;
  const sinip = Math.sin(inclp);
  const cosip = Math.cos(inclp);
  if (inclp >= 0.2) {
    ph /= sinip;
    pgh -= cosip * ph;
    argpp += pgh;
    nodep += ph;
    mp += pl;
  } else {
    // periodics with the Lyddane modification
    const sinop = Math.sin(nodep);
    const cosop = Math.cos(nodep);
    let alfdp = sinip * sinop;
    let betdp = sinip * cosop;
    const dalf = ph * cosop + pinc * cosip * sinop;
    const dbet = -ph * sinop + pinc * cosip * cosop;
    alfdp += dalf;
    betdp += dbet;
    nodep %= twoPi;
    if (nodep < 0.0 && opsmode === 'a') nodep += twoPi;
    let xls = mp + argpp + cosip * nodep;
    const dls = pl + pgh - pinc * nodep * sinip;
    xls += dls;
    const xnoh = nodep;
    nodep = Math.atan2(alfdp, betdp);
    if (nodep < 0.0 && opsmode === 'a') nodep += twoPi;
    if (Math.abs(xnoh - nodep) > pi) {
      if (nodep < xnoh) nodep += twoPi;
      else nodep -= twoPi;
    }
    mp += pl;
    argpp = xls - mp - cosip * nodep;
  }
  pEp = ep;
  pInclp = inclp;
  pNodep = nodep;
  pArgpp = argpp;
  pMp = mp;
}

/**
 * Propagate a deep-space satrec (method 'd') to tsince minutes from its epoch: TEME position
 * (km) into out[0..2], velocity (km/s) into out[3..5]. Returns 0, or the SGP4 error code
 * (satrec.error is set likewise; out is then left as it was; -1 for a null state without a
 * code, as sgp4.ts SGP4_NON_FINITE). `track`: this satrec's own
 * DeepSpaceTrack (newDeepSpaceTrack), kept across its calls.
 */
export function sgp4DeepSpaceInto(satrec: SatRec, tsince: number, out: Float64Array, track: DeepSpaceTrack): number {
  const atime0 = satrec.atime;
  if (satrec.irez !== 0 && !(atime0 === 0.0 || tsince * atime0 <= 0.0 || Math.abs(tsince) < Math.abs(atime0))) {
    // an integrator state satellite.js itself would continue from: its own code
    const pv = sgp4(satrec, tsince);
    if (pv === null) return satrec.error !== ERR_NONE ? satrec.error : -1;
    const v = pv.velocity as { x: number; y: number; z: number };
    out[0] = pv.position.x;
    out[1] = pv.position.y;
    out[2] = pv.position.z;
    out[3] = v.x;
    out[4] = v.y;
    out[5] = v.z;
    return ERR_NONE;
  }
  let argpm: number;
  let mm: number;
  let nm: number;
  let nodem: number;
  let tempa: number;
  let tempe: number;
  let templ: number;
  const temp4 = 1.5e-12;
  sgp4SecularInto(satrec, tsince, secular);
  argpm = secular[0]!;
  mm = secular[1]!;
  nodem = secular[2]!;
  tempa = secular[3]!;
  tempe = secular[4]!;
  templ = secular[5]!;
  nm = satrec.no;
  let em = satrec.ecco;
  let inclm = satrec.inclo;
  // method 'd': deep-space resonance and secular effects
  const tc = satrec.t;
  dspaceInto(satrec, track, satrec.t, tc, em, argpm, inclm, mm, nodem, nm);
  em = rEm;
  argpm = rArgpm;
  inclm = rInclm;
  mm = rMm;
  nodem = rNodem;
  nm = rNm;
  if (nm <= 0.0) {
    satrec.error = ERR_MEAN_MOTION;
    return ERR_MEAN_MOTION;
  }
  const am = (xke / nm) ** x2o3 * tempa * tempa;
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
  // (satellite.js's sin and cos of inclm here are overwritten below for method 'd')
  // lunar-solar periodics
  dpperInto(satrec, em, inclm, nodem, argpm, mm);
  let ep = pEp;
  let nodep = pNodep;
  let argpp = pArgpp;
  const mp = pMp;
  let xincp = pInclp;
  if (xincp < 0.0) {
    xincp = -xincp;
    nodep += pi;
    argpp -= pi;
  }
  if (ep < 0.0 || ep > 1.0) {
    satrec.error = ERR_PERTURBED_ECCENTRICITY;
    return ERR_PERTURBED_ECCENTRICITY;
  }
  // long-period periodics
  const sinip = Math.sin(xincp);
  const cosip = Math.cos(xincp);
  satrec.aycof = -0.5 * j3oj2 * sinip;
  if (Math.abs(cosip + 1.0) > 1.5e-12) {
    satrec.xlcof = (-0.25 * j3oj2 * sinip * (3.0 + 5.0 * cosip)) / (1.0 + cosip);
  } else {
    satrec.xlcof = (-0.25 * j3oj2 * sinip * (3.0 + 5.0 * cosip)) / temp4;
  }
  // short-period periodics (method 'd'): the inclination's terms, then the part both paths share
  const cosisq = cosip * cosip;
  satrec.con41 = 3.0 * cosisq - 1.0;
  satrec.x1mth2 = 1.0 - cosisq;
  satrec.x7thm1 = 7.0 * cosisq - 1.0;
  return sgp4PeriodicsInto(satrec, ep, argpp, nodep, mp, xincp, sinip, cosip, am, nm, out);
}
