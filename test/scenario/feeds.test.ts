// Station feeds and several radios per spacecraft (src/scenario/feeds.ts, plan/link.ts):
// a radio links at a station only through a feed covering its frequency; otherwise the
// pair keeps its windows but has no link, said once. Every radio gets its own volume; the
// file's dataRadio is the data downlink. Invented stations and an invented spacecraft
// (the demo's KESTREL-1 elements) with an S-band TT&C radio beside its X-band payload.
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, writeFileSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadScenario } from '../../src/scenario/load.js';
import { runPlan } from '../../src/plan/run.js';
import { spacecraftTotals } from '../../src/plan/daily.js';
import { singleBudget } from '../../src/plan/single.js';
import { demoFiles } from '../../src/scenario/paths.js';
import type { PlanResult } from '../../src/plan/types.js';
import type { Scenario } from '../../src/scenario/types.js';

const C_M_S = 299_792_458; // SI exact
let scenario: Scenario;
let plan: PlanResult;
let dir: string;

const demoTle = readFileSync(join(demoFiles().spacecraftFile, '..', 'demo-fleet.tle'), 'utf8').split('\n').slice(0, 3).join('\n');
const xRadio = {
  id: 'X-PAYLOAD', frequencyMHz: 8212.5, powerW: 2, antenna: { gainDbi: 3 },
  coding: { adaptive: true, table: 'DVB-S2', symbolRateBaud: 10000000, rollOff: 0.35 },
};
const sRadio = { id: 'S-TTC', frequencyMHz: 2245, powerW: 1, antenna: { gainDbi: 0 }, coding: { code: 'turbo r1/2 k8920 BER 1e-6', informationRateBps: 64000 } };

function files(dataRadio?: string): { spacecraftFile: string; networkFile: string } {
  const spacecraftFile = join(dir, `fleet-${dataRadio ?? 'default'}.json`);
  writeFileSync(
    spacecraftFile,
    JSON.stringify({
      window: { from: '2026-03-05T00:00:00Z', days: 1 },
      spacecraft: [{ id: 'TWOBAND', orbit: { tle: demoTle }, radios: [xRadio, sRadio], ...(dataRadio ? { dataRadio } : {}) }],
    }),
  );
  const site = { latitudeDeg: 64.12, longitudeDeg: -146.14, heightM: 310, maskDeg: 5, timeZone: 'UTC' };
  const networkFile = join(dir, 'net.json');
  writeFileSync(
    networkFile,
    JSON.stringify({
      stations: [
        {
          id: 'SONLY', ...site,
          antenna: { dishDiameterM: 11, apertureEfficiency: 0.6 },
          receiver: { noiseTempK: 60 },
          feeds: [{ id: 'S', band: 'S', receiver: { noiseTempK: 120 } }],
        },
        {
          id: 'BOTH', ...site, longitudeDeg: -146.0,
          antenna: { dishDiameterM: 11, apertureEfficiency: 0.6 },
          receiver: { noiseTempK: 60 },
          feeds: [{ id: 'S', fromMHz: 2200, toMHz: 2300, gainDbi: 30, receiver: { noiseTempK: 150 } }, { id: 'X', band: 'X' }],
        },
      ],
    }),
  );
  return { spacecraftFile, networkFile };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'pb-feeds-'));
  scenario = loadScenario(files());
  plan = runPlan(scenario, scenario.span!);
});

describe('a station with an S-band feed only', () => {
  it('gives an X-band radio windows but no X-band volume, and says so once', () => {
    const at = plan.contacts.filter((c) => c.stationId === 'SONLY');
    expect(at.length).toBeGreaterThan(2);
    for (const c of at) expect(c.link).toBeUndefined();
    const said = plan.warnings.filter((w) => w.startsWith('SONLY:') && w.includes('X-PAYLOAD'));
    expect(said).toHaveLength(1);
    expect(said[0]).toMatch(/no feed covers 8\.21250 GHz .*carry no link/);
    expect(plan.warnings.filter((w) => w.includes('S-TTC'))).toHaveLength(0);
  });

  it('still carries the S-band radio with its own volume', () => {
    const at = plan.contacts.filter((c) => c.stationId === 'SONLY');
    const s = at.map((c) => c.otherLinks?.find((l) => l.radioId === 'S-TTC')?.volumeBits ?? 0);
    expect(s.reduce((a, b) => a + b, 0)).toBeGreaterThan(0);
  });
});

describe('a station with S and X feeds', () => {
  it('carries both radios at once, each its own volume; totals list the other radio', () => {
    const at = plan.contacts.filter((c) => c.stationId === 'BOTH');
    expect(at.some((c) => (c.link?.volumeBits ?? 0) > 0)).toBe(true);
    expect(at.some((c) => (c.otherLinks?.[0]?.volumeBits ?? 0) > 0)).toBe(true);
    for (const c of at) expect(c.link?.radioId).toBe('X-PAYLOAD');
    const t = spacecraftTotals(plan)[0]!;
    expect(t.otherRadios?.map((r) => r.radioId)).toEqual(['S-TTC']);
    expect(t.otherRadios![0]!.volumeBits).toBeGreaterThan(0);
    // X volume only through BOTH's X feed
    expect(t.stationSumVolumeBits).toBe(at.reduce((s, c) => s + (c.link?.volumeBits ?? 0), 0));
  });

  it("each feed's own receiver: S feed 30 dBi as given, X feed the station's 11 m dish, eta (pi D f / c)^2 (common practice)", () => {
    const s = singleBudget(scenario, { spacecraftId: 'TWOBAND', stationId: 'BOTH', radioId: 'S-TTC', elevationDeg: 30 });
    const x = singleBudget(scenario, { spacecraftId: 'TWOBAND', stationId: 'BOTH', radioId: 'X-PAYLOAD', elevationDeg: 30 });
    const g = (b: typeof s) => b.terms.find((t) => t.name === 'Receive antenna gain')!.value;
    expect(g(s)).toBe(30);
    expect(Math.abs(g(x) - 10 * Math.log10(0.6 * ((Math.PI * 11 * 8212.5e6) / C_M_S) ** 2))).toBeLessThan(1e-9);
    expect(() => singleBudget(scenario, { spacecraftId: 'TWOBAND', stationId: 'SONLY', radioId: 'X-PAYLOAD', elevationDeg: 30 })).toThrow(/no feed of station SONLY covers 8212\.500 MHz/);
  });
});

describe('dataRadio', () => {
  it('names the data downlink (default: the first radio)', () => {
    expect(scenario.spacecraft[0]!.radios[0]!.id).toBe('X-PAYLOAD');
    const s2 = loadScenario(files('S-TTC'));
    expect(s2.spacecraft[0]!.radios.map((r) => r.id)).toEqual(['S-TTC', 'X-PAYLOAD']);
    const p2 = runPlan(s2, s2.span!);
    for (const c of p2.contacts) if (c.link) expect(c.link.radioId).toBe('S-TTC');
  });

  it('an unknown dataRadio is a bad input naming the field', () => {
    const f = files('NOPE');
    expect(() => loadScenario(f)).toThrow(/spacecraft\[0\]\.dataRadio: "NOPE" is not one of its radios \(X-PAYLOAD, S-TTC\)/);
  });
});
