/**
 * Worst-case elevation margin (src/plan/margin.ts) against a hand computation:
 * the slant range at the mask elevation from the largest geocentric distance, by the
 * Earth-central-angle form of the law of cosines (plane triangle Earth centre -
 * station - spacecraft), then the budget functions at that look. Also the CLI exit
 * code (1 when a row fails) on an invented weak and an invented strong radio.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';
import type { CliIo } from '../../src/cli/io.js';
import { makeSite } from '../../src/geometry/earth.js';
import { newLook } from '../../src/geometry/topocentric.js';
import { evaluateLink } from '../../src/link/budget.js';
import { newLinkSample } from '../../src/link/types.js';
import { makeTarget } from '../../src/plan/contacts.js';
import { prepareRadioAtStation } from '../../src/plan/link.js';
import { marginGatePasses, marginRows, slantRangeAtElevationKm, type MarginRow } from '../../src/plan/margin.js';
import { runPlan } from '../../src/plan/run.js';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import type { Scenario, Span } from '../../src/scenario/types.js';
import { elementSetFromTle, FIXTURE_EPOCH_MS, inventedDecayingOrbit, makeTle } from '../fixtures/orbits.js';

const DEG = Math.PI / 180;
const hundredthDb = 0.01;

/** Slant range by the central angle: lambda = acos(R cos e / r) - e; rho^2 = R^2 + r^2 - 2 R r cos lambda. */
function handSlantRangeKm(stationRadiusKm: number, targetRadiusKm: number, elevationDeg: number): number {
  const e = elevationDeg * DEG;
  const lambda = Math.acos((stationRadiusKm * Math.cos(e)) / targetRadiusKm) - e;
  return Math.sqrt(stationRadiusKm ** 2 + targetRadiusKm ** 2 - 2 * stationRadiusKm * targetRadiusKm * Math.cos(lambda));
}

let scenario: Scenario;
let span: Span;
let rows: MarginRow[];

beforeAll(() => {
  const demo = loadScenario(demoFiles());
  scenario = { ...demo, spacecraft: demo.spacecraft.filter((s) => s.id === 'HERON-2' || s.id === 'PETREL-3') };
  span = { startMs: demo.span!.startMs, endMs: demo.span!.startMs + 86_400_000 };
  rows = marginRows(scenario, runPlan(scenario, span, { linkStepS: 10 }));
});

function row(station: string, spacecraft: string): MarginRow {
  const r = rows.find((x) => x.station === station && x.spacecraft === spacecraft);
  if (!r) throw new Error(`no row ${station}/${spacecraft}`);
  return r;
}

function setup(stationId: string, spacecraftId: string) {
  const station = scenario.stations.find((s) => s.id === stationId)!;
  const sc = scenario.spacecraft.find((s) => s.id === spacecraftId)!;
  const site = makeSite(station.id, station.latitudeDeg, station.longitudeDeg, station.heightKm);
  const stationRadiusKm = Math.hypot(...site.ecefKm);
  const link = prepareRadioAtStation(sc.radios[0]!, station, site, scenario.link, 0);
  return { station, sc, site, stationRadiusKm, link };
}

function marginAt(link: ReturnType<typeof setup>['link'], elevationDeg: number, rangeKm: number): number {
  const look = newLook();
  look.elevationDeg = elevationDeg;
  look.rangeKm = rangeKm;
  const s = newLinkSample();
  evaluateLink(link, look, s);
  // closure margin by hand: above the most robust entry's threshold plus the required margin
  if (link.codingKind === 'fixed') return s.marginDb;
  const robust = Math.min(...link.modcodTable.map((e) => e.esN0ThresholdDb));
  return s.esN0Db - link.implementationLossDb - robust - link.requiredMarginDb;
}

describe('slant range at an elevation', () => {
  it('GEO at the zenith of an equatorial station is the GEO altitude, 35,786 km (common practice figure)', () => {
    // WGS-84 a = 6378.137 km; GEO radius 42,164.17 km (from memory); tolerance 1 km
    expect(slantRangeAtElevationKm(6378.137, 42164.17, 90)).toBeCloseTo(35786, -0);
  });
  it('GEO at 0 deg is sqrt(r^2 - R^2) = 41,679 km (tangent line, common practice)', () => {
    expect(Math.abs(slantRangeAtElevationKm(6378.137, 42164.17, 0) - 41679)).toBeLessThan(1);
  });
  it('matches the central-angle law of cosines at every elevation (1 m)', () => {
    for (let e = 0; e <= 90; e += 7.5) {
      expect(Math.abs(slantRangeAtElevationKm(6371, 6371 + 550, e) - handSlantRangeKm(6371, 6371 + 550, e))).toBeLessThan(1e-3);
    }
  });
});

describe('margin at the mask elevation', () => {
  it('the largest geocentric distance is at least the largest of a 10 s brute-force scan (and within 10 m of it)', () => {
    const r = row('SAL', 'HERON-2');
    const target = makeTarget(scenario.spacecraft.find((s) => s.id === 'HERON-2')!, span);
    const state = new Float64Array(6);
    let best = 0;
    for (let t = span.startMs; t <= span.endMs; t += 10_000) {
      if (target.stateEcefAt(t, state)) best = Math.max(best, Math.hypot(state[0]!, state[1]!, state[2]!));
    }
    expect(r.maxRadiusKm).toBeGreaterThanOrEqual(best - 1e-9);
    expect(r.maxRadiusKm - best).toBeLessThan(0.01);
  });

  for (const [stationId, spacecraftId] of [
    ['SAL', 'HERON-2'],
    ['FRV', 'PETREL-3'],
    ['EQP', 'PETREL-3'],
  ] as const) {
    it(`${stationId} / ${spacecraftId}: hand slant range and budget give the row's margin (0.01 dB)`, () => {
      const r = row(stationId, spacecraftId);
      const { station, stationRadiusKm, link } = setup(stationId, spacecraftId);
      // mask rule: lowest point of the mask (FRV has a profile whose lowest point is 3 deg)
      const m = station.mask;
      const maskDeg = m.kind === 'constant' ? m.elevationDeg : Math.min(...m.elevationDeg);
      expect(r.maskElevationDeg).toBe(Math.max(maskDeg, scenario.link.minDataElevationDeg, 0));
      const rangeKm = handSlantRangeKm(stationRadiusKm, r.maxRadiusKm, r.maskElevationDeg);
      expect(Math.abs(r.worstRangeKm - rangeKm)).toBeLessThan(1e-3);
      const margin = marginAt(link, r.maskElevationDeg, rangeKm);
      expect(Math.abs(r.maskMarginDb - margin)).toBeLessThan(hundredthDb);
      expect(r.pass).toBe(margin >= 0);
    });
  }

  it('fixed coding: no contact sample is worse than the worst case (0.1 dB: geodetic vs geocentric vertical)', () => {
    for (const r of rows.filter((x) => x.spacecraft === 'HERON-2' && x.worstSeenMarginDb !== null)) {
      expect(r.worstSeenMarginDb!).toBeGreaterThan(r.maskMarginDb - 0.1);
    }
    expect(rows.some((x) => x.spacecraft === 'HERON-2' && x.worstSeenMarginDb !== null)).toBe(true);
  });
});

describe('usable data mask', () => {
  it('EQP / PETREL-3: margin ~0 at the usable mask, negative just below it', () => {
    const r = row('EQP', 'PETREL-3');
    expect(r.usableMaskDeg).not.toBeNull();
    const e = r.usableMaskDeg!;
    expect(e).toBeGreaterThan(0); // interior crossing in the demo (heavy equatorial rain)
    const { stationRadiusKm, link } = setup('EQP', 'PETREL-3');
    const at = marginAt(link, e, handSlantRangeKm(stationRadiusKm, r.maxRadiusKm, e));
    // bisection to 1e-4 deg; the margin slope at low elevation is a few dB/deg
    expect(at).toBeGreaterThanOrEqual(0);
    expect(at).toBeLessThan(hundredthDb);
    const below = e - 0.01;
    expect(marginAt(link, below, handSlantRangeKm(stationRadiusKm, r.maxRadiusKm, below))).toBeLessThan(0);
    // and the link closes everywhere above it
    for (let el = e + 0.5; el <= 90; el += 0.5) {
      expect(marginAt(link, el, handSlantRangeKm(stationRadiusKm, r.maxRadiusKm, el))).toBeGreaterThanOrEqual(0);
    }
  });
});

describe('passbudget margin exit code', () => {
  let dir: string;
  beforeAll(() => {
    dir = mkdtempSync(join(tmpdir(), 'passbudget-margin-'));
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  /** An invented deep-space craft with one S-band radio of the given power. */
  function craftFile(name: string, powerW: number): string {
    const file = join(dir, `${name}.json`);
    const doc = {
      mission: 'Margin test (invented)',
      window: { from: '2026-03-05T00:00:00Z', days: 1 },
      spacecraft: [
        {
          id: 'FAINT-1',
          name: 'Invented test craft',
          orbit: { sky: { rightAscensionDeg: 100, declinationDeg: 5, rangeKm: 1_000_000 } },
          radios: [
            {
              id: 'S-TEST',
              frequencyMHz: 2250,
              powerW,
              antenna: { gainDbi: 10 },
              coding: { code: 'turbo r1/2 k8920 BER 1e-6', informationRateBps: 1000 },
            },
          ],
        },
      ],
    };
    writeFileSync(file, JSON.stringify(doc));
    return file;
  }

  async function runMargin(file: string): Promise<{ code: number; out: string }> {
    let out = '';
    const io: CliIo = { out: (t) => void (out += t), err: () => {}, isTty: false, nowMs: () => 0 };
    const code = await run(['margin', '--spacecraft', file, '--step', '60s', '--no-write', '--format', 'csv'], io);
    return { code, out };
  }

  it('a 1 mW radio at 1e6 km fails: exit 1, FAIL rows', async () => {
    const { code, out } = await runMargin(craftFile('weak', 0.001));
    expect(code).toBe(1);
    expect(out).toMatch(/,FAIL$/m);
  });

  it('a 100 W radio at 1e6 km passes everywhere: exit 0', async () => {
    const { code, out } = await runMargin(craftFile('strong', 100));
    expect(code).toBe(0);
    expect(out.trim().split('\n')).toHaveLength(1 + 6);
    expect(out).not.toMatch(/FAIL/);
  });
});

describe('pairs that never see each other', () => {
  // The demo: ANCHOR-G (geostationary at 10 deg E) is below every horizon at Aurora Lake
  // (146 deg W) and HERON-2 (inclination 50 deg) never rises over Frostvik (70.3 deg N):
  // with no contact there is nothing to grade (common practice: a pair out of view is not
  // a link requirement). Such rows are "not visible" and do not set the exit code.
  let all: MarginRow[];
  beforeAll(() => {
    const demo = loadScenario(demoFiles());
    const sc = { ...demo, spacecraft: demo.spacecraft.filter((s) => s.id === 'HERON-2' || s.id === 'ANCHOR-G') };
    all = marginRows(sc, runPlan(sc, { startMs: demo.span!.startMs, endMs: demo.span!.startMs + 86_400_000 }, { linkStepS: 60 }));
  });

  it('ALK / ANCHOR-G and FRV / HERON-2 are "not visible", neither pass nor fail', () => {
    for (const [st, sc] of [['ALK', 'ANCHOR-G'], ['FRV', 'HERON-2']] as const) {
      const r = all.find((x) => x.station === st && x.spacecraft === sc)!;
      expect(r.contacts).toBe(0);
      expect(r.result).toBe('not visible');
      expect(r.pass).toBe(false);
    }
    for (const r of all) expect(r.result === 'not visible').toBe(r.contacts === 0);
  });

  it('"not visible" rows do not fail the gate', () => {
    const visibleOnly = all.filter((r) => r.result !== 'not visible');
    expect(marginGatePasses(all)).toBe(marginGatePasses(visibleOnly));
    const hidden = all.filter((r) => r.result === 'not visible');
    expect(hidden.length).toBeGreaterThan(0);
    expect(marginGatePasses(hidden)).toBe(true);
  });
});

describe('a spacecraft with no orbit state in the span', () => {
  it('gives a FAIL row, never a silent pass', () => {
    const base = loadScenario(demoFiles());
    const tle = makeTle(inventedDecayingOrbit());
    const sc = { ...base.spacecraft[0]!, id: 'DECAYED', orbit: { kind: 'elements' as const, sets: [elementSetFromTle(tle, 'test')] } };
    const scenario = { ...base, spacecraft: [sc], stations: base.stations.slice(0, 1) };
    // the decaying orbit ends ~45 h after its epoch: start the span 3 days after it
    const span = { startMs: FIXTURE_EPOCH_MS + 3 * 86_400_000, endMs: FIXTURE_EPOCH_MS + 4 * 86_400_000 };
    const rows = marginRows(scenario, runPlan(scenario, span));
    expect(rows).toHaveLength(1);
    expect(rows[0]!.pass).toBe(false);
    expect(rows[0]!.result).toBe('fail');
    expect(rows[0]!.maskModcod).toBe('no orbit state in the span');
  });
});
