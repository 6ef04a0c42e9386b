// Failure behaviour (README "Failure behaviour"): every failure is one clear line and a
// meaningful exit code, and an interrupted or failing run never leaves outputs half
// replaced. One table of cases: input, command, expected exit code, expected first
// line, files expected under --out. The thread, pipe, signal and disk cases spawn the
// built CLI (dist/, made by `npm test`'s tsc step); the others call run() in-process.
// The exit codes 130 / 141 / 143 are 128 + the signal number, as POSIX shells report
// a process stopped by SIGINT / SIGPIPE / SIGTERM (common practice).
import { describe, it, expect, afterAll } from 'vitest';
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { run } from '../../src/cli/main.js';
import { withChecksum } from '../../src/scenario/tle.js';
import { hostTag } from '../../src/report/write.js';
import { ModelRangeError, ScenarioError, reviveError, serializeError } from '../../src/errors.js';

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, '..', '..');
const cliPath = join(root, 'dist', 'src', 'cli', 'main.js');
const demoTle = join(root, 'ephemerides', 'demo-fleet.tle');
const demoNetwork = join(root, 'stations', 'demo-network.yaml');
const demoFleet = JSON.parse(readFileSync(join(root, 'ephemerides', 'demo-fleet.json'), 'utf8')) as {
  window: unknown;
  link: unknown;
  spacecraft: Record<string, unknown>[];
};
const version = (JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { version: string }).version;
const STATIONS = ['FRV', 'ALK', 'MDL', 'SAL', 'EQP', 'SCX'];
/** What `plan --days 1` writes on the demo network (no --schedule). */
const PLAN_FILES = ['calendar/', ...STATIONS.map((s) => `calendar/${s}.ics`), 'contacts.csv', 'contacts.ics', 'contacts.jsonl', 'daily.csv', 'plan.json', 'report.html', 'sun-outages.csv'].sort();

// ------------------------------------------------------------------ inputs

type Json = Record<string, unknown>;

/** KESTREL-1 of the demo (its invented TLE by absolute path), changed by `edit`. */
function kestrel(edit: (sc: Json) => void = () => {}): Json {
  const sc = structuredClone(demoFleet.spacecraft[0]!) as Json;
  sc.orbit = { tleFile: demoTle, catalogNumber: 90001 };
  edit(sc);
  return sc;
}
function radio0(sc: Json): Json {
  return (sc.radios as Json[])[0]!;
}
function fleet(spacecraft: Json[], extra: Json = {}): string {
  return JSON.stringify({ window: demoFleet.window, link: demoFleet.link, spacecraft, ...extra }, null, 1);
}
/** An invented TLE (columns as in the demo file) with mean motion and eccentricity replaced, checksums recomputed. */
function tle(cat: string, meanMotion: string, ecc7: string, incl = ' 97.5800', epoch = '26063.50000000'): string {
  const l1 = withChecksum(`1 ${cat}U 26901A   ${epoch}  .00001200  00000+0  72000-4 0  999`);
  const l2 = withChecksum(`2 ${cat} ${incl} 138.2000 ${ecc7}  90.0000 270.1000 ${meanMotion}12006`);
  return `${l1}\n${l2}\n`;
}
const demoYaml = readFileSync(demoNetwork, 'utf8');
const petrelOmm = readFileSync(join(root, 'ephemerides', 'petrel-3.omm'), 'utf8');

// ------------------------------------------------------------------ machine abilities

/** A tiny tmpfs can be mounted here (root in a container that allows it). */
function canMountTmpfs(): boolean {
  const probe = mkdtempSync(join(tmpdir(), 'pb-mount-probe-'));
  try {
    execFileSync('mount', ['-t', 'tmpfs', '-o', 'size=64k', 'tmpfs', probe], { stdio: 'ignore' });
    execFileSync('umount', [probe], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  } finally {
    rmSync(probe, { recursive: true, force: true });
  }
}
const TMPFS = canMountTmpfs();
const NO_TMPFS = 'cannot mount a tmpfs here (needs root and a mount-capable container): full-disk and read-only cases skipped';
const mounted: string[] = [];
function mountTmpfs(path: string, options: string): void {
  mkdirSync(path, { recursive: true });
  execFileSync('mount', ['-t', 'tmpfs', '-o', options, 'tmpfs', path]);
  mounted.push(path);
}
afterAll(() => {
  for (const m of mounted.reverse()) spawnSync('umount', [m]);
});

// ------------------------------------------------------------------ running

interface Result {
  code: number;
  out: string;
  err: string;
}

async function inProcess(args: string[]): Promise<Result> {
  let out = '';
  let err = '';
  const code = await run(args, { out: (t) => (out += t), err: (t) => (err += t), isTty: false, nowMs: () => Date.UTC(2026, 2, 5) });
  return { code, out, err };
}

type Spawn = { kind: 'plain' } | { kind: 'stdout-closed' } | { kind: 'signal'; signal: NodeJS.Signals; afterMs: number };

function spawned(args: string[], how: Spawn, cwd: string): Promise<Result> {
  if (!existsSync(cliPath)) throw new Error('build first: npm run build (dist/src/cli/main.js is missing)');
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [cliPath, ...args], { cwd, stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    child.stdout.setEncoding('utf8').on('data', (t: string) => (out += t));
    child.stderr.setEncoding('utf8').on('data', (t: string) => (err += t));
    // the reader goes away before the first byte: the child's first write meets EPIPE
    if (how.kind === 'stdout-closed') child.stdout.destroy();
    if (how.kind === 'signal') setTimeout(() => child.kill(how.signal), how.afterMs);
    child.on('close', (code, signal) => resolve({ code: code ?? 128 + (signal === 'SIGINT' ? 2 : signal === 'SIGTERM' ? 15 : 9), out, err }));
  });
}

/** Every entry under `dir`, relative, sorted; folders end in "/" (dot files included: temp files show). */
function listing(dir: string): string[] {
  if (!existsSync(dir)) return [];
  const out: string[] = [];
  const walk = (d: string, rel: string): void => {
    for (const e of readdirSync(d, { withFileTypes: true })) {
      if (e.isDirectory()) {
        out.push(`${rel}${e.name}/`);
        walk(join(d, e.name), `${rel}${e.name}/`);
      } else out.push(`${rel}${e.name}`);
    }
  };
  walk(dir, '');
  return out.sort();
}

// ------------------------------------------------------------------ the table

interface Ctx {
  /** Scratch folder of the case (also the child's working folder). */
  dir: string;
  /** The --out folder of the case. */
  out: string;
  /** Paths of the input files the case wrote. */
  files: Record<string, string>;
}

interface Case {
  item: string;
  what: string;
  /** Input files to write: name -> content (string or bytes). */
  input?: Record<string, string | Buffer>;
  /** Prepares the --out folder before the run (previous outputs, mounts, stale temps). */
  before?: (ctx: Ctx) => void | Promise<void>;
  command: (ctx: Ctx) => string[];
  spawn?: Spawn;
  exit: number;
  /** First line of stderr (of stdout with `stream: 'out'`). */
  first: RegExp;
  stream?: 'out' | 'err';
  /** Entries expected under --out afterwards (see listing()); undefined: not checked. */
  files?: string[];
  more?: (r: Result, ctx: Ctx) => void;
  skip?: string;
}

const PREVIOUS = 'previous output\n';
/** An --out holding a previous plan.json whose content must survive the case. */
const previousPlan = (ctx: Ctx): void => {
  mkdirSync(ctx.out, { recursive: true });
  writeFileSync(join(ctx.out, 'plan.json'), PREVIOUS);
};
const keptPrevious = (_r: Result, ctx: Ctx): void => {
  expect(readFileSync(join(ctx.out, 'plan.json'), 'utf8')).toBe(PREVIOUS);
};
const net = ['--network', demoNetwork];

const cases: Case[] = [
  // 1. errors inside worker threads keep their class
  {
    item: '1',
    what: '8 spacecraft (2 worker threads), one radio at 60 GHz with rain: one line naming file and field, exit 2',
    input: { 'fleet.json': fleet([...Array.from({ length: 7 }, (_, i) => kestrel((sc) => (sc.id = `K${i}`))), kestrel((sc) => ((sc.id = 'K7'), (radio0(sc).frequencyMHz = 60_000)))]) },
    command: (c) => ['plan', '--spacecraft', c.files['fleet.json']!, ...net, '--days', '1', '--out', c.out],
    spawn: { kind: 'plain' },
    exit: 2,
    first: /^error: .*fleet\.json: spacecraft\[7\]\.radios\[0\]\.frequencyMHz: ITU-R P\.618-14 rain: .*60 is outside its valid range \(1\.\.55 GHz\)/,
    files: [],
    more: (r) => expect(r.err.trim().split('\n')).toHaveLength(1),
  },
  // 2. a closed stdout, for every command: quiet, exit 141
  ...(
    [
      ['plan', ['plan', '--days', '1', '--no-write']],
      ['trace', ['trace', '--days', '1', '--no-write']],
      ['check', ['check']],
      ['budget', ['budget', '--spacecraft-id', 'KESTREL-1', '--station-id', 'FRV', '--elevation', '10']],
    ] as const
  ).map(
    ([name, args]): Case => ({
      item: '2',
      what: `${name} with its stdout closed by the reader: ends quietly, exit 141`,
      command: () => [...args],
      spawn: { kind: 'stdout-closed' },
      exit: 141,
      first: /^$/,
      more: (r) => expect(r.err).toBe(''),
    }),
  ),
  // 3. output folder problems: checked before the work; all-or-nothing writes
  {
    item: '3',
    what: '--out is a file',
    before: (c) => writeFileSync(c.out, 'a file'),
    command: (c) => ['plan', '--days', '1', '--out', c.out],
    exit: 2,
    first: /^error: .*out: is a file, not a folder/,
    more: (r) => expect(r.out).toBe(''), // refused before the plan was printed
  },
  {
    item: '3',
    what: '--out sits under a file',
    before: (c) => writeFileSync(c.out, 'a file'),
    command: (c) => ['plan', '--days', '1', '--out', join(c.out, 'sub')],
    exit: 2,
    first: /^error: .*out\/sub: sits under .*out, which is a file, not a folder/,
    more: (r) => expect(r.out).toBe(''),
  },
  {
    item: '3',
    what: 'a name the run writes is taken by a folder (mkdir -p out/contacts.csv): refused before the work, nothing replaced',
    before: (c) => {
      previousPlan(c);
      mkdirSync(join(c.out, 'contacts.csv'));
    },
    command: (c) => ['plan', '--days', '1', '--out', c.out],
    exit: 2,
    first: /^error: .*out\/contacts\.csv: is a folder; the run writes a file of that name there/,
    files: ['contacts.csv/', 'plan.json'],
    more: keptPrevious,
  },
  {
    item: '3',
    what: 'a rename that fails part-way (calendar/FRV.ics is a folder): the previous outputs stay, every temp file removed',
    before: (c) => {
      previousPlan(c);
      mkdirSync(join(c.out, 'calendar', 'FRV.ics'), { recursive: true });
    },
    command: (c) => ['plan', '--days', '1', '--out', c.out],
    exit: 2,
    first: /^error: .*out\/calendar\/FRV\.ics: is a folder, not replaced by the output file; nothing was replaced \(temp files removed\)/,
    files: ['calendar/', 'calendar/FRV.ics/', 'plan.json'],
    more: keptPrevious,
  },
  {
    item: '3',
    what: 'read-only --out (a read-only tmpfs): refused before the work',
    before: (c) => mountTmpfs(c.out, 'size=64k,ro'),
    command: (c) => ['plan', '--days', '1', '--out', join(c.out, 'x')],
    exit: 2,
    first: /^error: .*out: is on a read-only file system: the output folder cannot be written/,
    files: [],
    more: (r) => expect(r.out).toBe(''),
    ...(TMPFS ? {} : { skip: NO_TMPFS }),
  },
  {
    item: '3',
    what: 'plan on a full disk (300 KiB tmpfs): one line naming the file, the previous plan.json kept, no temp file',
    before: (c) => {
      mountTmpfs(c.out, 'size=300k');
      writeFileSync(join(c.out, 'plan.json'), PREVIOUS);
    },
    command: (c) => ['plan', '--days', '2', '--out', c.out],
    spawn: { kind: 'plain' },
    exit: 2,
    first: /^error: .*out\/.*: no space left on the device while writing; nothing was replaced \(temp files removed\)/,
    files: ['plan.json'],
    more: keptPrevious,
    ...(TMPFS ? {} : { skip: NO_TMPFS }),
  },
  {
    item: '3',
    what: 'trace on a full disk (1 MiB tmpfs): says which path has no space left, no temp file',
    before: (c) => mountTmpfs(c.out, 'size=1m'),
    command: (c) => ['trace', '--days', '1', '--out', c.out],
    spawn: { kind: 'plain' },
    exit: 2,
    first: /^error: .*out\/trace\.csv: no space left on the device while writing/,
    files: [],
    ...(TMPFS ? {} : { skip: NO_TMPFS }),
  },
  // 4. XML with a DOCTYPE / entity declarations
  {
    item: '4',
    what: 'OMM XML with an external entity',
    input: {
      'fleet.json': fleet([kestrel((sc) => (sc.orbit = { ommFile: 'x.xml' }))]),
      'x.xml': '<?xml version="1.0"?>\n<!DOCTYPE ndm [ <!ENTITY e SYSTEM "file:///etc/hostname"> ]>\n<ndm><omm>&e;</omm></ndm>\n',
    },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 2,
    first: /^error: .*x\.xml: OMM XML: line 2: a <!DOCTYPE declaration; valid: an NDM\/XML document without document type or entity declarations/,
  },
  {
    item: '4',
    what: 'OMM XML with an entity of 20,000 characters',
    input: {
      'fleet.json': fleet([kestrel((sc) => (sc.orbit = { ommFile: 'big.xml' }))]),
      'big.xml': `<?xml version="1.0"?>\n<!DOCTYPE omm [ <!ENTITY big "${'x'.repeat(20_000)}"> ]>\n<omm>&big;</omm>\n`,
    },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 2,
    first: /^error: .*big\.xml: OMM XML: line 2: a <!DOCTYPE declaration/,
  },
  // 5. caps on the problems printed and on nesting depth
  {
    item: '5',
    what: 'a 400,000-line junk TLE file: 50 problems printed, then how many more',
    input: {
      'fleet.json': fleet([kestrel((sc) => (sc.orbit = { tleFile: 'junk.tle' }))]),
      'junk.tle': Array.from({ length: 400_000 }, (_, i) => `junk ${i}`).join('\n'),
    },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 2,
    first: /^error: .*junk\.tle: set 1 "junk 0": line 1 missing after the name line/,
    more: (r) => {
      const lines = r.err.trim().split('\n');
      expect(lines).toHaveLength(51);
      expect(lines[50]).toBe('error: ... and 399950 more problems (400000 in all; the first 50 are shown)');
    },
  },
  {
    item: '5',
    what: '40,000 empty stations',
    input: { 'net.json': JSON.stringify({ stations: Array.from({ length: 40_000 }, () => ({})) }) },
    command: (c) => ['check', '--network', c.files['net.json']!],
    exit: 2,
    first: /^error: .*net\.json: stations\[0\]\.id: is required/,
    more: (r) => expect(r.err.trim().split('\n')).toHaveLength(51),
  },
  {
    item: '5',
    what: 'JSON nested 20,000 levels deep in a numeric field',
    input: { 'fleet.json': fleet([kestrel()]).replace('"powerW": 2', `"powerW": ${'['.repeat(20_000)}2${']'.repeat(20_000)}`) },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 2,
    first: /^error: .*fleet\.json: nests arrays and objects more than 32 levels deep \(line \d+\); valid: at most 32 levels$/,
  },
  {
    item: '5',
    what: 'an inline omm nested 20,000 levels deep (YAML flow)',
    input: { 'fleet.yaml': `spacecraft:\n  - id: A\n    orbit:\n      omm: ${'{a: '.repeat(20_000)}1${'}'.repeat(20_000)}\n` },
    command: (c) => ['check', '--spacecraft', c.files['fleet.yaml']!, ...net],
    exit: 2,
    first: /^error: .*fleet\.yaml: nests arrays and objects more than 32 levels deep/,
  },
  {
    item: '5',
    what: 'a horizon of 5,000 points (spread into Math.min before): bounded at 3,600',
    input: { 'net.yaml': demoYaml.replace('- [0, 3.0]', Array.from({ length: 5000 }, (_, i) => `- [${(i * 0.07).toFixed(2)}, 3.0]`).join('\n      ')) },
    command: (c) => ['check', '--network', c.files['net.yaml']!],
    exit: 2,
    first: /^error: .*net\.yaml: stations\[0\]\.horizon: has more than 3600 points/,
  },
  // 6. signals stop plan at once; element sets far from the window
  {
    item: '6',
    what: 'SIGINT during plan (--step 1s): stopped, the previous plan.json kept, nothing new, exit 130',
    before: previousPlan,
    command: (c) => ['plan', '--step', '1s', '--out', c.out],
    spawn: { kind: 'signal', signal: 'SIGINT', afterMs: 700 },
    exit: 130,
    first: /^$|^interrupted \(SIGINT\): stopped; no output was written or replaced$/,
    files: ['plan.json'],
    more: keptPrevious,
  },
  {
    item: '6',
    what: 'SIGTERM during plan with 8 spacecraft (worker threads): stopped, nothing written, exit 143',
    input: { 'fleet.json': fleet(Array.from({ length: 8 }, (_, i) => kestrel((sc) => (sc.id = `K${i}`)))) },
    command: (c) => ['plan', '--spacecraft', c.files['fleet.json']!, ...net, '--step', '1s', '--out', c.out],
    spawn: { kind: 'signal', signal: 'SIGTERM', afterMs: 700 },
    exit: 143,
    // empty when the signal lands before the handlers are installed (a loaded machine): Node's default action, still exit 143 and nothing written
    first: /^$|^terminated \(SIGTERM\): stopped; no output was written or replaced$/,
    files: [],
  },
  {
    item: '6',
    what: 'a window 70 years after the element sets: refused (limit 365 days), before any propagation',
    command: () => ['plan', '--from', '2096-01-01T00:00:00Z', '--days', '2', '--no-write'],
    exit: 2,
    first: /^error: .*demo-fleet\.json: spacecraft\[0\]\.orbit: the element set nearest .* is \d+ days from it; valid: an element set within 365 days of every part of the window/,
  },
  // 7. check runs plan's model-range checks and prints plan's warnings
  ...(
    [
      [150, /ITU-R P\.618-14 rain: frequencyHz\/1e9 = 0\.15 is outside its valid range/],
      [60_000, /ITU-R P\.618-14 rain: frequencyHz\/1e9 = 60 is outside/],
      [300_000, /frequencyHz\/1e9 = 300 is outside/],
    ] as const
  ).map(
    ([mhz, model]): Case => ({
      item: '7',
      what: `check: a radio at ${mhz} MHz names file and field`,
      input: { 'fleet.json': fleet([kestrel((sc) => (radio0(sc).frequencyMHz = mhz))]) },
      command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
      exit: 2,
      first: new RegExp(`^error: .*fleet\\.json: spacecraft\\[0\\]\\.radios\\[0\\]\\.frequencyMHz: .*${model.source}`),
    }),
  ),
  {
    item: '7',
    what: 'check: a sky range of 5,000 km',
    input: { 'fleet.json': fleet([kestrel((sc) => (sc.orbit = { sky: { rightAscensionDeg: 10, declinationDeg: 5, rangeKm: 5000 } }))]) },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 2,
    first: /^error: .*fleet\.json: spacecraft\[0\]\.orbit\.sky\.rangeKm: .*rangeKm = 5000 is outside its valid range \(>= 10000 km\)/,
  },
  {
    item: '7',
    what: 'check: a 500 m dish',
    input: { 'net.yaml': demoYaml.replace('dishDiameterM: 7.3', 'dishDiameterM: 500') },
    command: (c) => ['check', '--network', c.files['net.yaml']!],
    exit: 2,
    first: /^error: .*net\.yaml: stations\[0\]\.antenna: .*antennaDiameterM = 500 is outside its valid range/,
  },
  {
    item: '7',
    what: 'check: a horizon whose 0 and 360 deg points differ',
    input: { 'net.yaml': demoYaml.replace('- [0, 3.0]', '- [0, 3.0]\n      - [360, 4.0]') },
    command: (c) => ['check', '--network', c.files['net.yaml']!],
    exit: 2,
    first: /^error: .*net\.yaml: stations\[0\]\.horizon: \[0, 3\] and \[360, 4\] are the same azimuth with different elevations/,
  },
  {
    item: '7',
    what: "check prints plan's warnings: no rain climate above 3 GHz, element sets older than 14 days",
    input: {
      'fleet.json': fleet([kestrel()], { window: { from: '2026-05-01T00:00:00Z', days: 1 } }),
      'net.yaml': demoYaml.replace(/\n {4}climate: \{ rainRate001MmH: 24, rainHeightKm: 2\.1, /, '\n    climate: { '),
    },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, '--network', c.files['net.yaml']!],
    exit: 0,
    stream: 'err',
    first: /^warning: KESTREL-1: .*element set epoch 2026-03-04T12:00:00\.000Z is 5\d\.\d days from .* \(limit 14 days\)/,
    more: (r) => {
      // the rain climate left out is now read from the ITU-R maps (P.837-7, P.839-4): no "no rain climate" warning
      expect(r.err).not.toMatch(/no rain climate/);
      expect(r.out).toMatch(/^ok: /);
    },
  },
  // 8. orbits inside the Earth
  {
    item: '8',
    what: 'a sub-orbital TLE (17.5 rev/day)',
    input: { 'fleet.json': fleet([kestrel((sc) => (sc.orbit = { tle: tle('90009', '17.50000000', '0001200') }))]) },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 2,
    first: /^error: .*fleet\.json: spacecraft\[0\]\.orbit\.tle: element set .*catalogue 90009\): mean motion 17\.5 rev\/day .* puts the perigee at -\d+ km \(inside the Earth\); valid: a perigee at least 100 km above/,
  },
  {
    item: '8',
    what: 'an OMM with e = 0.9999999',
    input: {
      'fleet.json': fleet([
        kestrel(
          (sc) =>
            (sc.orbit = {
              omm: {
                OBJECT_NAME: 'X', OBJECT_ID: '2026-901A', EPOCH: '2026-03-04T00:00:00', MEAN_MOTION: 2.0, ECCENTRICITY: 0.9999999,
                INCLINATION: 10, RA_OF_ASC_NODE: 0, ARG_OF_PERICENTER: 0, MEAN_ANOMALY: 0, NORAD_CAT_ID: 90010, BSTAR: 0,
                MEAN_MOTION_DOT: 0, MEAN_MOTION_DDOT: 0,
              },
            }),
        ),
      ]),
    },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 2,
    first: /^error: .*fleet\.json: spacecraft\[0\]\.orbit\.omm: element set .*eccentricity 0\.9999999 puts the perigee at -\d+ km \(inside the Earth\)/,
  },
  // 9. dates bounded at parsing
  {
    item: '9',
    what: '--from +275760-09-13T00:00:00Z',
    command: () => ['plan', '--from', '+275760-09-13T00:00:00Z', '--no-write'],
    exit: 2,
    first: /^error: --from: "\+275760-09-13T00:00:00Z" is not an ISO 8601 time from 1957-01-01 to 2099-12-31/,
  },
  {
    item: '9',
    what: '--from 9999-12-31 (the run that never finished)',
    command: () => ['plan', '--from', '9999-12-31T00:00:00Z', '--days', '2', '--no-write'],
    exit: 2,
    first: /^error: --from: "9999-12-31T00:00:00Z" is not an ISO 8601 time from 1957-01-01 to 2099-12-31/,
  },
  {
    item: '9',
    what: 'window.from in 1900 in the file',
    input: { 'fleet.json': fleet([kestrel()], { window: { from: '1900-01-01T00:00:00Z', days: 1 } }) },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 2,
    first: /^error: .*fleet\.json: window\.from: "1900-01-01T00:00:00Z" is not an ISO 8601 time from 1957-01-01 to 2099-12-31/,
  },
  // 10. NaN, Infinity and 1e400 quoted as written
  {
    item: '10',
    what: 'JSON powerW 1e400',
    input: { 'fleet.json': fleet([kestrel()]).replace('"powerW": 2', '"powerW": 1e400') },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 2,
    first: /^error: .*fleet\.json: spacecraft\[0\]\.radios\[0\]\.powerW: 1e400 must be a number$/,
  },
  {
    item: '10',
    what: 'YAML latitude .nan and height .inf',
    input: { 'net.yaml': demoYaml.replace('latitudeDeg: 70.31', 'latitudeDeg: .nan').replace('heightM: 60', 'heightM: -.inf') },
    command: (c) => ['check', '--network', c.files['net.yaml']!],
    exit: 2,
    first: /^error: .*net\.yaml: stations\[0\]\.latitudeDeg: \.nan /,
    more: (r) => {
      expect(r.err).toMatch(/stations\[0\]\.heightM: -\.inf /);
      expect(r.err).not.toMatch(/null/);
    },
  },
  // 11. all problems at once
  {
    item: '11',
    what: 'window.from "yesterday" with window.days 0 and powerW -5: all three in one pass',
    input: { 'fleet.json': fleet([kestrel((sc) => (radio0(sc).powerW = -5))], { window: { from: 'yesterday', days: 0 } }) },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 2,
    first: /^error: .*fleet\.json: window\.days: 0 is outside 0\.001\.\.366$/,
    more: (r) => {
      expect(r.err).toMatch(/spacecraft\[0\]\.radios\[0\]\.powerW: -5 must be > 0/);
      expect(r.err).toMatch(/window\.from: "yesterday" is not an ISO 8601 time/);
    },
  },
  {
    item: '11',
    what: 'a bad field in one spacecraft and a bad TLE checksum in another: both',
    input: {
      'fleet.json': fleet([
        kestrel((sc) => (radio0(sc).powerW = -5)),
        kestrel((sc) => ((sc.id = 'B'), (sc.orbit = { tle: tle('90009', '15.05500000', '0001200').replace(/\d\n/, (m) => `${(Number(m[0]) + 1) % 10}\n`) }))),
      ]),
    },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 2,
    first: /^error: .*powerW: -5 must be > 0/,
    more: (r) => expect(r.err).toMatch(/spacecraft\[1\]\.orbit\.tle: line 1 of set 1 .*checksum \(column 69\)/),
  },
  // 12. one catalogue number and epoch, two element sets
  {
    item: '12',
    what: 'two different sets with the same catalogue number and epoch: both line numbers',
    input: { 'fleet.json': fleet([kestrel((sc) => (sc.orbit = { tle: tle('90009', '15.05500000', '0001200') + tle('90009', '15.05500000', '0001200', ' 97.6000') }))]) },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 2,
    first: /^error: .*fleet\.json: spacecraft\[0\]\.orbit\.tle: set 2 \(line 3 of the text\) and set 1 \(line 1 of the text\) have the same catalogue number 90009 and epoch but different elements/,
  },
  {
    item: '12',
    what: 'the same in an OMM KVN file: both EPOCH lines',
    input: {
      'fleet.json': fleet([kestrel((sc) => (sc.orbit = { ommFile: 'dup.omm' }))]),
      'dup.omm': `${petrelOmm}\n${petrelOmm.replace('INCLINATION = 87.9000', 'INCLINATION = 88.0000')}`,
    },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 2,
    first: /^error: .*dup\.omm: OMM KVN: message 2 \(EPOCH at line 41\) and message 1 \(EPOCH at line 13\) have the same NORAD_CAT_ID 90003 and EPOCH but different elements/,
  },
  // 13. a byte-order mark
  {
    item: '13',
    what: 'a UTF-8 BOM in the scenario JSON is accepted',
    input: { 'fleet.json': `\uFEFF${fleet([kestrel()])}` },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 0,
    stream: 'out',
    first: /^ok: .*fleet\.json: 1 spacecraft, 1 element set, 1 radio$/,
  },
  // 14. stale temp files of dead processes
  {
    item: '14',
    what: 'trace killed with SIGKILL mid-write, then plan into the same folder: the stale temp is removed and said',
    before: async (c) => {
      mkdirSync(c.out, { recursive: true });
      const child = spawn(process.execPath, [cliPath, 'trace', '--days', '2', '--step', '1s', '--out', c.out], { stdio: 'ignore' });
      const deadline = Date.now() + 30_000;
      while (Date.now() < deadline && !readdirSync(c.out).some((f) => f.endsWith('.tmp') && statSync(join(c.out, f)).size > 10_000)) {
        await new Promise((r) => setTimeout(r, 50));
      }
      child.kill('SIGKILL');
      await new Promise((r) => child.on('close', r));
      const left = readdirSync(c.out);
      // the temp name says which run made it: host, pid, start
      expect(left).toEqual([expect.stringMatching(new RegExp(`^\\.trace\\.csv\\.passbudget-${hostTag()}-${child.pid}-[0-9a-z]+\\.tmp$`))]);
      // and one of a process that still runs (this one) is left alone
      writeFileSync(join(c.out, `.daily.csv.passbudget-${hostTag()}-${process.pid}-abc.tmp`), 'x');
    },
    command: (c) => ['plan', '--days', '1', '--out', c.out],
    exit: 0,
    stream: 'err',
    first: /^note: removed 1 temp file left in .*out by stopped run \(pid \d+\)$/,
    files: [...PLAN_FILES, `.daily.csv.passbudget-${hostTag()}-${process.pid}-abc.tmp`].sort(),
  },
  // 15. --version
  { item: '15', what: '--version', command: () => ['--version'], exit: 0, stream: 'out', first: new RegExp(`^${version.replace(/\./g, '\\.')}$`) },
  { item: '15', what: '-V', command: () => ['-V'], exit: 0, stream: 'out', first: new RegExp(`^${version.replace(/\./g, '\\.')}$`) },
  // also seen: decided and documented (README "Failure behaviour")
  {
    item: 'also',
    what: '--days 0x10: decimal only',
    command: () => ['plan', '--days', '0x10', '--no-write'],
    exit: 2,
    first: /^error: --days: "0x10" must be a number of days in \(0, 366\]$/,
  },
  {
    item: 'also',
    what: '--elevation 0x10 (budget): decimal only',
    command: () => ['budget', '--spacecraft-id', 'KESTREL-1', '--station-id', 'FRV', '--elevation', '0x10'],
    exit: 2,
    first: /^error: --elevation: "0x10" must be a number in 0\.\.90$/,
  },
  { item: 'also', what: '--out ""', command: () => ['plan', '--days', '1', '--out', ''], exit: 2, first: /^error: --out: "" is empty/ },
  {
    item: 'also',
    what: 'a binary file as the TLE file: one line',
    input: {
      'fleet.json': fleet([kestrel((sc) => (sc.orbit = { tleFile: 'bin.tle' }))]),
      'bin.tle': Buffer.from(Array.from({ length: 20_000 }, (_, i) => (i * 7919) % 256)),
    },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 2,
    first: /^error: .*bin\.tle: is not a text file: line 1 holds a NUL byte \(reading stopped there\); valid: a UTF-8 text file/,
    more: (r) => expect(r.err.trim().split('\n')).toHaveLength(1),
  },
  {
    item: 'also',
    what: 'a TLE path to some other text file: only its first offending line is quoted, cut at 80 characters',
    input: {
      'fleet.json': fleet([kestrel((sc) => (sc.orbit = { tleFile: 'other.txt' }))]),
      'other.txt': Array.from({ length: 30 }, (_, i) => `secret-${i}:${'z'.repeat(100)}`).join('\n'),
    },
    command: (c) => ['check', '--spacecraft', c.files['fleet.json']!, ...net],
    exit: 2,
    first: /^error: .*other\.txt: set 1: line 1 of the text \("secret-0:z+\.\.\."\) is not a TLE line/,
    more: (r) => {
      expect(r.err.trim().split('\n')).toHaveLength(15); // one per pair of lines
      expect(r.err.match(/secret-/g)).toHaveLength(1); // its first line only, nothing after
      expect(r.err).not.toMatch(/z{81}/);
    },
  },
];

describe('failure behaviour: one line, a meaningful exit code, outputs never half replaced', () => {
  for (const c of cases) {
    it.skipIf(c.skip !== undefined)(`${c.item}. ${c.what}${c.skip ? ` (skipped: ${c.skip})` : ''}`, { timeout: 60_000 }, async () => {
      const dir = mkdtempSync(join(tmpdir(), 'pb-fail-'));
      const ctx: Ctx = { dir, out: join(dir, 'out'), files: {} };
      for (const [name, content] of Object.entries(c.input ?? {})) {
        ctx.files[name] = join(dir, name);
        writeFileSync(ctx.files[name]!, content);
      }
      await c.before?.(ctx);
      const args = c.command(ctx);
      const r = c.spawn ? await spawned(args, c.spawn, dir) : await inProcess(args);
      const text = (c.stream ?? (c.exit === 0 ? 'out' : 'err')) === 'out' ? r.out : r.err;
      expect(r.code, `exit code; stderr: ${r.err.slice(0, 500)}`).toBe(c.exit);
      expect(text.split('\n')[0]).toMatch(c.first);
      // never a stack trace, never a raw JS error name
      expect(r.err).not.toMatch(/^\s+at .+:\d+:\d+\)?$/m);
      expect(r.err).not.toMatch(/\b(RangeError|TypeError|AbortError|Error \[)/);
      if (c.files !== undefined) expect(listing(ctx.out)).toEqual(c.files);
      c.more?.(r, ctx);
    });
  }
});

describe('errors cross the worker-thread boundary as data', () => {
  it('serializeError / reviveError give back the class and its fields', () => {
    const s = reviveError(structuredClone(serializeError(new ScenarioError([{ file: 'f.json', path: 'a[0]', message: 'bad' }]))));
    expect(s).toBeInstanceOf(ScenarioError);
    expect((s as ScenarioError).problems).toEqual([{ file: 'f.json', path: 'a[0]', message: 'bad' }]);
    const m = reviveError(structuredClone(serializeError(new ModelRangeError('ITU-R P.618-14 rain', 'f', 60, '1..55 GHz'))));
    expect(m).toBeInstanceOf(ModelRangeError);
    expect(m.message).toBe('ITU-R P.618-14 rain: f = 60 is outside its valid range (1..55 GHz)');
    const bug = reviveError(structuredClone(serializeError(new TypeError('x is undefined'))));
    expect(bug).not.toBeInstanceOf(ScenarioError);
    expect(bug.name).toBe('TypeError');
  });
});
