/**
 * Time series of one contact (elevation, data rate, margin) for charts: the
 * contact is re-sampled with the same pieces the link engine uses (target
 * state, lookFrom, evaluateLink), on its own grid AOS + k * stepS plus LOS.
 *
 * The rate follows the volume rule of link.ts: 0 before the data start
 * (AOS + acquisition time) and where the link does not close; so the
 * integral of `rateBps` over `tMs` is the contact's volume (to the sampling
 * error of a chart: the series is for drawing, the volume comes from link.ts).
 */
import { makeSite } from '../geometry/earth.js';
import { lookFrom, newLook } from '../geometry/topocentric.js';
import type { Site, Target } from '../geometry/types.js';
import { evaluateLink } from '../link/budget.js';
import { newLinkSample, type PreparedLink } from '../link/types.js';
import type { Scenario, Span } from '../scenario/types.js';
import { makeTarget, skyBodiesFor } from './contacts.js';
import { bodyTempK, lowestMaskDeg, prepareRadioAtStation, radioHeardAt } from './link.js';
import { newBodyAngles, type SkyBodies } from '../geometry/sky-bodies.js';
import type { Contact, PlanResult } from './types.js';

export interface ContactSeries {
  stationId: string;
  spacecraftId: string;
  radioId: string;
  aosMs: number;
  losMs: number;
  dataStartMs: number;
  stepS: number;
  tMs: Float64Array;
  elevationDeg: Float64Array;
  azimuthDeg: Float64Array;
  rateBps: Float64Array;
  marginDb: Float64Array;
  /** The MODCOD (adaptive) or code (fixed) in use at each sample, an index into `modcodNames`; -1: none closes. */
  modcodIndex: Int16Array;
  modcodNames: readonly string[];
  /** The receive antenna's 3 dB beamwidth, deg (NaN when unknown). */
  rxBeamwidthDeg: number;
}

/** Default number of intervals a charted contact is cut into. */
export const DEFAULT_SERIES_POINTS = 240;

/** Whole-second step giving at most `maxPoints` intervals over the contact, >= minStepS. */
export function seriesStepS(durationS: number, maxPoints: number, minStepS = 1): number {
  return Math.max(minStepS, Math.ceil(durationS / maxPoints));
}

/**
 * Samples one contact at AOS, AOS + k * stepS (k >= 1, before LOS) and LOS.
 * Times where the target has no valid state (track ended) are left out.
 */
export function sampleContact(
  contact: Contact,
  target: Target,
  site: Site,
  link: PreparedLink,
  acquisitionTimeS: number,
  stepS: number,
  sky: SkyBodies,
): ContactSeries {
  const angles = newBodyAngles();
  if (!(stepS > 0)) throw new Error(`sampleContact: stepS must be > 0 (got ${stepS})`);
  const stepMs = stepS * 1000;
  const n = Math.max(0, Math.ceil((contact.losMs - contact.aosMs) / stepMs - 1e-9)) + 1;
  const tMs = new Float64Array(n);
  const elevationDeg = new Float64Array(n);
  const azimuthDeg = new Float64Array(n);
  const modcodIndex = new Int16Array(n);
  const rateBps = new Float64Array(n);
  const marginDb = new Float64Array(n);
  const dataStartMs = Math.min(contact.aosMs + acquisitionTimeS * 1000, contact.losMs);
  const state = new Float64Array(6);
  const look = newLook();
  const sample = newLinkSample();
  let m = 0;
  for (let k = 0; k < n; k++) {
    const t = k === n - 1 ? contact.losMs : contact.aosMs + k * stepMs;
    if (!target.stateEcefAt(t, state)) continue;
    lookFrom(site, state, look);
    sky.at(t);
    evaluateLink(link, look, sample, true, bodyTempK(link, sky, site, state, angles));
    tMs[m] = t;
    elevationDeg[m] = look.elevationDeg;
    azimuthDeg[m] = look.azimuthDeg;
    modcodIndex[m] = link.codingKind === 'fixed' ? (sample.rateBps > 0 ? 0 : -1) : sample.modcodIndex;
    rateBps[m] = t >= dataStartMs ? sample.rateBps : 0;
    marginDb[m] = sample.closureMarginDb;
    m++;
  }
  return {
    stationId: contact.stationId,
    spacecraftId: contact.spacecraftId,
    radioId: link.radioId,
    aosMs: contact.aosMs,
    losMs: contact.losMs,
    dataStartMs,
    stepS,
    tMs: tMs.slice(0, m),
    elevationDeg: elevationDeg.slice(0, m),
    azimuthDeg: azimuthDeg.slice(0, m),
    rateBps: rateBps.slice(0, m),
    marginDb: marginDb.slice(0, m),
    modcodIndex: modcodIndex.slice(0, m),
    modcodNames: link.codingKind === 'fixed' ? [link.codingName] : link.modcodTable.map((e) => e.name),
    rxBeamwidthDeg: link.rxBeamwidthDeg,
  };
}

/**
 * The passes that matter, each once: the highest volume, the worst closure margin and the
 * longest (ties: the first in plan order), with why each was chosen; among the passes
 * wholly inside the span when there are any.
 */
export function passesThatMatter(plan: PlanResult): { contact: Contact; why: string[] }[] {
  // passes wholly inside the span (a geostationary "pass" as long as the span is not one); all when none is
  const whole = plan.contacts.filter((c) => !c.aosClipped && !c.losClipped);
  const pool = whole.length > 0 ? whole : plan.contacts;
  const linked = pool.filter((c) => c.link !== undefined);
  const pick = (pool: readonly Contact[], better: (a: Contact, b: Contact) => boolean): Contact | undefined =>
    pool.reduce<Contact | undefined>((b, c) => (b === undefined || better(c, b) ? c : b), undefined);
  const chosen: [Contact | undefined, string][] = [
    [pick(linked, (a, b) => a.link!.volumeBits > b.link!.volumeBits), 'best: highest volume'],
    [pick(linked, (a, b) => a.link!.worstMarginDb < b.link!.worstMarginDb), 'worst closure margin'],
    [pick(pool, (a, b) => a.durationS > b.durationS), 'longest'],
  ];
  const out: { contact: Contact; why: string[] }[] = [];
  for (const [c, why] of chosen) {
    if (!c) continue;
    const same = out.find((o) => o.contact === c);
    if (same) same.why.push(why);
    else out.push({ contact: c, why: [why] });
  }
  return out;
}

/** The highest-volume contact of each spacecraft (plan order; ties: the earlier AOS). */
export function highestVolumeContacts(plan: PlanResult): Contact[] {
  const best = new Map<string, Contact>();
  for (const c of plan.contacts) {
    if (!c.link) continue;
    const b = best.get(c.spacecraftId);
    if (!b || c.link.volumeBits > (b.link?.volumeBits ?? 0) || (c.link.volumeBits === b.link?.volumeBits && c.aosMs < b.aosMs)) {
      best.set(c.spacecraftId, c);
    }
  }
  return plan.spacecraft.flatMap((s) => {
    const c = best.get(s.id);
    return c ? [c] : [];
  });
}

/**
 * Series for the given contacts of a plan made from `scenario` over `span`:
 * builds each pair's target, site and prepared link as the plan did
 * (data radio = radios[0], atmosphere table from the lowest mask elevation).
 */
export function seriesForContacts(
  scenario: Scenario,
  span: Span,
  contacts: readonly Contact[],
  maxPoints: number = DEFAULT_SERIES_POINTS,
): ContactSeries[] {
  const out: ContactSeries[] = [];
  const targets = new Map<string, Target>();
  for (const c of contacts) {
    const sc = scenario.spacecraft.find((s) => s.id === c.spacecraftId);
    const station = scenario.stations.find((s) => s.id === c.stationId);
    const radio = sc?.radios[0];
    if (!sc || !station || !radio || !radioHeardAt(station, radio)) continue;
    let target = targets.get(sc.id);
    if (!target) {
      target = makeTarget(sc, span);
      targets.set(sc.id, target);
    }
    const site = makeSite(station.id, station.latitudeDeg, station.longitudeDeg, station.heightKm);
    const link = prepareRadioAtStation(radio, station, site, scenario.link, lowestMaskDeg(station));
    const stepS = seriesStepS(c.durationS, maxPoints);
    // the span's Sun and Moon, made when a series first needs them and shared with the plan's (plan/contacts.ts)
    out.push(sampleContact(c, target, site, link, scenario.link.acquisitionTimeS, stepS, skyBodiesFor(span)));
  }
  return out;
}
