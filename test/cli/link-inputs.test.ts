// Bad link inputs through `passbudget plan`: each gives one clear line and exit 2,
// never a NaN in an output. Validity ranges: ITU-R P.618-14 rain up to 55 GHz,
// ITU-R P.676-13 from 1 GHz; availability 90..99.999 %, aperture efficiency (0, 1],
// transmit power > 0 W (this project's schema). Spacecraft and stations invented.
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, writeFileSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { run } from '../../src/cli/main.js';
import { withChecksum } from '../../src/scenario/tle.js';

const L1 = withChecksum('1 90001U 26901A   26063.50000000  .00001200  00000+0  72000-4 0  999');
const L2 = withChecksum('2 90001  97.5800 138.2000 0001200  90.0000 270.1000 15.05500000 1200');

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'pb-link-'));
});

function files(radio: Record<string, unknown>, station: Record<string, unknown> = {}, link: Record<string, unknown> = {}): string[] {
  const s = join(dir, `fleet-${Math.random().toString(36).slice(2)}.json`);
  const n = join(dir, `net-${Math.random().toString(36).slice(2)}.json`);
  writeFileSync(
    s,
    JSON.stringify({
      window: { from: '2026-03-05T00:00:00Z', days: 0.25 },
      link,
      spacecraft: [
        {
          id: 'PBX-1',
          orbit: { tle: `${L1}\n${L2}` },
          radios: [{ id: 'R', frequencyMHz: 8200, powerW: 2, antenna: { gainDbi: 3 }, coding: { code: 'conv K7 r1/2 BER 1e-5', informationRateBps: 1e6 }, ...radio }],
        },
      ],
    }),
  );
  writeFileSync(
    n,
    JSON.stringify({
      stations: [
        {
          id: 'TST',
          latitudeDeg: 60,
          longitudeDeg: 10,
          heightM: 100,
          maskDeg: 5,
          timeZone: 'Europe/Oslo',
          antenna: { dishDiameterM: 3.7, apertureEfficiency: 0.6 },
          receiver: { noiseTempK: 100 },
          climate: { rainRate001MmH: 30, rainHeightKm: 2.5 },
          ...station,
        },
      ],
    }),
  );
  return ['--spacecraft', s, '--network', n];
}

async function plan(args: string[], out = join(dir, 'out')): Promise<{ code: number; err: string; out: string }> {
  let o = '';
  let e = '';
  const code = await run(['plan', '--out', out, ...args], { out: (t) => (o += t), err: (t) => (e += t), isTty: false, nowMs: () => 0 });
  return { code, err: e, out: o };
}

describe('link inputs outside a model or the schema', () => {
  it('a 60 GHz radio with a rain climate: P.618 rain stops at 55 GHz', async () => {
    const r = await plan(files({ frequencyMHz: 60_000 }));
    expect(r.code).toBe(2);
    expect(r.err.trim().split('\n')).toHaveLength(1);
    // names the file and the field (preflight), and the station
    expect(r.err).toMatch(/fleet-.*\.json: spacecraft\[0\]\.radios\[0\]\.frequencyMHz: .*P\.618.*60.*1\.\.55 GHz.*at station TST/);
  });

  it('a 500 MHz radio: gaseous attenuation (P.676) starts at 1 GHz', async () => {
    const r = await plan(files({ frequencyMHz: 500 }, { climate: {} }));
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/spacecraft\[0\]\.radios\[0\]\.frequencyMHz: .*0\.5.*1\.\..*at station TST/);
  });

  it('negative power, efficiency outside (0, 1], availability outside 90..99.999 %', async () => {
    const a = await plan(files({ powerW: -2 }));
    expect(a.code).toBe(2);
    expect(a.err).toMatch(/spacecraft\[0\]\.radios\[0\]\.powerW: -2 must be > 0/);
    const b = await plan(files({}, { antenna: { dishDiameterM: 3.7, apertureEfficiency: 1.2 } }));
    expect(b.code).toBe(2);
    expect(b.err).toMatch(/stations\[0\]\.antenna\.apertureEfficiency: 1\.2 must be in \(0, 1\]/);
    const c = await plan(files({}, {}, { availabilityPercent: 99.9999 }));
    expect(c.code).toBe(2);
    expect(c.err).toMatch(/link\.availabilityPercent: 99\.9999 is outside 90\.\.99\.999/);
  });

  it('no NaN anywhere in the outputs of a good run', async () => {
    const out = mkdtempSync(join(dir, 'ok-'));
    const r = await plan(files({}), out);
    expect(r.code).toBe(0);
    for (const f of ['plan.json', 'contacts.csv', 'daily.csv', 'report.html']) {
      expect(readFileSync(join(out, f), 'utf8')).not.toMatch(/NaN|Infinity/);
    }
  });
});
