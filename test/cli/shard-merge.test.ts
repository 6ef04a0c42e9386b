// One plan three ways gives the same bytes in every output file: on one thread (the
// CLI run in-process from the sources, where runPlanParallel is runPlan), on worker
// threads (the compiled CLI, 10 spacecraft: 2 threads on a machine with 2 cores or more)
// and as 3 shards (`plan --shard K/3`) combined by `passbudget merge`. Scenario: the
// benchmark's invented seeded LEO workload (bench/workload.ts), 10 spacecraft x 4
// stations x 1 day. The compiled program is needed (npm test builds it first).
import { describe, it, expect } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, dirname, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { spawnSync } from 'node:child_process';
import { run } from '../../src/cli/main.js';
import { writeConstellation } from '../../bench/workload.js';
import { fnv1a32, shardOfId } from '../../src/plan/shard.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const distMain = join(root, 'dist', 'src', 'cli', 'main.js');

function listing(dir: string): Map<string, Buffer> {
  const out = new Map<string, Buffer>();
  const walk = (d: string): void => {
    for (const e of readdirSync(d, { withFileTypes: true })) {
      const p = join(d, e.name);
      if (e.isDirectory()) walk(p);
      else out.set(relative(dir, p), readFileSync(p));
    }
  };
  walk(dir);
  return out;
}

function dist(args: string[]): { code: number | null; out: string; err: string } {
  const r = spawnSync(process.execPath, [distMain, ...args], { encoding: 'utf8' });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

describe('single thread, worker threads, shards + merge', () => {
  it('write byte-identical outputs', async () => {
    if (!existsSync(distMain)) throw new Error('build first: npm run build');
    const work = mkdtempSync(join(tmpdir(), 'pb-shard-'));
    const files = writeConstellation(join(work, 'in'), 10, 4, 1);
    // one station hears S band only: a "no feed" warning per spacecraft, whose order the merge must keep
    const network = JSON.parse(readFileSync(files.networkFile, 'utf8')) as { stations: Record<string, unknown>[] };
    network.stations[1]!.feeds = [{ id: 'S-ONLY', band: 'S' }];
    writeFileSync(files.networkFile, JSON.stringify(network));
    const scenarioFlags = ['--spacecraft', files.spacecraftFile, '--network', files.networkFile];
    const single = join(work, 'single');
    let singleOut = '';
    const code = await run(['plan', ...scenarioFlags, '--out', single, '--format', 'csv'], { out: (t) => (singleOut += t), err: () => {}, isTty: false, nowMs: () => 0 });
    expect(code).toBe(0);
    const threads = join(work, 'threads');
    const threadRun = dist(['plan', ...scenarioFlags, '--out', threads, '--format', 'csv']);
    expect(threadRun.code).toBe(0);
    // what the workers rendered reaches stdout too: the CSV and, without files, the JSON
    expect(threadRun.out).toBe(singleOut);
    expect(threadRun.out).toBe(readFileSync(join(single, 'contacts.csv'), 'utf8'));
    const jsonRun = dist(['plan', ...scenarioFlags, '--no-write', '--format', 'json']);
    expect(jsonRun.code).toBe(0);
    expect(jsonRun.out).toBe(readFileSync(join(single, 'plan.json'), 'utf8'));
    const shardDirs: string[] = [];
    for (let k = 1; k <= 3; k++) {
      const d = join(work, `shard-${k}`);
      const r = dist(['plan', ...scenarioFlags, '--shard', `${k}/3`, '--out', d]);
      expect(r.code, r.err).toBe(0);
      expect(readdirSync(d)).toEqual([`shard-${k}-of-3.pbshard`]);
      shardDirs.push(d);
    }
    const merged = join(work, 'merged');
    const m = dist(['merge', ...shardDirs, ...scenarioFlags, '--out', merged, '--format', 'csv']);
    expect(m.code, m.err).toBe(0);
    const a = listing(single);
    expect(a.size).toBeGreaterThan(5);
    const warnings = (JSON.parse(a.get('plan.json')!.toString('utf8')) as { warnings: string[] }).warnings;
    expect(warnings.filter((w) => /^GS-01: no feed covers/.test(w))).toHaveLength(10);
    expect([...a.keys()]).toContain('contacts.jsonl');
    for (const other of [listing(threads), listing(merged)]) {
      expect([...other.keys()].sort()).toEqual([...a.keys()].sort());
      for (const [name, bytes] of a) expect(other.get(name)!.equals(bytes), `${name} differs`).toBe(true);
    }
  }, 120_000);

  it('merge refuses a missing shard and a shard of another span, naming the file (exit 2)', () => {
    const work = mkdtempSync(join(tmpdir(), 'pb-shard-bad-'));
    const files = writeConstellation(join(work, 'in'), 3, 2, 0.25);
    const flags = ['--spacecraft', files.spacecraftFile, '--network', files.networkFile];
    expect(dist(['plan', ...flags, '--shard', '1/2', '--out', join(work, 's1')]).code).toBe(0);
    const missing = dist(['merge', join(work, 's1'), ...flags, '--no-write']);
    expect(missing.code).toBe(2);
    expect(missing.err).toMatch(/shard-1-of-2\.pbshard: shard: shard 2 of 2 missing; merge needs all 2/);
    const span = dist(['merge', join(work, 's1'), ...flags, '--days', '1', '--no-write']);
    expect(span.err).toMatch(/shard-1-of-2\.pbshard: span: planned .* merge was given/);
    writeFileSync(join(work, 'shard-1-of-1.pbshard'), 'not a shard\n');
    const junk = dist(['merge', join(work, 'shard-1-of-1.pbshard'), ...flags, '--no-write']);
    expect(junk.code).toBe(2);
    expect(junk.err).toMatch(/^error: .*shard-1-of-1\.pbshard: is not a shard file/);
    expect(dist(['plan', ...flags, '--shard', '3/2', '--no-write']).err).toMatch(/^error: --shard: "3\/2" must be K\/N/);
  }, 60_000);

  it('plan --booking and merge --booking of the shards write byte-identical outputs (demo day: Sun outage, booking files)', () => {
    if (!existsSync(distMain)) throw new Error('build first: npm run build');
    const work = mkdtempSync(join(tmpdir(), 'pb-shard-booking-'));
    const span = ['--from', '2026-03-05T00:00:00Z', '--days', '1'];
    const booking = ['--booking', join(root, 'stations', 'demo-booking.yaml')];
    const single = join(work, 'single');
    expect(dist(['plan', ...span, ...booking, '--out', single, '--format', 'csv']).code).toBe(0);
    const shardDirs = [1, 2].map((k) => join(work, `shard-${k}`));
    shardDirs.forEach((d, i) => expect(dist(['plan', ...span, '--shard', `${i + 1}/2`, '--out', d]).code).toBe(0));
    expect(dist(['plan', ...span, ...booking, '--shard', '1/2', '--out', join(work, 'refused')]).code).toBe(2);
    const merged = join(work, 'merged');
    const m = dist(['merge', ...shardDirs, ...span, ...booking, '--out', merged, '--format', 'csv']);
    expect(m.code, m.err).toBe(0);
    const a = listing(single);
    for (const f of ['booking.csv', 'requirements.csv', 'sun-outages.csv']) expect([...a.keys()]).toContain(f);
    expect(a.get('sun-outages.csv')!.toString('utf8').trim().split('\n').length).toBeGreaterThan(1);
    const b = listing(merged);
    expect([...b.keys()].sort()).toEqual([...a.keys()].sort());
    for (const [name, bytes] of a) expect(b.get(name)!.equals(bytes), `${name} differs`).toBe(true);
  }, 120_000);

  it('assigns shards by FNV-1a of the id (reference values of the FNV test suite)', () => {
    // FNV-1a 32-bit reference hashes (Fowler/Noll/Vo test vectors): "" and "a", "foobar"
    expect(fnv1a32('')).toBe(0x811c9dc5);
    expect(fnv1a32('a')).toBe(0xe40c292c);
    expect(fnv1a32('foobar')).toBe(0xbf9cf968);
    expect(shardOfId('a', 4)).toBe((0xe40c292c % 4) + 1);
  });
});
