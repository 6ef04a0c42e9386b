/**
 * findContacts (src/plan/contacts.ts) builds each contact as one object literal (contactOf)
 * so that all contacts share a hidden class; the previous implementation, the reference
 * here, was { ...pass, durationS, ...transmit times }. Every contact must have that object's
 * keys in that order and its values bit for bit (Object.is), for invented orbits and sites
 * (test/fixtures/orbits.ts) over two days.
 */
import { describe, expect, it } from 'vitest';
import { makeSite } from '../../src/geometry/earth.js';
import { prepareMask } from '../../src/geometry/mask.js';
import { findPassesWithRanges } from '../../src/geometry/passes.js';
import { makeSgp4Target } from '../../src/geometry/targets/sgp4.js';
import { DEFAULT_SEARCH } from '../../src/geometry/types.js';
import { findContacts, prepareGeometry } from '../../src/plan/contacts.js';
import type { Mask, Scenario } from '../../src/scenario/types.js';
import { elementSetFromTle, FIXTURE_EPOCH_MS, inventedFleet, inventedSites, makeTle } from '../fixtures/orbits.js';

describe('findContacts contact objects', () => {
  it('have the keys, order and values of { ...pass, durationS, ...times }', () => {
    const fleet = inventedFleet();
    const span = { startMs: FIXTURE_EPOCH_MS + 3_600_000, endMs: FIXTURE_EPOCH_MS + 2 * 86_400_000 };
    const names = Object.keys(fleet);
    const scenario = {
      spacecraft: names.map((id) => ({ id, radios: [], orbit: { kind: 'elements', sets: [elementSetFromTle(makeTle(fleet[id]!), `fixture ${id}`)] } })),
      stations: inventedSites.map((s) => ({ id: s.id, latitudeDeg: s.latitudeDeg, longitudeDeg: s.longitudeDeg, heightKm: s.heightKm, mask: s.mask as Mask })),
    } as unknown as Scenario;
    const found = findContacts(scenario, prepareGeometry(scenario, span), span);
    const sites = inventedSites.map((s) => makeSite(s.id, s.latitudeDeg, s.longitudeDeg, s.heightKm));
    const masks = inventedSites.map((s) => prepareMask(s.mask as Mask));
    const spread: Record<string, unknown>[] = [];
    for (const id of names) {
      const passes = findPassesWithRanges(makeSgp4Target(id, [elementSetFromTle(makeTle(fleet[id]!), `fixture ${id}`)]), sites, masks, span, DEFAULT_SEARCH).passes;
      for (const p of passes) {
        const c = found.contacts.find((x) => x.spacecraftId === p.spacecraftId && x.stationId === p.stationId && x.aosMs === p.aosMs)!;
        spread.push({ ...p, durationS: (p.losMs - p.aosMs) / 1000, aosTransmitMs: c.aosTransmitMs, losTransmitMs: c.losTransmitMs, lightTimeS: c.lightTimeS });
      }
    }
    expect(found.contacts.length).toBeGreaterThan(20);
    expect(spread.length).toBe(found.contacts.length);
    for (const want of spread) {
      const got = found.contacts.find((x) => x.spacecraftId === want.spacecraftId && x.stationId === want.stationId && x.aosMs === want.aosMs)! as unknown as Record<string, unknown>;
      expect(Object.keys(got)).toEqual(Object.keys(want));
      for (const k of Object.keys(want)) expect(Object.is(got[k], want[k]), `${String(want.spacecraftId)} ${k}`).toBe(true);
    }
  });
});
