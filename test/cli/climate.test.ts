// Station climate from the ITU-R maps through the CLI: `climate` and `check` list every input
// with its source; a station with no climate block and the same station with the values
// typed in give the same budget (1e-6 dB: the same numbers go in, so only the printing's
// 10 significant digits separate them); a site the maps cannot serve and an exceedance
// outside the shipped maps give one line naming the station and what is valid, exit 2.
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { run } from '../../src/cli/main.js';
import { loadScenario } from '../../src/scenario/load.js';
import { stationClimate } from '../../src/link/climate/station.js';
import { rainRate001MmH } from '../../src/link/climate/p837-7.js';
import { rainHeightKm } from '../../src/link/climate/p839-4.js';
import { standardPressureHpa } from '../../src/link/climate/p835-6.js';

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'pb-climate-'));
});

const SITE = { id: 'HLM', latitudeDeg: 41.9, longitudeDeg: 12.49, heightM: 46, maskDeg: 5, timeZone: 'Europe/Rome', antenna: { dishDiameterM: 4.5, apertureEfficiency: 0.6 }, receiver: { noiseTempK: 80 } };

function fleet(): string {
  const p = join(dir, 'fleet.json');
  writeFileSync(
    p,
    JSON.stringify({
      link: { availabilityPercent: 99.9 },
      spacecraft: [{ id: 'KA', orbit: { sky: { rightAscensionDeg: 0, declinationDeg: 0, rangeKm: 40000 } }, radios: [{ id: 'R', frequencyMHz: 20000, powerW: 10, antenna: { gainDbi: 30 }, coding: { code: 'uncoded BER 1e-5', informationRateBps: 1e6 } }] }],
    }),
  );
  return p;
}
function network(name: string, stations: Record<string, unknown>[]): string {
  const p = join(dir, name);
  writeFileSync(p, JSON.stringify({ stations }));
  return p;
}
async function cli(args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await run(args, { out: (t) => (out += t), err: (t) => (err += t), isTty: false, nowMs: () => 0 });
  return { code, out, err };
}

describe('station climate from the ITU-R maps', () => {
  it('climate lists every input from its map when the file gives none', async () => {
    const r = await cli(['climate', '--spacecraft', fleet(), '--network', network('bare.json', [SITE]), '--format', 'json']);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const doc = JSON.parse(r.out) as { exceedance_percent: number; stations: { gas_cloud_exceedance_percent: number; inputs: { field: string; value: number; source: string }[] }[] };
    expect(doc.exceedance_percent).toBe(0.1);
    const s = doc.stations[0]!;
    expect(s.gas_cloud_exceedance_percent).toBe(5);
    const by = Object.fromEntries(s.inputs.map((i) => [i.field, i]));
    expect(Object.keys(by).sort()).toEqual(['cloudLiquidWaterKgM2', 'nWetMedian', 'pressureHpa', 'rainHeightKm', 'rainRate001MmH', 'temperatureK', 'waterVapourDensityGM3']);
    expect(by['rainRate001MmH']!.source).toMatch(/^ITU-R P\.837-7/);
    expect(by['rainHeightKm']!.source).toMatch(/^ITU-R P\.839-4/);
    expect(by['waterVapourDensityGM3']!.source).toMatch(/^ITU-R P\.836-6 .*5 %/);
    expect(by['temperatureK']!.source).toMatch(/^ITU-R P\.1510-1/);
    expect(by['pressureHpa']!.source).toMatch(/^ITU-R P\.835-6/);
    expect(by['nWetMedian']!.source).toMatch(/^ITU-R P\.453-14/);
    expect(by['cloudLiquidWaterKgM2']!.source).toMatch(/^ITU-R P\.840-9 .*5 %/);
    // The values are the models' at the site (10 significant digits printed).
    expect(by['rainRate001MmH']!.value).toBeCloseTo(rainRate001MmH(41.9, 12.49), 6);
    expect(by['rainHeightKm']!.value).toBeCloseTo(rainHeightKm(41.9, 12.49), 8);
    expect(by['pressureHpa']!.value).toBeCloseTo(standardPressureHpa(0.046), 6);
    // ITU-R SG3 validation workbook Rev 8.3.0 (p837-7_r001.csv, p839-4_rain_height.csv): Rome 33.936 mm/h, hR 3.0475 km.
    expect(Math.abs(by['rainRate001MmH']!.value / 33.936232 - 1)).toBeLessThan(1.5e-3);
    expect(Math.abs(by['rainHeightKm']!.value / 3.04749333333333 - 1)).toBeLessThan(1e-4);
  });

  it('a value in the file overrides its map value, and says "file"', async () => {
    const r = await cli(['climate', '--spacecraft', fleet(), '--network', network('one.json', [{ ...SITE, climate: { rainRate001MmH: 50 } }])]);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/Rain rate R0\.01\s+50\.000\s+mm\/h\s+file/);
    expect(r.out).toMatch(/Rain height\s+[\d.]+\s+km\s+ITU-R P\.839-4/);
  });

  it('no climate block and the same values typed in give the same budget to 1e-6 dB', async () => {
    const s = fleet();
    const bare = network('bare2.json', [SITE]);
    const c = stationClimate(loadScenario({ spacecraftFile: s, networkFile: bare }).stations[0]!, 0.1).values;
    const typed = network('typed.json', [
      {
        ...SITE,
        climate: {
          rainRate001MmH: c.rainRate001MmH,
          rainHeightKm: c.rainHeightKm,
          waterVapourDensityGM3: c.surfaceWaterVapourDensityGM3,
          temperatureK: c.surfaceTemperatureK,
          pressureHpa: c.surfacePressureHpa,
          nWetMedian: c.nWetMedian,
          cloudLiquidWaterKgM2: c.cloudLiquidWaterKgM2,
        },
      },
    ]);
    const budget = async (net: string) => {
      const r = await cli(['budget', '--spacecraft', s, '--network', net, '--spacecraft-id', 'KA', '--station-id', 'HLM', '--elevation', '20', '--format', 'json']);
      expect(r.err).toBe('');
      return JSON.parse(r.out) as { terms: { name: string; value: number; unit: string }[]; climate: { source: string }[] };
    };
    const a = await budget(bare);
    const b = await budget(typed);
    expect(a.climate.every((x) => x.source.startsWith('ITU-R'))).toBe(true);
    expect(b.climate.every((x) => x.source === 'file')).toBe(true);
    expect(a.terms.length).toBe(b.terms.length);
    let rainDb = 0;
    for (let i = 0; i < a.terms.length; i++) {
      const ta = a.terms[i]!;
      const tb = b.terms[i]!;
      expect(tb.name).toBe(ta.name);
      if (ta.unit.startsWith('dB')) expect(Math.abs(ta.value - tb.value), ta.name).toBeLessThanOrEqual(1e-6);
      else expect(Math.abs(ta.value - tb.value), ta.name).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(ta.value)));
      if (/^Rain/.test(ta.name)) rainDb = Math.abs(ta.value);
    }
    expect(rainDb).toBeGreaterThan(0.5); // the maps did bring rain: 20 GHz at 0.1 % in Rome
  });

  it('check lists the climate too', async () => {
    const r = await cli(['check', '--spacecraft', fleet(), '--network', network('bare3.json', [SITE])]);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^ok: .*fleet\.json/m);
    expect(r.out).toMatch(/HLM .*\n.*\n.*\nRain rate R0\.01 .*ITU-R P\.837-7/);
  });

  it('a site the maps cannot serve: one line naming the station and what is valid, exit 2', async () => {
    const net = network('pole.json', [SITE, { ...SITE, id: 'NPL', latitudeDeg: 89, longitudeDeg: 50, timeZone: 'UTC' }]);
    for (const cmd of ['climate', 'check']) {
      const r = await cli([cmd, '--spacecraft', fleet(), '--network', net]);
      expect(r.code).toBe(2);
      expect(r.out).toBe('');
      const lines = r.err.trim().split('\n');
      expect(lines).toHaveLength(1);
      expect(lines[0]).toMatch(/^error: .*pole\.json: station NPL: climate\.waterVapourDensityGM3: ITU-R P\.836-6 .*89.*or give climate\.waterVapourDensityGM3/);
    }
    const typed = network('pole2.json', [{ ...SITE, id: 'NPL', latitudeDeg: 89, longitudeDeg: 50, timeZone: 'UTC', climate: { waterVapourDensityGM3: 2 } }]);
    expect((await cli(['climate', '--spacecraft', fleet(), '--network', typed])).code).toBe(0);
  });

  it('an exceedance outside the shipped maps: one line per station field naming what is valid, exit 2', async () => {
    const r = await cli(['climate', '--spacecraft', fleet(), '--network', network('bare4.json', [SITE]), '--availability', '80']);
    expect(r.code).toBe(2);
    expect(r.out).toBe('');
    const lines = r.err.trim().split('\n');
    expect(lines).toHaveLength(2); // rho and L
    expect(lines[0]).toMatch(/station HLM: climate\.waterVapourDensityGM3: .*exceedancePercent = 20 is outside its valid range \(5\.\.10 %/);
    expect(lines[1]).toMatch(/station HLM: climate\.cloudLiquidWaterKgM2: .*exceedancePercent = 20 .*5\.\.10 %/);
  });

  it('a latitude off the Earth is refused by the schema (one line, exit 2)', async () => {
    const r = await cli(['climate', '--spacecraft', fleet(), '--network', network('lat.json', [{ ...SITE, latitudeDeg: 91 }])]);
    expect(r.code).toBe(2);
    expect(r.err.trim().split('\n')).toHaveLength(1);
    expect(r.err).toMatch(/stations\[0\]\.latitudeDeg/);
  });
});
