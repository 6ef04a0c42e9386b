// Data volume per contact: the fast path (one propagation per grid step shared by
// all stations, the rate's step function integrated between samples at 1 s and at the
// default step) against a slow obvious sum at 0.1 s (the rate at each 0.1 s midpoint
// times 0.1 s), on the demo's first day.
// Tolerance 0.5 % of the contact's volume (issue acceptance figure).
import { describe, it, expect } from 'vitest';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { prepareGeometry, findContacts } from '../../src/plan/contacts.js';
import { prepareLinks, integrateContacts, linkKey, wholeBitBins, DEFAULT_LINK_STEP_S } from '../../src/plan/link.js';
import { lookFrom, newLook } from '../../src/geometry/topocentric.js';
import { evaluateLink } from '../../src/link/budget.js';
import { newLinkSample } from '../../src/link/types.js';

const scenario = loadScenario(demoFiles());
const span = { startMs: scenario.span!.startMs, endMs: scenario.span!.startMs + 86_400_000 };
const geometry = prepareGeometry(scenario, span);
const found = findContacts(scenario, geometry, span);
const setup = prepareLinks(scenario, geometry);
const stats = integrateContacts(found.contacts, geometry, setup, scenario.link, 1);

function fineVolumeBits(c: (typeof found.contacts)[number], stepS: number): number {
  const target = geometry.targets.get(c.spacecraftId)!;
  const site = geometry.sites.find((s) => s.stationId === c.stationId)!;
  const link = setup.links.get(linkKey(c.spacecraftId, c.stationId))!;
  const state = new Float64Array(6);
  const look = newLook();
  const sample = newLinkSample();
  const startMs = c.aosMs + scenario.link.acquisitionTimeS * 1000;
  let bits = 0;
  for (let t = startMs + (stepS * 1000) / 2; t < c.losMs; t += stepS * 1000) {
    if (!target.stateEcefAt(t, state)) continue;
    lookFrom(site, state, look);
    evaluateLink(link, look, sample);
    const dt = Math.min(stepS, (c.losMs - (t - (stepS * 1000) / 2)) / 1000);
    bits += sample.rateBps * dt;
  }
  return bits;
}

describe('volume per contact', () => {
  const leo = found.contacts.filter((c) => ['KESTREL-1', 'HERON-2', 'PETREL-3'].includes(c.spacecraftId) && !c.aosClipped && !c.losClipped);

  it('has LEO contacts with data on the first demo day', () => {
    expect(leo.length).toBeGreaterThan(20);
    expect(leo.filter((c) => (c.link?.volumeBits ?? 0) > 0).length).toBeGreaterThan(20);
  });

  it('agrees with a 0.1 s fine-step sum within 0.5 % on every LEO contact', () => {
    let worst = 0;
    for (const c of leo.slice(0, 40)) {
      const fine = fineVolumeBits(c, 0.1);
      const fast = c.link!.volumeBits;
      if (fine === 0) {
        expect(fast).toBe(0);
        continue;
      }
      const rel = Math.abs(fast - fine) / fine;
      worst = Math.max(worst, rel);
      expect(rel).toBeLessThanOrEqual(0.005);
    }
    expect(worst).toBeLessThan(0.005);
  });

  it('keeps within 0.5 % of the fine sum at the default step too', () => {
    const contacts = found.contacts.map((c) => ({ ...c }));
    integrateContacts(contacts, geometry, setup, scenario.link, DEFAULT_LINK_STEP_S);
    let checked = 0;
    contacts.forEach((c, i) => {
      const base = found.contacts[i]!;
      if (!['KESTREL-1', 'HERON-2', 'PETREL-3'].includes(c.spacecraftId) || c.aosClipped || c.losClipped || checked >= 25) return;
      const fine = fineVolumeBits(base, 0.1);
      if (fine === 0) return;
      checked++;
      expect(Math.abs(c.link!.volumeBits - fine) / fine).toBeLessThanOrEqual(0.005);
    });
    expect(checked).toBe(25);
  });

  it('samples the link only inside contacts (fast path really ran)', () => {
    const inContactS = found.contacts.reduce((s, c) => s + c.durationS, 0);
    // about one sample per second of contact, plus edges: never a sample outside contacts
    expect(stats.linkSamples).toBeLessThan(inContactS + 4 * found.contacts.length);
    expect(stats.linkSamples).toBeGreaterThan(0.9 * inContactS);
  });

  it('splits each volume into whole-bit 15-minute bins that sum exactly to it', () => {
    for (const c of found.contacts) {
      if (!c.link) continue;
      expect(c.link.volumeBinsBits.reduce((a, b) => a + b, 0)).toBe(c.link.volumeBits);
      expect(Number.isInteger(c.link.volumeBits)).toBe(true);
    }
    expect(wholeBitBins([0.4, 0.4, 0.4]).bins).toEqual([0, 1, 0]);
  });

  it('records the worst margin and the time spent in each MODCOD', () => {
    const c = leo.find((x) => x.spacecraftId === 'KESTREL-1' && (x.link?.volumeBits ?? 0) > 0)!;
    const l = c.link!;
    expect(l.worstMarginAtMs).toBeGreaterThanOrEqual(c.aosMs);
    expect(l.worstMarginAtMs).toBeLessThanOrEqual(c.losMs);
    const inModcods = Object.values(l.timeInModcodS).reduce((a, b) => a + b, 0);
    expect(Math.abs(inModcods - l.closedS)).toBeLessThan(1e-6);
    expect(l.closedS).toBeLessThanOrEqual(c.durationS);
  });
});
