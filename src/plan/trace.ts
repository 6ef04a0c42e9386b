/**
 * Time series of geometry and link budget for spacecraft-station pairs, as a
 * generator of rows (pure: no I/O; the writer in src/report/trace.ts streams them).
 *
 * Grid: tMs = span.startMs + k * stepS, k = 0, 1, ... while tMs < span.endMs
 * (the same grid as the plan's link sampling), so a full trace has
 * steps x pairs rows, steps = ceil((endMs - startMs) / stepMs).
 * Order: spacecraft (file order), then time, then station (file order). Each
 * spacecraft is propagated once per time step and that state serves every station.
 * in_contact: the time lies inside a contact window of the pair found by the plan's
 * contact search (findContacts, same search options), AOS and LOS included.
 * Link columns: the budget of the spacecraft's data radio (radios[0]) is evaluated
 * at every row whose geometric elevation is >= 0 deg (the horizon), whether or not
 * it is in contact; below the horizon, or without a radio, they are absent.
 * The link is prepared with its atmosphere table from 0 deg (prepareRadioAtStation),
 * so low-elevation rows below the mask carry the modelled atmosphere of their own
 * elevation; inside contacts the numbers agree with the plan's to the atmosphere
 * table's interpolation accuracy (0.01 dB target).
 * Rate: the rate the link supports at that look (0 below minDataElevationDeg or when
 * the link does not close); data flows only in contact, after the acquisition time.
 * A step at which the target has no state (SGP4 failure) gives rows with ok = false.
 *
 * The generator yields ONE reused row object (no allocation per row): read or copy
 * it before asking for the next one.
 */
import { lookFrom, newLook } from '../geometry/topocentric.js';
import { DEFAULT_SEARCH, type Look, type SearchOptions, type Site } from '../geometry/types.js';
import { dopplerShiftHz } from '../link/doppler.js';
import { evaluateLink } from '../link/budget.js';
import { newLinkSample, type LinkSample, type PreparedLink } from '../link/types.js';
import type { Scenario, Span } from '../scenario/types.js';
import { findContacts, prepareGeometry, type Geometry } from './contacts.js';
import { bodyTempK, prepareRadioAtStation, radioHeardAt } from './link.js';
import { newBodyAngles } from '../geometry/sky-bodies.js';
import { LunarSiteTarget } from '../geometry/targets/lunar.js';
import type { Contact } from './types.js';

export const DEFAULT_TRACE_STEP_S = 10;
/** Lowest elevation at which the trace evaluates the link, deg (the geometric horizon). */
export const TRACE_LINK_MIN_ELEVATION_DEG = 0;
/** Steps between two progress reports inside one spacecraft. */
export const TRACE_PROGRESS_EVERY_STEPS = 20_000;

export interface TraceOptions {
  /** Only this spacecraft (default: all). */
  spacecraftId?: string;
  /** Only this station (default: all). */
  stationId?: string;
  stepS?: number;
  /** Keep only rows inside contact windows. */
  inContactOnly?: boolean;
  search?: SearchOptions;
  /** Called when a spacecraft starts and every TRACE_PROGRESS_EVERY_STEPS steps. */
  onProgress?: (p: TraceProgress) => void;
}

export interface TraceProgress {
  /** 1-based index of the spacecraft being traced, and how many there are. */
  spacecraftIndex: number;
  spacecraftCount: number;
  spacecraftId: string;
  /** Share of this spacecraft's steps done, 0..1. */
  fraction: number;
}

export interface TraceRow {
  tMs: number;
  spacecraftId: string;
  stationId: string;
  /** False when the target had no state at tMs (track ended): every other field is stale. */
  ok: boolean;
  look: Look;
  inContact: boolean;
  /** True when the spacecraft has a data radio (Doppler is meaningful). */
  hasRadio: boolean;
  dopplerHz: number;
  /** True when `link` and `modcod` were evaluated at this row (elevation >= 0, radio present). */
  hasLink: boolean;
  link: LinkSample;
  /** MODCOD (adaptive) or code name (fixed) carrying data, '' when the rate is 0. */
  modcod: string;
  /** The Sun's centre from boresight at the station, and the Sun-Earth-probe angle, deg. */
  sunOffsetDeg: number;
  sunEarthProbeDeg: number;
  /** True for a lunar surface site: where the station lies in the site's sky, deg. */
  lunarSite: boolean;
  lunarEarthElevationDeg: number;
  lunarEarthAzimuthDeg: number;
}

interface PairPlan {
  stationId: string;
  site: Site;
  link: PreparedLink | undefined;
  /** This pair's contacts, by AOS. */
  contacts: Contact[];
}

interface SpacecraftPlan {
  spacecraftId: string;
  frequencyHz: number;
  pairs: PairPlan[];
  /** Union of this spacecraft's contact windows over the selected stations, by start. */
  merged: { aosMs: number; losMs: number }[];
}

export interface PreparedTrace {
  span: Span;
  stepS: number;
  stepMs: number;
  /** Grid times per pair. */
  steps: number;
  /** Selected spacecraft x selected stations. */
  pairs: number;
  inContactOnly: boolean;
  spacecraftIds: string[];
  stationIds: string[];
  warnings: string[];
  geometry: Geometry;
  plans: SpacecraftPlan[];
  onProgress: ((p: TraceProgress) => void) | undefined;
}

/** Selection problems a caller can show the user (unknown id); empty when fine. */
export function traceSelectionProblems(scenario: Scenario, opts: TraceOptions): string[] {
  const problems: string[] = [];
  if (opts.spacecraftId !== undefined && !scenario.spacecraft.some((s) => s.id === opts.spacecraftId)) {
    problems.push(`spacecraft "${opts.spacecraftId}" is not in the scenario (have: ${scenario.spacecraft.map((s) => s.id).join(', ')})`);
  }
  if (opts.stationId !== undefined && !scenario.stations.some((s) => s.id === opts.stationId)) {
    problems.push(`station "${opts.stationId}" is not in the scenario (have: ${scenario.stations.map((s) => s.id).join(', ')})`);
  }
  return problems;
}

/** Grid times in [startMs, endMs) at stepMs. */
export function traceSteps(span: Span, stepMs: number): number {
  return Math.max(0, Math.ceil((span.endMs - span.startMs) / stepMs));
}

/** Selects pairs, finds their contacts and prepares their links. Throws if an id is unknown. */
export function prepareTrace(scenario: Scenario, span: Span, opts: TraceOptions = {}): PreparedTrace {
  const problems = traceSelectionProblems(scenario, opts);
  if (problems.length > 0) throw new Error(`prepareTrace: ${problems.join('; ')}`);
  const stepS = opts.stepS ?? DEFAULT_TRACE_STEP_S;
  if (!(stepS > 0)) throw new Error(`prepareTrace: stepS ${stepS} must be > 0`);
  const selected: Scenario = {
    ...scenario,
    spacecraft: scenario.spacecraft.filter((s) => opts.spacecraftId === undefined || s.id === opts.spacecraftId),
    stations: scenario.stations.filter((s) => opts.stationId === undefined || s.id === opts.stationId),
  };
  const geometry = prepareGeometry(selected, span);
  const found = findContacts(selected, geometry, span, opts.search ?? DEFAULT_SEARCH);
  const plans: SpacecraftPlan[] = selected.spacecraft.map((sc) => {
    const radio = sc.radios[0];
    const pairs: PairPlan[] = selected.stations.map((st, i) => {
      const site = geometry.sites[i]!;
      return {
        stationId: st.id,
        site,
        // no link where no feed of the station covers the radio's frequency
        link: radio && radioHeardAt(st, radio) ? prepareRadioAtStation(radio, st, site, selected.link, TRACE_LINK_MIN_ELEVATION_DEG) : undefined,
        contacts: found.contacts
          .filter((c) => c.spacecraftId === sc.id && c.stationId === st.id)
          .sort((a, b) => a.aosMs - b.aosMs),
      };
    });
    return { spacecraftId: sc.id, frequencyHz: radio?.frequencyHz ?? Number.NaN, pairs, merged: mergeWindows(pairs.flatMap((p) => p.contacts)) };
  });
  const stepMs = stepS * 1000;
  return {
    span,
    stepS,
    stepMs,
    steps: traceSteps(span, stepMs),
    pairs: selected.spacecraft.length * selected.stations.length,
    inContactOnly: opts.inContactOnly ?? false,
    spacecraftIds: selected.spacecraft.map((s) => s.id),
    stationIds: selected.stations.map((s) => s.id),
    warnings: found.warnings,
    geometry,
    plans,
    onProgress: opts.onProgress,
  };
}

function mergeWindows(contacts: Contact[]): { aosMs: number; losMs: number }[] {
  const sorted = contacts.map((c) => ({ aosMs: c.aosMs, losMs: c.losMs })).sort((a, b) => a.aosMs - b.aosMs);
  const out: { aosMs: number; losMs: number }[] = [];
  for (const w of sorted) {
    const last = out[out.length - 1];
    if (last !== undefined && w.aosMs <= last.losMs) last.losMs = Math.max(last.losMs, w.losMs);
    else out.push(w);
  }
  return out;
}

function modcodOf(link: PreparedLink, s: LinkSample): string {
  if (s.rateBps <= 0) return '';
  if (link.codingKind === 'fixed') return link.codingName;
  return link.modcodTable[s.modcodIndex]?.name ?? '';
}

/** The rows of a prepared trace, one reused object (see the head comment). */
export function* traceRows(t: PreparedTrace): Generator<TraceRow, void, undefined> {
  const state = new Float64Array(6);
  const row: TraceRow = {
    tMs: 0,
    spacecraftId: '',
    stationId: '',
    ok: false,
    look: newLook(),
    inContact: false,
    hasRadio: false,
    dopplerHz: 0,
    hasLink: false,
    link: newLinkSample(),
    modcod: '',
    sunOffsetDeg: 0,
    sunEarthProbeDeg: 0,
    lunarSite: false,
    lunarEarthElevationDeg: 0,
    lunarEarthAzimuthDeg: 0,
  };
  const sky = t.geometry.sky;
  const angles = newBodyAngles();
  const { startMs } = t.span;
  const { stepMs, steps } = t;
  const count = t.plans.length;
  for (let si = 0; si < count; si++) {
    const plan = t.plans[si]!;
    const target = t.geometry.targets.get(plan.spacecraftId);
    if (!target) continue;
    const report = (fraction: number) =>
      t.onProgress?.({ spacecraftIndex: si + 1, spacecraftCount: count, spacecraftId: plan.spacecraftId, fraction });
    report(0);
    const cursors = new Int32Array(plan.pairs.length);
    let mergedCursor = 0;
    row.spacecraftId = plan.spacecraftId;
    const lunar = target instanceof LunarSiteTarget ? target : undefined;
    row.lunarSite = lunar !== undefined;
    row.hasRadio = Number.isFinite(plan.frequencyHz);
    let nextReport = TRACE_PROGRESS_EVERY_STEPS;
    for (let k = 0; k < steps; k++) {
      if (k >= nextReport) {
        report(k / steps);
        nextReport = k + TRACE_PROGRESS_EVERY_STEPS;
      }
      const tMs = startMs + k * stepMs;
      if (t.inContactOnly) {
        // skip straight to the next contact of any selected station
        const merged = plan.merged;
        while (mergedCursor < merged.length && merged[mergedCursor]!.losMs < tMs) mergedCursor++;
        if (mergedCursor >= merged.length) break;
        const next = merged[mergedCursor]!.aosMs;
        if (next > tMs) {
          k = Math.max(k, Math.ceil((next - startMs) / stepMs) - 1);
          continue;
        }
      }
      row.tMs = tMs;
      row.ok = target.stateEcefAt(tMs, state);
      if (row.ok) {
        sky.at(tMs);
        row.sunEarthProbeDeg = sky.sunEarthProbeDeg(state);
      }
      for (let pi = 0; pi < plan.pairs.length; pi++) {
        const pair = plan.pairs[pi]!;
        const contacts = pair.contacts;
        let c = cursors[pi]!;
        while (c < contacts.length && contacts[c]!.losMs < tMs) c++;
        cursors[pi] = c;
        const inContact = c < contacts.length && contacts[c]!.aosMs <= tMs;
        if (t.inContactOnly && !inContact) continue;
        row.stationId = pair.stationId;
        row.inContact = inContact;
        row.hasLink = false;
        row.modcod = '';
        if (row.ok) {
          lookFrom(pair.site, state, row.look);
          row.dopplerHz = row.hasRadio ? dopplerShiftHz(plan.frequencyHz, row.look.rangeRateKmS) : 0;
          row.sunOffsetDeg = sky.angles(pair.site, state, angles).sunOffsetDeg;
          if (lunar !== undefined) {
            const sk = lunar.skyOf(pair.site.ecefKm);
            row.lunarEarthElevationDeg = sk.elevationDeg;
            row.lunarEarthAzimuthDeg = sk.azimuthDeg;
          }
          if (pair.link !== undefined && row.look.elevationDeg >= TRACE_LINK_MIN_ELEVATION_DEG) {
            evaluateLink(pair.link, row.look, row.link, true, bodyTempK(pair.link, sky, pair.site, state, angles));
            row.hasLink = true;
            row.modcod = modcodOf(pair.link, row.link);
          }
        }
        yield row;
      }
    }
    report(1);
  }
}
