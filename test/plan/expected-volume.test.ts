// Expected volume over an average year (src/link/atmosphere/exceedance-levels.ts, the link
// engine in src/plan/link.ts) against a brute-force average: many draws of the exceedance
// p from its distribution (uniform on 0..100 % of an average year, stratified: one draw in
// each of 400 equal strata of 0..10 %, and the part above 10 %, where the absorption is held
// at its 10 % value, taken exactly), each draw's contact volume by a slow obvious 1 s sum with
// the atmosphere evaluated directly by the models (no table) at that p, scintillation left
// out as the method says. Tolerance: the engine's stated quadrature bound plus 0.2 % of the
// volume (the fast path's 1 s step and table interpolation against the 1 s midpoint sum;
// test/plan/volume.test.ts allows 0.5 % for that alone) plus three standard errors of the
// draws. Source of the distribution: ITU-R P.618-14 §2.5 Eqs. (65)-(68) (our reading).
// At 0 mm/h rain rate every level has the same absorption, so the expected volume equals
// the clear-sky volume (gas and cloud only) to the fast path's accuracy (0.2 %).
import { describe, it, expect } from 'vitest';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { prepareGeometry, findContacts } from '../../src/plan/contacts.js';
import { atmosphereInputFor, integrateContacts, linkKey, prepareLinks } from '../../src/plan/link.js';
import { lookFrom, newLook } from '../../src/geometry/topocentric.js';
import { evaluateLink, prepareLink } from '../../src/link/budget.js';
import { newLinkSample } from '../../src/link/types.js';
import { combineTerms, evaluateTerms, newAtmospherePrepared, prepareAtmosphere } from '../../src/link/atmosphere/prepare.js';
import type { AtmosphereResult, AtmosphereTable } from '../../src/link/atmosphere/types.js';
import { EXPECTED_VOLUME_LEVELS, expectationWeights } from '../../src/link/atmosphere/exceedance-levels.js';
import { stationThroughFeed } from '../../src/scenario/feeds.js';
import { mulberry32 } from '../fixtures/prng.js';
import type { Scenario, Span } from '../../src/scenario/types.js';
import type { Contact } from '../../src/plan/types.js';

const FINE_STEP_S = 1;

interface Case {
  scenario: Scenario;
  span: Span;
  contact: Contact;
  geometry: ReturnType<typeof prepareGeometry>;
}

function contactCase(scenario: Scenario, span: Span, spacecraftId: string, stationId: string): Case {
  const geometry = prepareGeometry(scenario, span);
  const found = findContacts(scenario, geometry, span);
  const setup = prepareLinks(scenario, geometry);
  const contacts = found.contacts.filter((c) => c.spacecraftId === spacecraftId && c.stationId === stationId);
  integrateContacts(contacts, geometry, setup, scenario.link, FINE_STEP_S);
  const contact = contacts.reduce((a, b) => ((b.link?.volumeBits ?? 0) > (a.link?.volumeBits ?? 0) ? b : a));
  expect(setup.links.get(linkKey(spacecraftId, stationId))?.exceedanceLevels).toBeDefined();
  return { scenario, span, contact, geometry };
}

/** The contact's volume by a 1 s midpoint sum, atmosphere evaluated directly at exceedance p (no scintillation). */
function directVolumeBits(k: Case, exceedancePercent: number): number {
  const { scenario, contact: c, geometry } = k;
  const sc = scenario.spacecraft.find((s) => s.id === c.spacecraftId)!;
  const radio = sc.radios[0]!;
  const station0 = scenario.stations.find((s) => s.id === c.stationId)!;
  const station = stationThroughFeed(station0, radio.frequencyHz) ?? station0;
  const settings = { ...scenario.link, availabilityPercent: 100 - exceedancePercent };
  const prep = prepareAtmosphere(atmosphereInputFor(station, radio, settings), newAtmospherePrepared());
  const direct: AtmosphereTable = {
    minElevationDeg: 0,
    at(elevationDeg: number, out: AtmosphereResult): void {
      evaluateTerms(prep, elevationDeg, out);
      out.scintillationDb = 0;
      combineTerms(out);
    },
  };
  const site = geometry.sites.find((s) => s.stationId === c.stationId)!;
  const link = prepareLink(radio, station, settings, direct, { stationGeocentricRadiusKm: Math.hypot(...site.ecefKm) });
  const target = geometry.targets.get(c.spacecraftId)!;
  const state = new Float64Array(6);
  const look = newLook();
  const s = newLinkSample();
  const startMs = c.link!.dataStartMs;
  let bits = 0;
  for (let t = startMs; t < c.losMs; t += FINE_STEP_S * 1000) {
    const dtS = Math.min(FINE_STEP_S, (c.losMs - t) / 1000);
    if (!target.stateEcefAt(t + (dtS * 1000) / 2, state)) continue;
    lookFrom(site, state, look);
    evaluateLink(link, look, s, false);
    bits += s.rateBps * dtS;
  }
  return bits;
}

/** Stratified draws of p ~ U(0, 100 %): 400 strata on 0..10 %, the rest (held at 10 %) exactly. */
function bruteForceExpected(k: Case, seed: number): { mean: number; stdErr: number } {
  const rand = mulberry32(seed);
  const strata = 400;
  const width = 10 / strata;
  const values: number[] = [];
  for (let i = 0; i < strata; i++) {
    const p = Math.max(0.001, (i + rand()) * width); // below 0.001 % the method holds the 0.001 % value
    values.push(directVolumeBits(k, p));
  }
  const tail = directVolumeBits(k, 10);
  const meanLow = values.reduce((a, b) => a + b, 0) / strata;
  // stratified estimator's standard error, bounded by the spread between neighbouring strata
  let varSum = 0;
  for (let i = 0; i + 1 < strata; i += 2) varSum += ((values[i]! - values[i + 1]!) ** 2) / 2;
  const stdErrLow = Math.sqrt(varSum / (strata / 2)) / Math.sqrt(strata);
  return { mean: 0.1 * meanLow + 0.9 * tail, stdErr: 0.1 * stdErrLow };
}

const demo = loadScenario(demoFiles());
const day1: Span = { startMs: demo.span!.startMs, endMs: demo.span!.startMs + 86_400_000 };

describe('expected volume over an average year', () => {
  it('the quadrature weights over the exceedance distribution sum to 1', () => {
    const w = expectationWeights(EXPECTED_VOLUME_LEVELS);
    expect(w.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 14);
    expect(Math.min(...w)).toBeGreaterThanOrEqual(0);
  });

  for (const [spacecraftId, stationId, span, what] of [
    ['KESTREL-1', 'EQP', day1, 'X-band LEO contact at the tropical station'],
    ['ANCHOR-G', 'EQP', { startMs: day1.startMs, endMs: day1.startMs + 3_600_000 }, 'Ka-band GEO link at the tropical station, 1 h'],
  ] as const) {
    it(`matches a brute-force average over draws of the attenuation: ${what}`, () => {
      const k = contactCase(demo, span, spacecraftId, stationId);
      const link = k.contact.link!;
      const engine = link.expectedVolumeBits!;
      const bound = link.expectedVolumeBoundBits!;
      const brute = bruteForceExpected(k, 8);
      const tol = bound + 0.002 * brute.mean + 3 * brute.stdErr;
      console.log(
        `${spacecraftId}@${stationId}: volume at ${demo.link.availabilityPercent} % ${(link.volumeBits / 1e9).toFixed(3)} Gbit, expected ${(engine / 1e9).toFixed(3)} Gbit, ` +
          `brute force ${(brute.mean / 1e9).toFixed(3)} Gbit (std err ${(brute.stdErr / 1e9).toFixed(4)}), |diff| ${(Math.abs(engine - brute.mean) / brute.mean * 100).toFixed(3)} %, ` +
          `bound ${((bound / brute.mean) * 100).toFixed(3)} %, tolerance ${((tol / brute.mean) * 100).toFixed(3)} %`,
      );
      expect(engine).toBeGreaterThan(link.volumeBits); // the average year beats the 0.5 % year here
      expect(Math.abs(engine - brute.mean)).toBeLessThanOrEqual(tol);
    });
  }

  it('equals the clear-sky volume at 0 mm/h rain rate', () => {
    const dry: Scenario = {
      ...demo,
      stations: demo.stations.map((s) => (s.id === 'EQP' ? { ...s, climate: { ...s.climate, rainRate001MmH: 0 } } : s)),
    };
    const k = contactCase(dry, day1, 'KESTREL-1', 'EQP');
    const link = k.contact.link!;
    const clear = directVolumeBits(k, 10); // gas and cloud only, the same at every p here
    expect(directVolumeBits(k, 0.01)).toBe(clear);
    expect(Math.abs(link.expectedVolumeBits! - clear)).toBeLessThanOrEqual(0.002 * clear);
    expect(link.expectedVolumeBoundBits!).toBeLessThanOrEqual((0.001 / 100) * clear * 1.0001); // only the p < 0.001 % sliver
  });
});
