/**
 * Benchmark of the geometry stage: a synthetic constellation (invented elements spread
 * over LEO altitudes and inclinations) against invented stations spread over latitudes,
 * for a week. Prints propagations, windows, wall time and peak RSS for the fast search and
 * for the 1 s brute-force scan (on a subset if the full run would be too long), and checks
 * that both find identical windows on what was compared.
 *
 * Run: npm run bench. Exported pieces let later figures (demo week, link engine) be added.
 */
import { isEntryModule } from '../src/cli/entry.js';
import { checksum } from './workload.js';
import { findPassesBruteForce } from '../src/geometry/bruteforce.js';
import { makeSite } from '../src/geometry/earth.js';
import { findPasses } from '../src/geometry/passes.js';
import { makeSgp4Target } from '../src/geometry/targets/sgp4.js';
import type { Pass, Site } from '../src/geometry/types.js';
import type { ElementSet, Mask, Span } from '../src/scenario/types.js';

const MU_KM3_S2 = 398600.8; // WGS-72, only to invent mean motions
const EARTH_RADIUS_KM = 6378.135;


/** Invented circular-ish LEO element sets, spread over 400..1400 km and 30..99 deg. */
export function syntheticFleet(count: number, epochMs: number): { id: string; sets: ElementSet[] }[] {
  const fleet: { id: string; sets: ElementSet[] }[] = [];
  const year = new Date(epochMs).getUTCFullYear();
  const doy = (epochMs - Date.UTC(year, 0, 1)) / 86_400_000 + 1;
  for (let k = 0; k < count; k++) {
    const altKm = 400 + ((k * 37) % 1000);
    const incDeg = 30 + ((k * 53) % 69);
    const a = EARTH_RADIUS_KM + altKm;
    const n = (Math.sqrt(MU_KM3_S2 / a ** 3) * 86400) / (2 * Math.PI);
    const cat = String(80000 + k).padStart(5, '0');
    const l1 = `1 ${cat}U 26001A   ${String(year % 100).padStart(2, '0')}${doy.toFixed(8).padStart(12, '0')}  .00000000  00000-0  10000-3 0  999`;
    const f = (v: number, w: number, d: number): string => v.toFixed(d).padStart(w, ' ');
    const l2 = `2 ${cat} ${f(incDeg, 8, 4)} ${f((k * 137.5) % 360, 8, 4)} 0010000 ${f((k * 71) % 360, 8, 4)} ${f((k * 211) % 360, 8, 4)} ${f(n, 11, 8)}    1`;
    const tle = { line1: l1 + checksum(l1), line2: l2 + checksum(l2) };
    fleet.push({ id: `sc-${k}`, sets: [{ origin: `bench sc-${k}`, catalogNumber: cat, epochMs, tle }] });
  }
  return fleet;
}

/** Invented stations spread over latitudes -70..75 and longitudes; 5 deg constant masks. */
export function syntheticStations(count: number): { sites: Site[]; masks: Mask[] } {
  const sites: Site[] = [];
  const masks: Mask[] = [];
  for (let k = 0; k < count; k++) {
    const lat = -70 + (145 * k) / Math.max(1, count - 1);
    const lon = -180 + ((k * 97) % 360);
    sites.push(makeSite(`gs-${k}`, lat, lon, 0.1));
    masks.push({ kind: 'constant', elevationDeg: 5 });
  }
  return { sites, masks };
}

export interface RunFigures {
  label: string;
  spacecraft: number;
  propagations: number;
  windows: number;
  wallMs: number;
  passes: Pass[];
}

export function runSearch(
  label: string,
  fleet: { id: string; sets: ElementSet[] }[],
  sites: Site[],
  masks: Mask[],
  span: Span,
  brute: boolean,
): RunFigures {
  const t0 = performance.now();
  let propagations = 0;
  const passes: Pass[] = [];
  for (const sc of fleet) {
    const target = makeSgp4Target(sc.id, sc.sets);
    const found = brute ? findPassesBruteForce(target, sites, masks, span, 1) : findPasses(target, sites, masks, span);
    propagations += target.evaluations;
    for (const p of found) passes.push(p);
  }
  return { label, spacecraft: fleet.length, propagations, windows: passes.length, wallMs: performance.now() - t0, passes };
}

/** Same windows: same count per pair, edges within 1 s (the brute force's resolution). */
export function compareWindows(fast: Pass[], slow: Pass[]): { identical: boolean; mismatches: number; maxEdgeS: number } {
  const key = (p: Pass): string => `${p.spacecraftId}|${p.stationId}`;
  const group = (ps: Pass[]): Map<string, Pass[]> => {
    const m = new Map<string, Pass[]>();
    for (const p of ps) m.set(key(p), [...(m.get(key(p)) ?? []), p]);
    return m;
  };
  const a = group(fast);
  const b = group(slow);
  let mismatches = 0;
  let maxEdgeS = 0;
  for (const k of new Set([...a.keys(), ...b.keys()])) {
    const fa = a.get(k) ?? [];
    const fb = b.get(k) ?? [];
    if (fa.length !== fb.length) {
      mismatches += Math.abs(fa.length - fb.length);
      continue;
    }
    for (let i = 0; i < fa.length; i++) {
      const d = Math.max(Math.abs(fa[i]!.aosMs - fb[i]!.aosMs), Math.abs(fa[i]!.losMs - fb[i]!.losMs)) / 1000;
      maxEdgeS = Math.max(maxEdgeS, d);
      if (d >= 1) mismatches++;
    }
  }
  return { identical: mismatches === 0, mismatches, maxEdgeS };
}

export function peakRssMb(): number {
  return process.resourceUsage().maxRSS / 1024; // maxRSS is in kilobytes
}

function line(f: RunFigures): string {
  return `${f.label.padEnd(34)} ${String(f.spacecraft).padStart(4)} sc  ${String(f.propagations).padStart(11)} propagations  ${String(f.windows).padStart(6)} windows  ${(f.wallMs / 1000).toFixed(2).padStart(8)} s`;
}

export function geometryBenchmark(spacecraft = 200, stations = 20, days = 7, bruteSubset = 20): void {
  const startMs = Date.UTC(2026, 2, 2);
  const span: Span = { startMs, endMs: startMs + days * 86_400_000 };
  const fleet = syntheticFleet(spacecraft, startMs - 86_400_000);
  const { sites, masks } = syntheticStations(stations);
  console.log(`geometry: ${spacecraft} spacecraft x ${stations} stations x ${days} days (invented LEO elements, 400..1400 km, 30..99 deg)`);
  const fast = runSearch('fast search (all)', fleet, sites, masks, span, false);
  console.log(line(fast));
  const subset = fleet.slice(0, bruteSubset);
  const fastSub = runSearch(`fast search (first ${subset.length})`, subset, sites, masks, span, false);
  const brute = runSearch(`1 s brute force (first ${subset.length})`, subset, sites, masks, span, true);
  console.log(line(fastSub));
  console.log(line(brute));
  const cmp = compareWindows(fastSub.passes, brute.passes);
  const perScBrute = brute.wallMs / subset.length;
  const perScFast = fast.wallMs / fleet.length;
  console.log(
    `brute force run on the first ${subset.length} spacecraft only (the full run would take ~${((perScBrute * fleet.length) / 1000).toFixed(0)} s); ` +
      `compared per spacecraft:`,
  );
  console.log(`  propagations ratio fast/brute: 1/${(brute.propagations / fastSub.propagations).toFixed(1)} (target < 1/20)`);
  console.log(`  speed-up per spacecraft: ${(perScBrute / perScFast).toFixed(1)}x (subset vs subset: ${(brute.wallMs / fastSub.wallMs).toFixed(1)}x; target >= 15x)`);
  console.log(`  windows identical on the compared subset: ${cmp.identical ? 'yes' : 'NO'} (${cmp.mismatches} mismatches, max edge difference ${cmp.maxEdgeS.toFixed(4)} s)`);
  console.log(`  peak RSS: ${peakRssMb().toFixed(0)} MB`);
  if (!cmp.identical) process.exitCode = 1;
}

async function main(): Promise<void> {
  const { cliBenchmark } = await import('./cli-bench.js');
  const args = process.argv.slice(2);
  // `npm run bench -- --cli [sizes...] [--28d]`: only the whole-program figures
  if (args[0] === '--cli') {
    const sizes = args.slice(1).filter((a) => /^\d+$/.test(a)).map(Number);
    cliBenchmark(sizes.length > 0 ? sizes : [200, 1000], 20, 7, args.includes('--28d'));
    return;
  }
  const { demoBenchmark, linkBenchmark } = await import('./link-bench.js');
  const { benchTrace } = await import('./trace-bench.js');
  // Trace first: peak RSS is per process, so it is measured before the big runs below.
  const tr = await benchTrace(1);
  console.log(
    `trace: demo week at 1 s, ${tr.pairs} pairs, ${tr.rows} rows, ${(tr.bytes / 1e9).toFixed(2)} GB streamed in ${tr.wallS.toFixed(1)} s ` +
      `(${(tr.rowsPerS / 1e3).toFixed(0)} k rows/s), peak RSS ${tr.peakRssMb.toFixed(0)} MB, RSS while streaming ` +
      `${Math.min(...tr.rssSamplesMb).toFixed(0)}..${Math.max(...tr.rssSamplesMb).toFixed(0)} MB`,
  );
  demoBenchmark();
  geometryBenchmark();
  await linkBenchmark();
  cliBenchmark();
  const { bookingBenchmark } = await import('./booking-bench.js');
  await bookingBenchmark();
}

// Run only when executed directly (link-bench.ts imports the helpers above).
if (isEntryModule(import.meta.url)) void main();
