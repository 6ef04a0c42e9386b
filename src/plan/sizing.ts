/**
 * Sizing: the inverse question. What transmit power (or station dish, or
 * symbol rate) makes the link reach a target?
 *
 * Week mode (`sizeForWeek`): the smallest value at which one spacecraft's
 * delivered volume over the span (its radio's data counted once: unique-volume.ts), divided by the span's days, reaches a target
 * daily volume at the scenario's availability. Geometry (targets, sites,
 * contact windows) and a baseline link run are computed once; each candidate
 * re-runs the link engine (prepareRadioAtStation + integrateContacts) only over
 * fresh copies of the contacts whose budget the candidate changes:
 *   power, symbol rate: the spacecraft's contacts at every station;
 *   dish: every spacecraft's contacts at the station(s) whose dish changes.
 * Volume basis: 'scheduled' (the antenna schedule of schedule.ts is re-run at
 * each candidate, so a stronger link may also win more windows) or
 * 'unscheduled' (every window counts). 'auto' picks scheduled when some
 * station has more windows in progress at once than antennas (setup included),
 * else unscheduled (both then give the same answer).
 * Searches:
 *   power: delivered volume does not fall as power rises for a fixed schedule
 *     (each sample's rate is a non-decreasing step function of power), so the
 *     threshold is bracketed in 10 dB steps from the radio's power (limits -60
 *     .. +60 dBW, the file format's range) and bisected to 0.01 dB. With the
 *     schedule re-run, monotonicity is not proven (a window can change hands);
 *     the answer is then a power that meets the target with the power 0.01 dB
 *     lower failing.
 *   dish, symbol rate: not monotone (a bigger dish has a narrower beam and a
 *     larger pointing loss; a higher symbol rate lowers Es/N0), so a geometric
 *     scan (x1.25 steps, from 0.5 m / from the lowest symbol rate that could
 *     carry the target in the contact time at the best efficiency) finds the
 *     first value that meets the target, refined by bisection to 0.1 %. A
 *     passing band narrower than one scan step could be missed.
 *
 * One-geometry mode (`sizePowerAtGeometry`): the power at which one budget, at
 * a stated elevation and/or range, just carries a target rate. Closed form:
 * for a given code the margin is linear in transmit power with slope 1 dB/dB
 * (power enters C/N0 additively in dB, budget.ts), so
 *   P = P_now - margin_now(code).
 * Fixed coding: the code's rate must be >= the target. Adaptive: the cheapest
 * entry (lowest Es/N0 threshold, ties to the higher efficiency) whose rate
 * efficiency x symbol rate is >= the target.
 *
 * Pure: no I/O.
 */
import { ModelRangeError, ScenarioError, UsageError } from '../errors.js';
import type { Look } from '../geometry/types.js';
import type { AtmosphereTable } from '../link/atmosphere/types.js';
import { evaluateLink } from '../link/budget.js';
import { newLinkSample, type PreparedLink } from '../link/types.js';
import type { Radio, Receiver, Scenario, Span, Station } from '../scenario/types.js';
import { findContacts, prepareGeometry, type Geometry } from './contacts.js';
import { integrateContacts, linkKey, lowestMaskDeg, prepareLinks, prepareRadioAtStation, radioHeardAt, type LinkSetup } from './link.js';
import { maxDepth, scheduleContacts } from './schedule.js';
import { preparePoint, withOverrides, type LinkOverrides } from './single.js';
import { SolverLimitError } from '../geometry/roots.js';
import { uniqueVolumeOf } from './unique-volume.js';

/** Bisection steps any sizing search may take (a 120 dB or 1e6:1 bracket needs under 40): past it, a bug. */
const MAX_BISECTIONS = 200;
import { planResult } from './run.js';
import type { Contact, PlanResult } from './types.js';

export type SolveFor = 'power' | 'dish' | 'symbol-rate';
export type VolumeBasis = 'scheduled' | 'unscheduled';

export const POWER_LIMITS_DBW = { min: -60, max: 60 } as const;
export const POWER_TOLERANCE_DB = 0.01;
export const SCAN_RATIO = 1.25;
export const RELATIVE_TOLERANCE = 1e-3;
export const DISH_LIMITS_M = { min: 0.5, max: 100 } as const;
export const SYMBOL_RATE_LIMITS_BAUD = { min: 1e3, max: 2e9 } as const;
export const DEFAULT_SIZING_LINK_STEP_S = 10;

export interface WeekSizingRequest {
  spacecraftId: string;
  targetBitsPerDay: number;
  solve: SolveFor;
  /** Dish: the station whose dish is sized (default: every station with a receive chain). */
  stationId?: string;
  basis?: VolumeBasis | 'auto';
  oneStationAtATime?: boolean;
  linkStepS?: number;
}

export interface WeekSizingResult {
  spacecraftId: string;
  solve: SolveFor;
  unit: 'dBW' | 'm' | 'baud';
  /** The smallest value found that meets the target; null when none in the limits does. */
  answer: number | null;
  /** True when the answer is the lower search limit (the target is met there already). */
  answerAtLimit: boolean;
  /** The value just below the answer that misses (bisection's lower end), or null. */
  below: number | null;
  belowBitsPerDay: number | null;
  /** The scenario's own value (radio power, dish, symbol rate). */
  current: number | null;
  targetBitsPerDay: number;
  achievedBitsPerDay: number | null;
  currentBitsPerDay: number;
  /** Power: current - answer, dB; dish: 20 log10(current / answer), dB of gain; symbol rate: 10 log10(current / answer). */
  headroomDb: number | null;
  basis: VolumeBasis;
  basisReason: string;
  stationIds: string[];
  days: number;
  linkStepS: number;
  availabilityPercent: number;
  evaluations: number;
  searchRule: string;
  /** Why the search stopped short of its limit (a candidate outside a model's valid range), or null. */
  note: string | null;
}

/** Geometry and a baseline link run, computed once for all candidates. */
export interface SizingContext {
  scenario: Scenario;
  span: Span;
  geometry: Geometry;
  baseline: Contact[];
  basePlan: PlanResult;
  linkStepS: number;
  /** Atmosphere tables by input: candidates that change power or symbol rate reuse them. */
  atmosphereTables: Map<string, AtmosphereTable>;
}

export function prepareSizingContext(scenario: Scenario, span: Span, linkStepS = DEFAULT_SIZING_LINK_STEP_S): SizingContext {
  const geometry = prepareGeometry(scenario, span);
  const found = findContacts(scenario, geometry, span);
  const setup = prepareLinks(scenario, geometry, { expectedVolume: false }); // sizing reads the volume at the availability only
  integrateContacts(found.contacts, geometry, setup, scenario.link, linkStepS);
  const basePlan = planResult(scenario, span, linkStepS, found.contacts, [...found.warnings, ...setup.warnings], { propagations: 0, linkSamples: 0 });
  return { scenario, span, geometry, baseline: found.contacts, basePlan, linkStepS, atmosphereTables: new Map() };
}

/** True when some station has more windows in progress at once than antennas (setup included). */
export function antennasConflict(plan: PlanResult, stations: readonly Station[]): string | null {
  for (const st of stations) {
    const jobs = plan.contacts.filter((c) => c.stationId === st.id).map((c) => ({ startMs: c.aosMs, endMs: c.losMs, weight: 1 }));
    const d = maxDepth(jobs, st.setupTimeS * 1000);
    if (d > st.antennaCount) return `${st.id} has ${d} windows at once for ${st.antennaCount} antenna${st.antennaCount === 1 ? '' : 's'}`;
  }
  return null;
}

/** A change to the scenario for one candidate: the spacecraft's radio and/or some stations. */
interface Candidate {
  radio?: Radio;
  stations?: Map<string, Station>;
}

/** Delivered bits of the spacecraft over the span for one candidate. */
function deliveredBits(ctx: SizingContext, spacecraftId: string, cand: Candidate, basis: VolumeBasis, oneStation: boolean): number {
  const { scenario, geometry } = ctx;
  const stations = scenario.stations.map((s) => cand.stations?.get(s.id) ?? s);
  const links = new Map<string, PreparedLink>();
  scenario.stations.forEach((orig, i) => {
    const st = stations[i]!;
    const stationChanged = st !== orig;
    for (const sc of scenario.spacecraft) {
      const isTarget = sc.id === spacecraftId;
      const radio = isTarget && cand.radio ? cand.radio : sc.radios[0];
      if (!radio || !radioHeardAt(st, radio)) continue;
      const changed = (isTarget && cand.radio !== undefined) || stationChanged;
      if (!changed) continue;
      if (!isTarget && basis === 'unscheduled') continue; // other spacecraft do not count then
      links.set(linkKey(sc.id, st.id), prepareRadioAtStation(radio, st, geometry.sites[i]!, scenario.link, lowestMaskDeg(st), ctx.atmosphereTables));
    }
  });
  const setup: LinkSetup = { links, warnings: [] };
  const contacts = ctx.baseline.map((c) => {
    if (!links.has(linkKey(c.spacecraftId, c.stationId))) return c;
    const { link: _old, ...bare } = c;
    return bare as Contact;
  });
  integrateContacts(
    contacts.filter((c, i) => c !== ctx.baseline[i]),
    geometry,
    setup,
    scenario.link,
    ctx.linkStepS,
    contacts,
  );
  // the spacecraft's volume counts its radio's data once (unique-volume.ts)
  if (basis === 'unscheduled') return uniqueVolumeOf(spacecraftId, contacts).volumeBits;
  const plan: PlanResult = { ...ctx.basePlan, contacts };
  const sched = scheduleContacts(plan, stations, scenario.spacecraft, { oneStationAtATime: oneStation });
  return uniqueVolumeOf(
    spacecraftId,
    sched.taken.map((t) => contacts[t.contactIndex]!),
  ).volumeBits;
}

function findSpacecraft(scenario: Scenario, id: string) {
  const sc = scenario.spacecraft.find((s) => s.id === id);
  if (!sc) throw new UsageError(`--spacecraft-id: "${id}" is not in ${scenario.sources.spacecraftFile} (ids: ${scenario.spacecraft.map((s) => s.id).join(', ')})`);
  const radio = sc.radios[0];
  if (!radio) throw new ScenarioError([{ file: scenario.sources.spacecraftFile, path: `spacecraft ${sc.id}.radios`, message: 'has no radio; sizing needs one' }]);
  return { sc, radio };
}

/** Radio with a symbol rate: adaptive sets symbolRateBaud, fixed sets informationRateBps = Rs x efficiency. */
function withSymbolRate(radio: Radio, rsBaud: number): Radio {
  const c = radio.coding;
  if (c.kind === 'adaptive') return { ...radio, coding: { ...c, symbolRateBaud: rsBaud } };
  return { ...radio, coding: { ...c, informationRateBps: rsBaud * c.spectralEfficiencyBitsPerSymbol } };
}

function symbolRateOf(radio: Radio): number {
  const c = radio.coding;
  return c.kind === 'adaptive' ? c.symbolRateBaud : c.informationRateBps / c.spectralEfficiencyBitsPerSymbol;
}

function withDish(st: Station, diameterM: number): Station {
  const rx = st.receiver;
  if (!rx) throw new UsageError(`--solve dish: station ${st.id} has no antenna and receiver in the network file`);
  if (rx.kind !== 'chain') throw new UsageError(`--solve dish: station ${st.id} states a G/T; sizing its dish needs a receive chain (noise temperature or figure)`);
  const { gainDbi: _g, ...rest } = rx;
  const dish = (r: Receiver): Receiver => {
    if (r.kind !== 'chain') return r;
    const { gainDbi: _h, ...other } = r;
    return { ...other, dishDiameterM: diameterM };
  };
  return {
    ...st,
    receiver: { ...rest, dishDiameterM: diameterM },
    ...(st.feeds ? { feeds: st.feeds.map((f) => ({ ...f, receiver: dish(f.receiver) })) } : {}),
  };
}

/** Week mode (see the head comment). */
export function sizeForWeek(ctx: SizingContext, req: WeekSizingRequest): WeekSizingResult {
  const { scenario, span } = ctx;
  const { sc, radio } = findSpacecraft(scenario, req.spacecraftId);
  if (!(req.targetBitsPerDay > 0)) throw new UsageError('--target-gbit-per-day must be > 0');
  const days = (span.endMs - span.startMs) / 86_400_000;
  const conflict = antennasConflict(ctx.basePlan, scenario.stations);
  const basis: VolumeBasis = req.basis === 'scheduled' || req.basis === 'unscheduled' ? req.basis : conflict ? 'scheduled' : 'unscheduled';
  const basisReason =
    req.basis === 'scheduled' || req.basis === 'unscheduled'
      ? `asked for (${req.basis})`
      : conflict
        ? `antennas conflict (${conflict}): volumes after the antenna schedule`
        : 'no antenna conflict: every window counts';
  const oneStation = Boolean(req.oneStationAtATime);
  let evaluations = 0;
  const perDay = (cand: Candidate) => {
    evaluations++;
    return deliveredBits(ctx, sc.id, cand, basis, oneStation) / days;
  };

  let stationIds: string[] = [];
  let unit: WeekSizingResult['unit'];
  let current: number | null;
  let make: (v: number) => Candidate;
  let searchRule: string;
  let headroom: (cur: number, ans: number) => number;
  if (req.solve === 'power') {
    unit = 'dBW';
    current = radio.txPowerDbw;
    make = (p) => ({ radio: { ...radio, txPowerDbw: p } });
    headroom = (cur, ans) => cur - ans;
    searchRule = `bracket in 10 dB steps within ${POWER_LIMITS_DBW.min}..${POWER_LIMITS_DBW.max} dBW, bisection to ${POWER_TOLERANCE_DB} dB`;
  } else if (req.solve === 'dish') {
    unit = 'm';
    const targets = req.stationId === undefined ? scenario.stations.filter((s) => s.receiver?.kind === 'chain') : scenario.stations.filter((s) => s.id === req.stationId);
    if (targets.length === 0) {
      throw new UsageError(
        req.stationId === undefined
          ? '--solve dish: no station has a receive chain'
          : `--station-id: "${req.stationId}" is not in ${scenario.sources.networkFile} (ids: ${scenario.stations.map((s) => s.id).join(', ')})`,
      );
    }
    stationIds = targets.map((s) => s.id);
    for (const t of targets) withDish(t, 1); // throws for a G/T station
    const dishes = targets.map((t) => t.receiver?.dishDiameterM).filter((d): d is number => d !== undefined);
    current = dishes.length === targets.length && dishes.every((d) => d === dishes[0]) ? dishes[0]! : null;
    make = (d) => ({ stations: new Map(targets.map((t) => [t.id, withDish(t, d)])) });
    headroom = (cur, ans) => 20 * Math.log10(cur / ans);
    searchRule = `scan x${SCAN_RATIO} from ${DISH_LIMITS_M.min} m to ${DISH_LIMITS_M.max} m for the first diameter that meets the target, bisection to ${RELATIVE_TOLERANCE * 100} %`;
  } else {
    unit = 'baud';
    current = symbolRateOf(radio);
    make = (rs) => ({ radio: withSymbolRate(radio, rs) });
    headroom = (cur, ans) => 10 * Math.log10(cur / ans);
    searchRule = `scan x${SCAN_RATIO} upward from the lowest symbol rate that could carry the target in the contact time, bisection to ${RELATIVE_TOLERANCE * 100} %`;
  }

  const currentBitsPerDay = perDay({});
  // A candidate outside a model's valid range (e.g. a dish whose beam is narrower than the
  // pointing error) does not meet the target; the scan stops there and says why.
  let note: string | null = null;
  let outOfRange = false;
  const meets = (v: number): [boolean, number] => {
    try {
      const bpd = perDay(make(v));
      return [bpd >= req.targetBitsPerDay, bpd];
    } catch (err) {
      if (!(err instanceof ModelRangeError)) throw err;
      note = `stopped at ${v.toPrecision(6)} ${unit}: ${err.message}`;
      outOfRange = true;
      return [false, Number.NaN];
    }
  };

  let lo: number | null = null;
  let loBpd: number | null = null;
  let hi: number | null = null;
  let hiBpd: number | null = null;
  let atLimit = false;
  if (req.solve === 'power') {
    const p0 = Math.min(Math.max(radio.txPowerDbw, POWER_LIMITS_DBW.min), POWER_LIMITS_DBW.max);
    const [ok0, b0] = meets(p0);
    if (ok0) {
      hi = p0;
      hiBpd = b0;
      for (let p = p0 - 10; ; p -= 10) {
        const q = Math.max(p, POWER_LIMITS_DBW.min);
        const [ok, b] = meets(q);
        if (!ok) {
          lo = q;
          loBpd = b;
          break;
        }
        hi = q;
        hiBpd = b;
        if (q === POWER_LIMITS_DBW.min) {
          atLimit = true;
          break;
        }
      }
    } else {
      lo = p0;
      loBpd = b0;
      for (let p = p0 + 10; lo < POWER_LIMITS_DBW.max; p += 10) {
        const q = Math.min(p, POWER_LIMITS_DBW.max);
        const [ok, b] = meets(q);
        if (ok) {
          hi = q;
          hiBpd = b;
          break;
        }
        lo = q;
        loBpd = b;
      }
    }
    for (let it = 0; hi !== null && lo !== null && !atLimit && hi - lo > POWER_TOLERANCE_DB; it++) {
      if (it >= MAX_BISECTIONS) throw new SolverLimitError('size: power bisection', MAX_BISECTIONS, lo, hi);
      const mid = 0.5 * (lo + hi);
      const [ok, b] = meets(mid);
      if (ok) [hi, hiBpd] = [mid, b];
      else [lo, loBpd] = [mid, b];
    }
  } else {
    let start: number;
    let limit: number;
    if (req.solve === 'dish') {
      start = DISH_LIMITS_M.min;
      limit = DISH_LIMITS_M.max;
    } else {
      const c = radio.coding;
      const maxEff = c.kind === 'adaptive' ? Math.max(...c.table.map((e) => e.spectralEfficiencyBitsPerSymbol)) : c.spectralEfficiencyBitsPerSymbol;
      const contactS = ctx.baseline.filter((x) => x.spacecraftId === sc.id).reduce((s, x) => s + x.durationS, 0);
      const lowest = contactS > 0 ? (req.targetBitsPerDay * days) / (maxEff * contactS) : SYMBOL_RATE_LIMITS_BAUD.max;
      start = Math.max(SYMBOL_RATE_LIMITS_BAUD.min, lowest);
      limit = SYMBOL_RATE_LIMITS_BAUD.max;
    }
    for (let v = start, it = 0; ; v *= SCAN_RATIO, it++) {
      if (it >= MAX_BISECTIONS) throw new SolverLimitError(`size: ${req.solve} bracket scan`, MAX_BISECTIONS, start, limit);
      const q = Math.min(v, limit);
      const [ok, b] = meets(q);
      if (ok) {
        hi = q;
        hiBpd = b;
        if (lo === null) atLimit = true;
        break;
      }
      if (outOfRange) break;
      lo = q;
      loBpd = b;
      if (q >= limit) break;
    }
    for (let it = 0; hi !== null && lo !== null && !atLimit && hi / lo - 1 > RELATIVE_TOLERANCE; it++) {
      if (it >= MAX_BISECTIONS) throw new SolverLimitError(`size: ${req.solve} bisection`, MAX_BISECTIONS, lo, hi);
      const mid = Math.sqrt(lo * hi);
      const [ok, b] = meets(mid);
      if (ok) [hi, hiBpd] = [mid, b];
      else [lo, loBpd] = [mid, b];
    }
  }
  if (hi === null) atLimit = false;
  return {
    spacecraftId: sc.id,
    solve: req.solve,
    unit,
    answer: hi,
    answerAtLimit: atLimit,
    below: hi === null || atLimit ? null : lo,
    belowBitsPerDay: hi === null || atLimit ? null : loBpd,
    current,
    targetBitsPerDay: req.targetBitsPerDay,
    achievedBitsPerDay: hiBpd,
    currentBitsPerDay,
    headroomDb: hi !== null && current !== null ? headroom(current, hi) : null,
    basis,
    basisReason,
    stationIds,
    days,
    linkStepS: ctx.linkStepS,
    availabilityPercent: scenario.link.availabilityPercent,
    evaluations,
    searchRule,
    note,
  };
}

// ---------------------------------------------------------------- one geometry

export interface PointSizingRequest extends LinkOverrides {
  spacecraftId: string;
  stationId: string;
  elevationDeg?: number;
  rangeKm?: number;
  targetRateBps: number;
}

export interface PointSizingResult {
  spacecraftId: string;
  stationId: string;
  radioId: string;
  look: Look;
  targetRateBps: number;
  currentPowerDbw: number;
  /** The power that just carries the target rate; null when the coding cannot reach it at any power. */
  requiredPowerDbw: number | null;
  /** current - required, dB (positive: the radio has power to spare). */
  headroomDb: number | null;
  /** Code or MODCOD the answer is for, and its rate. */
  codingName: string | null;
  rateBps: number | null;
  /** The budget's margin at the current power (what `passbudget budget` prints). */
  marginAtCurrentDb: number;
  /** evaluateLink's margin at the answer (0 by construction). */
  marginAtAnswerDb: number | null;
  why: string | null;
}

/** The prepared budget and look of a one-geometry request (shared with the tests). */
export function pointLink(scenario: Scenario, req: Omit<PointSizingRequest, 'targetRateBps'>): { link: PreparedLink; look: Look; radio: Radio } {
  const { link, look, radio } = preparePoint(scenario, req, 'size');
  return { link: withOverrides(link, req), radio, look };
}

/** One-geometry mode (see the head comment). */
export function sizePowerAtGeometry(scenario: Scenario, req: PointSizingRequest): PointSizingResult {
  if (!(req.targetRateBps > 0)) throw new UsageError('--target-rate-bps must be > 0');
  const { link, look, radio } = pointLink(scenario, req);
  if (look.elevationDeg < link.minDataElevationDeg) {
    throw new ModelRangeError('size', 'elevationDeg', look.elevationDeg, `>= the minimum data elevation ${link.minDataElevationDeg} deg (no data flows below it)`);
  }
  const s = newLinkSample();
  evaluateLink(link, look, s);
  const base: PointSizingResult = {
    spacecraftId: req.spacecraftId,
    stationId: req.stationId,
    radioId: radio.id,
    look,
    targetRateBps: req.targetRateBps,
    currentPowerDbw: link.txPowerDbw,
    requiredPowerDbw: null,
    headroomDb: null,
    codingName: null,
    rateBps: null,
    marginAtCurrentDb: s.marginDb,
    marginAtAnswerDb: null,
    why: null,
  };
  let marginNowDb: number;
  if (link.codingKind === 'fixed') {
    if (link.informationRateBps < req.targetRateBps) {
      return { ...base, why: `the fixed code ${link.codingName} carries ${link.informationRateBps} bit/s, below the target at any power` };
    }
    marginNowDb = s.marginDb;
    base.codingName = link.codingName;
    base.rateBps = link.informationRateBps;
  } else {
    let best = -1;
    link.modcodTable.forEach((e, i) => {
      if (e.spectralEfficiencyBitsPerSymbol * link.symbolRateBaud < req.targetRateBps) return;
      const b = link.modcodTable[best];
      if (!b || e.esN0ThresholdDb < b.esN0ThresholdDb || (e.esN0ThresholdDb === b.esN0ThresholdDb && e.spectralEfficiencyBitsPerSymbol > b.spectralEfficiencyBitsPerSymbol)) best = i;
    });
    const e = link.modcodTable[best];
    if (!e) {
      const maxEff = Math.max(...link.modcodTable.map((m) => m.spectralEfficiencyBitsPerSymbol));
      return { ...base, why: `at ${link.symbolRateBaud} baud the best entry of ${link.codingName} carries ${maxEff * link.symbolRateBaud} bit/s, below the target at any power` };
    }
    marginNowDb = s.esN0Db - link.implementationLossDb - e.esN0ThresholdDb - link.requiredMarginDb;
    base.codingName = e.name;
    base.rateBps = e.spectralEfficiencyBitsPerSymbol * link.symbolRateBaud;
  }
  // + 1e-9 dB so that rounding cannot leave the entry a hair short of closing at the answer
  const requiredPowerDbw = link.txPowerDbw - marginNowDb + 1e-9;
  const check = newLinkSample();
  evaluateLink({ ...link, txPowerDbw: requiredPowerDbw }, look, check);
  return { ...base, requiredPowerDbw, headroomDb: link.txPowerDbw - requiredPowerDbw, marginAtAnswerDb: check.marginDb };
}
