/**
 * Benchmark of the whole program as a user runs it: `passbudget plan` started as its own
 * process on invented, seeded scenario files (bench/workload.ts), every output written to
 * a temp folder. Prints wall time, peak RSS of the process (worker threads included),
 * contacts, link samples, SGP4 calls (from `plan --stats`) and the bytes of every file.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { writeConstellation, writeMixed, type WorkloadFiles } from './workload.js';

const MAIN = fileURLToPath(new URL('../src/cli/main.js', import.meta.url));
const PROBE = new URL('./rss-probe.js', import.meta.url).href;

export interface CliFigures {
  label: string;
  wallS: number;
  peakRssMb: number;
  /** CPU time of the process, all threads, s (a fairer figure than wall time on a shared machine). */
  cpuS: number;
  exitCode: number | null;
  stats: { contacts: number; linkSamples: number; propagations: number } | undefined;
  files: { name: string; bytes: number }[];
  stderrTail: string;
}

function filesUnder(dir: string): { name: string; bytes: number }[] {
  const out: { name: string; bytes: number }[] = [];
  const walk = (d: string): void => {
    for (const e of readdirSync(d, { withFileTypes: true })) {
      const p = join(d, e.name);
      if (e.isDirectory()) walk(p);
      else out.push({ name: relative(dir, p), bytes: statSync(p).size });
    }
  };
  walk(dir);
  return out.sort((a, b) => a.name.localeCompare(b.name));
}

/** Runs `passbudget plan` on the files with extra flags; outputs go to a fresh temp folder (removed after). */
export function runCliPlan(label: string, files: WorkloadFiles | undefined, extra: string[] = []): CliFigures {
  const work = mkdtempSync(join(tmpdir(), 'passbudget-bench-'));
  const outDir = join(work, 'out');
  const rssFile = join(work, 'rss');
  const args = ['--import', PROBE, MAIN, 'plan', '--out', outDir, '--format', 'csv', '--stats', ...extra];
  if (files) args.push('--spacecraft', files.spacecraftFile, '--network', files.networkFile);
  const t0 = performance.now();
  const r = spawnSync(process.execPath, args, { env: { ...process.env, PASSBUDGET_BENCH_RSS_FILE: rssFile }, stdio: ['ignore', 'ignore', 'pipe'], maxBuffer: 1 << 26 });
  const wallS = (performance.now() - t0) / 1000;
  const stderr = r.stderr.toString();
  const m = /stats: (\d+) contacts, (\d+) link samples, (\d+) SGP4 propagations/.exec(stderr);
  let peakRssMb = Number.NaN;
  let cpuS = Number.NaN;
  try {
    const [rssKb, cpuUs] = readFileSync(rssFile, 'utf8').split(' ').map(Number);
    peakRssMb = (rssKb ?? Number.NaN) / 1024;
    cpuS = (cpuUs ?? Number.NaN) / 1e6;
  } catch {
    // the run died before its exit hook
  }
  const fig: CliFigures = {
    label,
    wallS,
    peakRssMb,
    cpuS,
    exitCode: r.status,
    stats: m ? { contacts: Number(m[1]), linkSamples: Number(m[2]), propagations: Number(m[3]) } : undefined,
    files: extra.includes('--no-write') ? [] : safeFiles(outDir),
    stderrTail: stderr.split('\n').filter((l) => !l.startsWith('stats:')).slice(-3).join('\n'),
  };
  rmSync(work, { recursive: true, force: true });
  return fig;
}

function safeFiles(dir: string): { name: string; bytes: number }[] {
  try {
    return filesUnder(dir);
  } catch {
    return [];
  }
}

export function printFigures(f: CliFigures): void {
  const s = f.stats;
  console.log(
    `${f.label.padEnd(40)} ${f.wallS.toFixed(2).padStart(7)} s wall  ${f.cpuS.toFixed(2).padStart(7)} s CPU  peak RSS ${f.peakRssMb.toFixed(0).padStart(5)} MB  exit ${f.exitCode}` +
      (s ? `  ${s.contacts} contacts, ${s.linkSamples} link samples, ${s.propagations} SGP4 calls` : ''),
  );
  if (f.exitCode !== 0) console.log(`  stderr: ${f.stderrTail}`);
  if (f.files.length > 0) {
    const big = f.files.filter((x) => !x.name.startsWith('calendar/'));
    const cal = f.files.filter((x) => x.name.startsWith('calendar/'));
    const mb = (b: number): string => (b >= 1e6 ? `${(b / 1e6).toFixed(1)} MB` : `${(b / 1e3).toFixed(1)} kB`);
    const parts = big.map((x) => `${x.name} ${mb(x.bytes)}`);
    if (cal.length > 0) parts.push(`calendar/*.ics ${cal.length} files ${mb(cal.reduce((a, x) => a + x.bytes, 0))}`);
    console.log(`  written: ${parts.join(', ')}`);
  }
}

/** The constellation cases, the mixed case and the demo, each through the CLI with every output written. */
export function cliBenchmark(sizes: number[] = [200, 1000], stations = 20, days = 7, withLong = false): void {
  const work = mkdtempSync(join(tmpdir(), 'passbudget-workload-'));
  try {
    console.log('\nwhole program (`passbudget plan`, every output written to a temp folder; invented seeded workloads):');
    printFigures(runCliPlan('demo (8 x 6 x 7 d)', undefined));
    const mixed = writeMixed(join(work, 'mixed'));
    printFigures(runCliPlan('mixed 5 x 5 x 7 d (LEO, HEO, MEO; geometry)', mixed));
    const bySize = new Map<number, CliFigures>();
    for (const n of sizes) {
      const files = writeConstellation(join(work, `leo-${n}`), n, stations, days);
      const f = runCliPlan(`LEO ${n} x ${stations} x ${days} d`, files);
      printFigures(f);
      bySize.set(n, f);
      if (withLong) {
        const long = writeConstellation(join(work, `leo-${n}-28`), n, stations, 28);
        const g = runCliPlan(`LEO ${n} x ${stations} x 28 d`, long);
        printFigures(g);
        console.log(`  28 d / 7 d: wall ${(g.wallS / f.wallS).toFixed(2)}x, peak RSS ${(g.peakRssMb / f.peakRssMb).toFixed(2)}x (target <= 1.5x)`);
      }
    }
    const [a, b] = sizes;
    const fa = a !== undefined ? bySize.get(a) : undefined;
    const fb = b !== undefined ? bySize.get(b) : undefined;
    if (fa && fb && a && b) {
      console.log(`  ${b} vs ${a} spacecraft: wall ${(fb.wallS / fa.wallS).toFixed(2)}x (linear: ${(b / a).toFixed(1)}x, target <= 5.5x), peak RSS ${(fb.peakRssMb / fa.peakRssMb).toFixed(2)}x`);
    }
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}
