/**
 * The plan pipeline: geometry -> contacts -> link volumes. A pure function of
 * the scenario and the span (no I/O); the CLI renders and writes the result.
 */
import { DEFAULT_SEARCH, type SearchOptions } from '../geometry/types.js';
import type { Scenario, Span } from '../scenario/types.js';
import { prepareGeometry, findContacts, type Geometry } from './contacts.js';
import { prepareLinks, type LinkTableCache, integrateContacts, integrateOtherRadios, DEFAULT_LINK_STEP_S } from './link.js';
import type { PlanResult, SunOutage } from './types.js';
import { findSunOutages } from './sun-outages.js';

export interface PlanOptions {
  linkStepS?: number;
  /** Compute each contact's expected volume over an average year (default true; the benchmark turns it off). */
  expectedVolume?: boolean;
  /** Skip the link engine (geometry only). */
  geometryOnly?: boolean;
  search?: SearchOptions;
  /** Progress of the run: (done, total, what). Called between stages, never per sample. */
  onProgress?: (done: number, total: number, label: string) => void;
}

/** `cache`: link tables kept across calls (a worker's batches of one run share them). */
export function runPlan(scenario: Scenario, span: Span, opts: PlanOptions = {}, cache?: LinkTableCache): PlanResult {
  return runPlanWithGeometry(scenario, span, opts, cache).result;
}

/** runPlan, with the geometry it prepared (a worker reuses it for the spacecraft's own figures: plan/worker-parts.ts). */
export function runPlanWithGeometry(scenario: Scenario, span: Span, opts: PlanOptions = {}, cache?: LinkTableCache): { result: PlanResult; geometry: Geometry } {
  const geometry = prepareGeometry(scenario, span);
  const total = opts.geometryOnly ? 1 : 2;
  opts.onProgress?.(0, total, 'contact search');
  const found = findContacts(scenario, geometry, span, opts.search ?? DEFAULT_SEARCH);
  opts.onProgress?.(1, total, opts.geometryOnly ? 'done' : 'link budgets');
  const warnings = [...found.warnings];
  const origins = [...found.warningOrigins];
  let linkSamples = 0;
  let propagations = found.propagations;
  let sunOutages: SunOutage[] | undefined;
  const linkStepS = opts.linkStepS ?? DEFAULT_LINK_STEP_S;
  if (!opts.geometryOnly) {
    const setup = prepareLinks(scenario, geometry, { ...(opts.expectedVolume === false ? { expectedVolume: false } : {}), ...(cache ? { cache } : {}) });
    for (const w of setup.warnings) warnings.push(w);
    for (const o of setup.warningOrigins ?? []) origins.push(o);
    // without a radio in the fleet there is nothing to integrate (nor a Sun and Moon table to build for it)
    const anyRadio = scenario.spacecraft.some((s) => s.radios.length > 0);
    const none = { linkSamples: 0, propagations: 0 };
    const stats = anyRadio ? integrateContacts(found.contacts, geometry, setup, scenario.link, linkStepS) : none;
    const other = anyRadio ? integrateOtherRadios(found.contacts, geometry, setup, scenario.link, linkStepS) : none;
    linkSamples = stats.linkSamples + other.linkSamples;
    propagations += stats.propagations + other.propagations;
    sunOutages = sortOutages(scenario, findSunOutages(found.contacts, geometry, setup));
    opts.onProgress?.(2, total, 'done');
  }
  const result = planResult(scenario, span, linkStepS, found.contacts, warnings, { propagations, linkSamples }, origins);
  if (sunOutages) result.sunOutages = sunOutages;
  return { result, geometry };
}

/** A PlanResult from its parts (shared with sizing, which re-runs only the link stage). */
export function planResult(
  scenario: Scenario,
  span: Span,
  linkStepS: number,
  contacts: PlanResult['contacts'],
  warnings: string[],
  stats: PlanResult['stats'],
  warningOrigins?: PlanResult['warningOrigins'],
): PlanResult {
  return {
    span,
    linkStepS,
    availabilityPercent: scenario.link.availabilityPercent,
    spacecraft: scenario.spacecraft.map((s) => ({ id: s.id, name: s.name, priority: s.priority })),
    stations: scenario.stations.map((s) => ({ id: s.id, name: s.name, timeZone: s.timeZone })),
    contacts,
    warnings,
    ...(warningOrigins && warningOrigins.length === warnings.length ? { warningOrigins } : {}),
    stats,
  };
}

/** Sun outages in plan order: station (file order), start, spacecraft (file order). */
export function sortOutages(scenario: Scenario, list: SunOutage[]): SunOutage[] {
  const st = new Map(scenario.stations.map((s, i) => [s.id, i]));
  const sc = new Map(scenario.spacecraft.map((s, i) => [s.id, i]));
  return list.sort((a, b) => (st.get(a.stationId) ?? 0) - (st.get(b.stationId) ?? 0) || a.startMs - b.startMs || (sc.get(a.spacecraftId) ?? 0) - (sc.get(b.spacecraftId) ?? 0));
}
