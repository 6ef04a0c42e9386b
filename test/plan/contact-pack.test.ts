// Contacts packed as columns (plan/contact-pack.ts) read back through their views give
// every field of the contacts they were packed from, bit for bit (Object.is: -0 and NaN
// too), absent optional fields absent, the MODCOD times in the same key order; the rate
// step functions are left out; a view cannot be
// written to. Reference: the contact objects of runPlan on one demo day, and a
// structured clone of the pack (what crossing threads does to it).
import { describe, it, expect } from 'vitest';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { runPlan } from '../../src/plan/run.js';
import { packContacts, unpackContacts } from '../../src/plan/contact-pack.js';
import type { Contact, ContactLink } from '../../src/plan/types.js';

const CONTACT_KEYS: (keyof Contact)[] = [
  'spacecraftId', 'stationId', 'aosMs', 'losMs', 'tcaMs', 'maxElevationDeg', 'aosAzimuthDeg', 'losAzimuthDeg',
  'aosElevationDeg', 'losElevationDeg', 'aosClipped', 'losClipped', 'losTrackEnded', 'durationS',
  'aosTransmitMs', 'losTransmitMs', 'lightTimeS',
];
const LINK_KEYS: (keyof ContactLink)[] = [
  'radioId', 'volumeBits', 'dataStartMs', 'dataEndMs', 'closedS', 'worstMarginDb', 'worstMarginAtMs',
  'worstMarginElevationDeg', 'peakRateBps', 'samples', 'binStartMs', 'expectedVolumeBits', 'expectedVolumeBoundBits',
];

function expectSameLink(view: ContactLink | undefined, ref: ContactLink | undefined): void {
  expect(view === undefined).toBe(ref === undefined);
  if (!view || !ref) return;
  for (const k of LINK_KEYS) expect(Object.is(view[k], ref[k]), `link.${k}`).toBe(true);
  expect(view.volumeBinsBits).toEqual(ref.volumeBinsBits);
  expect(view.expectedVolumeBinsBits).toEqual(ref.expectedVolumeBinsBits);
  expect(Object.entries(view.timeInModcodS)).toEqual(Object.entries(ref.timeInModcodS));
  expect(view.ratePieces).toBeUndefined();
  expect(view.expectedRatePieces).toBeUndefined();
}

describe('packContacts / unpackContacts', () => {
  const demo = loadScenario(demoFiles());
  const span = { startMs: demo.span!.startMs, endMs: demo.span!.startMs + 86_400_000 };
  const plan = runPlan(demo, span);

  it('gives back every field of every contact of a demo day', () => {
    // one contact with a second radio's link (a copy of its own, with rate pieces)
    const withRadio = plan.contacts.findIndex((c) => c.link?.ratePieces);
    const contacts = plan.contacts.map((c, i) => (i === withRadio ? { ...c, otherLinks: [{ ...c.link!, radioId: 'S2' }] } : c));
    expect(contacts.length).toBeGreaterThan(50);
    expect(contacts.some((c) => c.link?.ratePieces)).toBe(true); // and overlapping windows
    const views = unpackContacts(structuredClone(packContacts(contacts)));
    expect(views.length).toBe(contacts.length);
    views.forEach((v, i) => {
      const c = contacts[i]!;
      for (const k of CONTACT_KEYS) expect(Object.is(v[k], c[k]), `${k} of contact ${i}`).toBe(true);
      expectSameLink(v.link, c.link);
      expect(v.otherLinks?.length).toBe(c.otherLinks?.length);
      c.otherLinks?.forEach((l, j) => {
        const { ratePieces: _r, expectedRatePieces: _e, ...rest } = l;
        expect(v.otherLinks![j]).toEqual(rest);
      });
    });
  });

  it('keeps -0, NaN and absent optional fields as they were', () => {
    const c = plan.contacts.find((x) => x.link)!;
    const odd: Contact = { ...c, aosAzimuthDeg: -0, lightTimeS: Number.NaN, link: { ...c.link!, worstMarginDb: -Infinity } };
    delete odd.losTrackEnded;
    delete odd.aosElevationDeg;
    delete odd.link!.expectedVolumeBits;
    delete odd.link!.expectedVolumeBinsBits;
    const [v] = unpackContacts(packContacts([odd, { ...odd, link: undefined } as unknown as Contact]));
    expect(Object.is(v!.aosAzimuthDeg, -0)).toBe(true);
    expect(Number.isNaN(v!.lightTimeS)).toBe(true);
    expect(v!.link!.worstMarginDb).toBe(-Infinity);
    expect(v!.losTrackEnded).toBeUndefined();
    expect(v!.aosElevationDeg).toBeUndefined();
    expect(v!.link!.expectedVolumeBits).toBeUndefined();
    expect(v!.link!.expectedVolumeBinsBits).toBeUndefined();
  });

  it('hands out the shared ids and refuses writes', () => {
    const shared = new Map<string, string>();
    const views = unpackContacts(packContacts(plan.contacts.slice(0, 5)), (id) => {
      const s = `${id}`;
      shared.set(id, s);
      return s;
    });
    expect(shared.get(views[0]!.spacecraftId)).toBe(views[0]!.spacecraftId);
    expect(() => {
      (views[0] as { aosMs: number }).aosMs = 0;
    }).toThrow(TypeError);
  });
});
