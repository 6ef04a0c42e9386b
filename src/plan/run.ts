/**
 * The plan pipeline: geometry -> contacts -> link volumes. A pure function of
 * the scenario and the span (no I/O); the CLI renders and writes the result.
 */
import { DEFAULT_SEARCH, type SearchOptions } from '../geometry/types.js';
import type { Scenario, Span } from '../scenario/types.js';
import { prepareGeometry, findContacts } from './contacts.js';
import { prepareLinks, integrateContacts, DEFAULT_LINK_STEP_S } from './link.js';
import type { PlanResult } from './types.js';

export interface PlanOptions {
  linkStepS?: number;
  /** Skip the link engine (geometry only). */
  geometryOnly?: boolean;
  search?: SearchOptions;
}

export function runPlan(scenario: Scenario, span: Span, opts: PlanOptions = {}): PlanResult {
  const geometry = prepareGeometry(scenario, span);
  const found = findContacts(scenario, geometry, span, opts.search ?? DEFAULT_SEARCH);
  const warnings = [...found.warnings];
  let linkSamples = 0;
  let propagations = found.propagations;
  const linkStepS = opts.linkStepS ?? DEFAULT_LINK_STEP_S;
  if (!opts.geometryOnly) {
    const setup = prepareLinks(scenario, geometry);
    warnings.push(...setup.warnings);
    const stats = integrateContacts(found.contacts, geometry, setup, scenario.link, linkStepS);
    linkSamples = stats.linkSamples;
    propagations += stats.propagations;
  }
  return {
    span,
    linkStepS,
    availabilityPercent: scenario.link.availabilityPercent,
    spacecraft: scenario.spacecraft.map((s) => ({ id: s.id, name: s.name, priority: s.priority })),
    stations: scenario.stations.map((s) => ({ id: s.id, name: s.name, timeZone: s.timeZone })),
    contacts: found.contacts,
    warnings,
    stats: { propagations, linkSamples },
  };
}
