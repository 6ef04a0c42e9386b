/**
 * Contact windows for a scenario: one target per spacecraft, one site per
 * station, every window of every pair inside the span. Element-set age and
 * ended tracks (decay, SGP4 errors) become warnings, said once each.
 */
import { makeSite } from '../geometry/earth.js';
import { prepareMask, type PreparedMask } from '../geometry/mask.js';
import { findPasses } from '../geometry/passes.js';
import { makeSgp4Target, elementAgeWarning } from '../geometry/targets/sgp4.js';
import { makeMoonTarget } from '../geometry/targets/moon.js';
import { makeFixedSkyTarget } from '../geometry/targets/fixedSky.js';
import { DEFAULT_SEARCH, type SearchOptions, type Site, type Target } from '../geometry/types.js';
import type { Scenario, Spacecraft, Span } from '../scenario/types.js';
import { isoUtc } from '../time/format.js';
import type { Contact, WarningOrigin } from './types.js';

export function makeTarget(sc: Spacecraft, span: Span): Target {
  const o = sc.orbit;
  switch (o.kind) {
    case 'elements':
      return makeSgp4Target(sc.id, o.sets);
    case 'moon':
      return makeMoonTarget(sc.id, span);
    case 'fixedSky':
      return makeFixedSkyTarget(sc.id, o.rightAscensionDeg, o.declinationDeg, o.rangeKm, span);
  }
}

export interface Geometry {
  sites: Site[];
  masks: PreparedMask[];
  /** Targets by spacecraft id, in scenario order. */
  targets: Map<string, Target>;
  span: Span;
}

export function prepareGeometry(scenario: Scenario, span: Span): Geometry {
  const sites = scenario.stations.map((s) => makeSite(s.id, s.latitudeDeg, s.longitudeDeg, s.heightKm));
  const masks = scenario.stations.map((s) => prepareMask(s.mask));
  const targets = new Map<string, Target>();
  for (const sc of scenario.spacecraft) targets.set(sc.id, makeTarget(sc, span));
  return { sites, masks, targets, span };
}

export interface ContactSearch {
  contacts: Contact[];
  warnings: string[];
  /** warningOrigins[i]: the spacecraft warnings[i] is about. */
  warningOrigins: WarningOrigin[];
  propagations: number;
}

/** Every window of every spacecraft over every station, ordered by station then AOS. */
export function findContacts(scenario: Scenario, geometry: Geometry, span: Span, search: SearchOptions = DEFAULT_SEARCH): ContactSearch {
  const warnings: string[] = [];
  const warningOrigins: WarningOrigin[] = [];
  const contacts: Contact[] = [];
  let propagations = 0;
  for (const sc of scenario.spacecraft) {
    const target = geometry.targets.get(sc.id);
    if (!target) continue;
    if (sc.orbit.kind === 'elements') {
      const age = elementAgeWarning(sc.orbit.sets, span);
      if (age) {
        warnings.push(`${sc.id}: ${age}`);
        warningOrigins.push({ spacecraftId: sc.id });
      }
    }
    const before = target.evaluations;
    for (const p of findPasses(target, geometry.sites, geometry.masks, span, search)) {
      contacts.push({ ...p, durationS: (p.losMs - p.aosMs) / 1000 });
    }
    propagations += target.evaluations - before;
    if (target.failedAtMs !== undefined) {
      warnings.push(`${sc.id}: track ends at ${isoUtc(target.failedAtMs, 0)}: ${target.failureReason ?? 'SGP4 error'}; no contacts after it`);
      warningOrigins.push({ spacecraftId: sc.id });
    }
  }
  // order: station (file order), AOS, spacecraft (file order); keys computed once
  const order = new Map(scenario.stations.map((s, i) => [s.id, i]));
  const scOrder = new Map(scenario.spacecraft.map((s, i) => [s.id, i]));
  const keyed = contacts.map((c) => ({ c, st: order.get(c.stationId) ?? 0, sc: scOrder.get(c.spacecraftId) ?? 0 }));
  keyed.sort((a, b) => a.st - b.st || a.c.aosMs - b.c.aosMs || a.sc - b.sc);
  for (let i = 0; i < keyed.length; i++) contacts[i] = keyed[i]!.c;
  return { contacts, warnings, warningOrigins, propagations };
}
