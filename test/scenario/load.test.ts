// Scenario loading and `passbudget check`: the demo loads, and every bad input
// of the kinds users make gives one line naming file, field, value and what is
// valid, with exit code 2 and no stack trace. Element sets in these tests are
// invented (catalogue 90001, "PBX-TEST"); checksums are computed by tleChecksum.
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { withChecksum } from '../../src/scenario/tle.js';
import { ScenarioError } from '../../src/errors.js';
import { run } from '../../src/cli/main.js';

const L1 = withChecksum('1 90001U 26901A   26063.50000000  .00001200  00000+0  72000-4 0  999');
const L2 = withChecksum('2 90001  97.5800 138.2000 0001200  90.0000 270.1000 15.05500000 1200');

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'pb-load-'));
});

function fleet(orbit: unknown, extra: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    spacecraft: [
      {
        id: 'PBX-1',
        orbit,
        radios: [
          {
            id: 'X',
            frequencyMHz: 8200,
            powerW: 2,
            antenna: { gainDbi: 3 },
            coding: { code: 'conv K7 r1/2 BER 1e-5', informationRateBps: 1e6 },
          },
        ],
        ...extra,
      },
    ],
  };
}

const goodStation = {
  id: 'TST',
  latitudeDeg: 45,
  longitudeDeg: 10,
  heightM: 100,
  maskDeg: 5,
  timeZone: 'Europe/Rome',
  antenna: { dishDiameterM: 3.7, apertureEfficiency: 0.6 },
  receiver: { noiseTempK: 100 },
};

function write(name: string, content: unknown): string {
  const p = join(dir, name);
  writeFileSync(p, typeof content === 'string' ? content : JSON.stringify(content, null, 2));
  return p;
}

function problemsOf(spacecraft: unknown, network: unknown = { stations: [goodStation] }): string[] {
  const s = write(`sc-${Math.random().toString(36).slice(2)}.json`, spacecraft);
  const n = write(`net-${Math.random().toString(36).slice(2)}.json`, network);
  try {
    loadScenario({ spacecraftFile: s, networkFile: n });
  } catch (err) {
    expect(err).toBeInstanceOf(ScenarioError);
    return (err as ScenarioError).message.split('\n');
  }
  return [];
}

async function cli(args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await run(args, { out: (t) => (out += t), err: (t) => (err += t), isTty: false, nowMs: () => 0 });
  return { code, out, err };
}

describe('scenario loading', () => {
  it('loads the bundled demo: eight invented spacecraft, six invented stations', () => {
    const sc = loadScenario(demoFiles());
    expect(sc.spacecraft.map((s) => s.id)).toEqual(['KESTREL-1', 'HERON-2', 'PETREL-3', 'MOONWREN', 'TERN-BASE', 'ANCHOR-G', 'DRIFTER', 'CURLEW']);
    expect(sc.stations).toHaveLength(6);
    expect(sc.span).toEqual({ startMs: Date.UTC(2026, 2, 5), endMs: Date.UTC(2026, 2, 12) });
    // The OMM file and the TLE file give the expected catalogue numbers.
    const petrel = sc.spacecraft.find((s) => s.id === 'PETREL-3')!;
    expect(petrel.orbit.kind === 'elements' && petrel.orbit.sets[0]!.catalogNumber.replace(/^0+/, '')).toBe('90003');
    const frv = sc.stations.find((s) => s.id === 'FRV')!;
    expect(frv.mask.kind).toBe('profile');
  });

  it('accepts a good inline TLE', () => {
    expect(problemsOf(fleet({ tle: `PBX-1\n${L1}\n${L2}` }))).toEqual([]);
  });

  it('reports a TLE checksum error with file, field path, found and expected digit', () => {
    const bad = L1.slice(0, 68) + String((Number(L1[68]) + 1) % 10);
    const lines = problemsOf(fleet({ tle: `${bad}\n${L2}` }));
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/sc-.*\.json: spacecraft\[0\]\.orbit\.tle: .*checksum/i);
  });

  it('reports a line-1/line-2 catalogue mismatch', () => {
    const l2 = withChecksum('2 90002  97.5800 138.2000 0001200  90.0000 270.1000 15.05500000 1200');
    const lines = problemsOf(fleet({ tle: `${L1}\n${l2}` }));
    expect(lines.join('\n')).toMatch(/90002.*90001|90001.*90002/);
  });

  it('reports a column error (letters in the inclination field)', () => {
    const l2 = withChecksum('2 90001  97.58X0 138.2000 0001200  90.0000 270.1000 15.05500000 1200');
    expect(problemsOf(fleet({ tle: `${L1}\n${l2}` })).join('\n')).toMatch(/inclination|column/i);
  });

  it('reports mean motion <= 0', () => {
    const l2 = withChecksum('2 90001  97.5800 138.2000 0001200  90.0000 270.1000  0.00000000 1200');
    expect(problemsOf(fleet({ tle: `${L1}\n${l2}` })).join('\n')).toMatch(/mean motion/i);
  });

  it('reports an OMM with eccentricity >= 1, a missing field and a non-SGP4 theory', () => {
    const omm = {
      OBJECT_NAME: 'PBX-TEST',
      OBJECT_ID: '2026-901A',
      EPOCH: '2026-03-04T12:00:00',
      MEAN_MOTION: 15.055,
      ECCENTRICITY: 1.2,
      INCLINATION: 97.58,
      RA_OF_ASC_NODE: 138.2,
      ARG_OF_PERICENTER: 90,
      MEAN_ANOMALY: 270.1,
      NORAD_CAT_ID: 90001,
      BSTAR: 0.000072,
      MEAN_MOTION_DOT: 0.000012,
      MEAN_ELEMENT_THEORY: 'DSST',
    };
    const text = problemsOf(fleet({ omm })).join('\n');
    expect(text).toMatch(/ECCENTRICITY.*1\.2/);
    expect(text).toMatch(/MEAN_MOTION_DDOT/);
    expect(text).toMatch(/SGP4/);
  });

  it('reports station problems all at once: latitude, mask, time zone, duplicate id', () => {
    const stations = [
      { ...goodStation, latitudeDeg: 95 },
      { ...goodStation, id: 'TS2', maskDeg: 95 },
      { ...goodStation, id: 'TS3', timeZone: 'Mars/Olympus' },
    ];
    const lines = problemsOf(fleet({ tle: `${L1}\n${L2}` }), { stations });
    expect(lines).toContainEqual(expect.stringMatching(/net-.*: stations\[0\]\.latitudeDeg: 95 is outside -90\.\.90/));
    expect(lines).toContainEqual(expect.stringMatching(/stations\[1\]\.maskDeg: 95 is outside -5\.\.90/));
    expect(lines).toContainEqual(expect.stringMatching(/stations\[2\]\.timeZone: "Mars\/Olympus" is not an IANA time zone/));
    const dup = problemsOf(fleet({ tle: `${L1}\n${L2}` }), { stations: [goodStation, goodStation] });
    expect(dup).toContainEqual(expect.stringMatching(/stations\[1\]\.id: "TST" is already used by stations\[0\]/));
  });

  it('reports a horizon profile point outside -5..90', () => {
    const { maskDeg: _m, ...noMask } = goodStation;
    const lines = problemsOf(fleet({ tle: `${L1}\n${L2}` }), { stations: [{ ...noMask, horizon: [[0, 2], [180, 91]] }] });
    expect(lines).toContainEqual(expect.stringMatching(/stations\[0\]\.horizon\[1\]\[1\]: 91 is outside -5\.\.90/));
  });

  it('reports duplicate spacecraft ids and an orbit with two sources', () => {
    const doc = fleet({ tle: `${L1}\n${L2}` });
    const sc = (doc.spacecraft as Record<string, unknown>[])[0]!;
    const lines = problemsOf({ spacecraft: [sc, sc] });
    expect(lines).toContainEqual(expect.stringMatching(/spacecraft\[1\]\.id: "PBX-1" is already used/));
    const two = problemsOf(fleet({ tle: `${L1}\n${L2}`, moon: true }));
    expect(two).toContainEqual(expect.stringMatching(/spacecraft\[0\]\.orbit: has tle and moon; give exactly one/));
  });

  it('reports missing and empty files, and a TLE file that does not exist', () => {
    const empty = write('empty.json', '   \n');
    const net = write('net-ok.json', { stations: [goodStation] });
    expect(() => loadScenario({ spacecraftFile: join(dir, 'nope.json'), networkFile: net })).toThrow(/nope\.json: no such file/);
    expect(() => loadScenario({ spacecraftFile: empty, networkFile: net })).toThrow(/empty\.json: the file is empty/);
    const lines = problemsOf(fleet({ tleFile: 'missing.tle' }));
    expect(lines).toContainEqual(expect.stringMatching(/missing\.tle: no such file \(named by .*spacecraft\[0\]\.orbit\.tleFile\)/));
  });

  it('reports an unknown field, naming it', () => {
    const lines = problemsOf(fleet({ tle: `${L1}\n${L2}` }, { prority: 2 }));
    expect(lines).toContainEqual(expect.stringMatching(/spacecraft\[0\]\.prority: is not a known field/));
  });
});

describe('passbudget check', () => {
  it('passes the demo with exit 0', async () => {
    const r = await cli(['check']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/8 spacecraft/);
  });

  it('prints one line per problem, exit 2, no stack trace', async () => {
    const s = write('bad-fleet.json', fleet({ tle: `${L1.slice(0, 68)}0\n${L2}` }));
    const n = write('bad-net.json', { stations: [{ ...goodStation, latitudeDeg: -91, timeZone: 'Nowhere/Land' }] });
    const r = await cli(['check', '--spacecraft', s, '--network', n]);
    expect(r.code).toBe(2);
    const lines = r.err.trim().split('\n');
    expect(lines.length).toBeGreaterThanOrEqual(3);
    for (const l of lines) expect(l).toMatch(/^error: .*bad-(fleet|net)\.json: /);
    expect(r.err).not.toMatch(/\n\s+at /); // no stack frames
    expect(r.out).toBe('');
  });

  it('a bad flag value is one line and exit 2', async () => {
    const r = await cli(['plan', '--days', 'seven', '--no-write']);
    expect(r.code).toBe(2);
    expect(r.err.trim()).toBe('error: --days: "seven" must be a number of days in (0, 366]');
  });

  it('a station without antenna and receiver, and a spacecraft without radios, load with notes (heightM 0, UTC)', () => {
    const s = write('windows-only-fleet.json', { spacecraft: [{ id: 'PBX-1', orbit: { tle: `${L1}\n${L2}` } }] });
    const n = write('windows-only-net.json', { stations: [{ id: 'BARE', latitudeDeg: 60, longitudeDeg: 10 }] });
    const sc = loadScenario({ spacecraftFile: s, networkFile: n });
    const st = sc.stations[0]!;
    expect(st.receiver).toBeUndefined();
    expect(st.heightKm).toBe(0);
    expect(st.timeZone).toBe('UTC');
    expect(sc.spacecraft[0]!.radios).toEqual([]);
    const notes = sc.notices.map((x) => `${x.level}: ${x.message}`).join('\n');
    expect(notes).toMatch(
      /^note: .*windows-only-net\.json: stations\[0\] \(BARE\): heightM not given: 0 m above the WGS-84 ellipsoid; timeZone not given: local days and times in UTC; no antenna and receiver: windows only/,
    );
  });

  it('an antenna without a receiver (or the reverse) is one problem naming both ways out', () => {
    const text = problemsOf(fleet({ tle: `${L1}\n${L2}` }), { stations: [{ ...goodStation, receiver: undefined }] }).join('\n');
    expect(text).toMatch(/stations\[0\]: has an antenna but no receiver; give both \(for a link\) or neither \(windows only\)/);
  });

  it('an OMM without OBJECT_ID (not yet catalogued) is accepted with a warning', () => {
    const omm = {
      OBJECT_NAME: 'PBX-TEST',
      EPOCH: '2026-03-04T12:00:00',
      MEAN_MOTION: 15.055,
      ECCENTRICITY: 0.0012,
      INCLINATION: 97.58,
      RA_OF_ASC_NODE: 138.2,
      ARG_OF_PERICENTER: 90,
      MEAN_ANOMALY: 270.1,
      NORAD_CAT_ID: 90001,
      BSTAR: 0.000072,
      MEAN_MOTION_DOT: 0.000012,
      MEAN_MOTION_DDOT: 0,
    };
    const sc = loadScenario({ spacecraftFile: write('omm-no-id.json', fleet({ omm })), networkFile: write('omm-no-id-net.json', { stations: [goodStation] }) });
    expect(sc.spacecraft[0]!.orbit.kind).toBe('elements');
    expect(sc.notices.filter((x) => x.level === 'warning').map((x) => x.message)).toEqual([
      expect.stringMatching(/omm-no-id\.json: spacecraft\[0\]\.orbit\.omm: OMM JSON \("PBX-TEST"\): no OBJECT_ID .*accepted without one/),
    ]);
  });

  it('a planned orbit: exactly one of altitudeKm / semiMajorAxisKm and of inclinationDeg / sunSynchronous', () => {
    const text = problemsOf(fleet({ planned: { altitudeKm: 500, semiMajorAxisKm: 6900, epoch: '2026-03-05T00:00:00Z' } })).join('\n');
    expect(text).toMatch(/orbit\.planned: has altitudeKm and semiMajorAxisKm; give exactly one of altitudeKm, semiMajorAxisKm/);
    expect(text).toMatch(/orbit\.planned: needs exactly one of inclinationDeg, sunSynchronous/);
    expect(problemsOf(fleet({ planned: { altitudeKm: 9000, sunSynchronous: true, epoch: '2026-03-05T00:00:00Z' } })).join('\n')).toMatch(
      /orbit\.planned\.sunSynchronous: no inclination makes an orbit of semi-major axis 15378 km sun-synchronous/,
    );
  });
});
