// Golden files: the CLI on the committed demo with its fixed week, diffed byte for
// byte against committed expectations in test/golden/. An intended change of output
// is regenerated with UPDATE_GOLDEN=1 npm test and explained in its commit.
// Also: an interrupted run (SIGTERM mid-write) leaves no partial file.
import { describe, it, expect } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync, mkdirSync, existsSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { spawn } from 'node:child_process';
import { run } from '../../src/cli/main.js';

const here = dirname(fileURLToPath(import.meta.url));
const goldenDir = join(here, '..', 'golden');
const root = join(here, '..', '..');
const update = process.env.UPDATE_GOLDEN === '1';

async function cli(args: string[]): Promise<{ code: number; out: string }> {
  let out = '';
  const code = await run(args, { out: (t) => (out += t), err: () => {}, isTty: false, nowMs: () => 0 });
  return { code, out };
}

function compare(name: string, actual: string): void {
  const path = join(goldenDir, name);
  if (update) {
    mkdirSync(dirname(path), { recursive: true });
    writeFileSync(path, actual);
  }
  expect(existsSync(path), `${path} missing: run UPDATE_GOLDEN=1 npm test`).toBe(true);
  const expected = readFileSync(path, 'utf8');
  expect(actual === expected, `${name} differs from its golden file`).toBe(true);
}

describe('golden files on the demo week', () => {
  it('plan: plan.json, contacts.csv, daily.csv, sun-outages.csv', async () => {
    const out = mkdtempSync(join(tmpdir(), 'pb-golden-plan-'));
    const r = await cli(['plan', '--out', out]);
    expect(r.code).toBe(0);
    for (const f of ['plan.json', 'contacts.csv', 'daily.csv', 'sun-outages.csv']) compare(`plan/${f}`, readFileSync(join(out, f), 'utf8'));
    // contacts.jsonl: line i is plan.json's contacts[i], compact (jsonlines.org: one JSON value per line)
    const lines = readFileSync(join(out, 'contacts.jsonl'), 'utf8').split('\n');
    expect(lines.pop()).toBe('');
    const contacts = (JSON.parse(readFileSync(join(out, 'plan.json'), 'utf8')) as { contacts: unknown[] }).contacts;
    expect(lines).toEqual(contacts.map((c) => JSON.stringify(c)));
  });

  it('margin: margin.json, margin.csv, exit 1 on the failing rows', async () => {
    const out = mkdtempSync(join(tmpdir(), 'pb-golden-margin-'));
    const r = await cli(['margin', '--out', out]);
    expect(r.code).toBe(1);
    for (const f of ['margin.json', 'margin.csv']) compare(`margin/${f}`, readFileSync(join(out, f), 'utf8'));
  });

  it('trace: one pair, one day at 60 s, in contact', async () => {
    const out = mkdtempSync(join(tmpdir(), 'pb-golden-trace-'));
    const r = await cli(['trace', '--spacecraft-id', 'KESTREL-1', '--station-id', 'FRV', '--days', '1', '--step', '60s', '--in-contact', '--out', out]);
    expect(r.code).toBe(0);
    compare('trace/trace.csv', readFileSync(join(out, 'trace.csv'), 'utf8'));
  });
});

describe('interrupted output', () => {
  it('SIGTERM while trace streams a large file leaves neither the file nor a temp file', async () => {
    const out = mkdtempSync(join(tmpdir(), 'pb-kill-'));
    const cliPath = join(root, 'dist', 'src', 'cli', 'main.js');
    if (!existsSync(cliPath)) throw new Error('build first: npm run build (dist/src/cli/main.js is missing)');
    const child = spawn(process.execPath, [cliPath, 'trace', '--step', '1s', '--out', out], { stdio: 'ignore' });
    // wait until the temp file exists and has grown, then interrupt
    const deadline = Date.now() + 30_000;
    let started = false;
    while (Date.now() < deadline) {
      await new Promise((r) => setTimeout(r, 100));
      const temps = readdirSync(out).filter((f) => f.endsWith('.tmp'));
      if (temps.length > 0 && readFileSync(join(out, temps[0]!)).length > 100_000) {
        started = true;
        break;
      }
    }
    expect(started).toBe(true);
    child.kill('SIGTERM');
    const code = await new Promise<number | null>((r) => child.on('exit', (c) => r(c)));
    expect(code).toBe(143);
    expect(readdirSync(out)).toEqual([]);
  });
});
