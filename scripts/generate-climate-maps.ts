/**
 * Generates the ITU-R climate maps passbudget ships (data/itu-r/) from the ITU-R digital
 * maps (the gzip float32 copies described in that folder's README), and the small node
 * samples the tests recompute them from (test/reference/itu-r/maps/).
 *
 *   npm run build && node dist/scripts/generate-climate-maps.js --maps DIR [--out data/itu-r]
 *        [--samples test/reference/itu-r/maps]
 *
 * DIR holds index.json and the per-Recommendation folders. Every source file's SHA-256 is
 * checked against index.json before use. What is written:
 *   - P.837-7 R0.01 on the 0.25° grid of the monthly rainfall maps, by the Annex 1 method
 *     (src/link/climate/p837-7.ts) at every grid point, with the twelve P.1510-1 monthly
 *     temperatures interpolated bilinearly at that point (latitude clamped to +-90° for
 *     the padding rows beyond the poles); float32.
 *   - P.839-4 h0, P.1510-1 annual T, P.453-14 median Nwet, P.836-6 topography and rho /
 *     scale height at 5 and 10 %: the source values unchanged (float32).
 *   - P.840-9 L at 5 and 10 %: uint16 thousandths (the source has 3 decimals; every value is
 *     checked to be stored exactly).
 *   - SHA256SUMS of the written files.
 * Same inputs, byte-identical outputs.
 */

import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { gunzipSync, gzipSync } from 'node:zlib';
import { bilinear, cornersOf, nodeLatDeg, nodeLonDeg, type MapGrid } from '../src/link/climate/grid.js';
import { MAP_FILES, type MapFile, type MapName } from '../src/link/climate/maps.js';
import { rainRate001FromMonthlyMmH } from '../src/link/climate/p837-7.js';
import { isEntryModule } from '../src/cli/entry.js';

interface IndexEntry {
  file: string;
  rows: number;
  cols: number;
  lat_first_deg: number;
  lat_step_deg: number;
  lon_first_deg: number;
  lon_step_deg: number;
  sha256_of_uncompressed_f32: string;
}

/** Workbook sites whose surrounding grid points are sampled for the tests (ITU-R SG3 validation workbook Rev 8.3.0). */
const P837_SITES: [number, number][] = [
  [3.133, 101.7], [22.9, -43.23], [23, 30], [25.78, -80.22], [28.717, 77.3], [33.94, 18.43], [41.9, 12.49], [51.5, -0.14], [9.05, 38.7], [46.2208, 6.137],
];
const P836_SITES = P837_SITES;
const P840_SITES: [number, number][] = [[-45, -90], [-45, 0], [-87.5, 0], [0, 0], [45, -90], [45, 0], [45, 90], [87.5, 0]];
const P836_LEVELS = ['01', '02', '03', '05', '1', '2', '3', '5', '10'];
const P840_LEVELS = ['001', '002', '003', '005', '01', '02', '03', '05', '1', '2', '3', '5', '10', '20', '30', '50', '60', '70', '80'];

const sha256 = (b: Uint8Array): string => createHash('sha256').update(b).digest('hex');

class Source {
  private readonly index = new Map<string, IndexEntry>();
  private readonly cache = new Map<string, MapGrid>();
  constructor(private readonly dir: string) {
    for (const e of JSON.parse(readFileSync(join(dir, 'index.json'), 'utf8')) as IndexEntry[]) this.index.set(e.file, e);
  }
  entry(file: string): IndexEntry {
    const e = this.index.get(file);
    if (!e) throw new Error(`${file} is not in ${this.dir}/index.json`);
    return e;
  }
  bytes(file: string): Uint8Array {
    const e = this.entry(file);
    const raw = gunzipSync(readFileSync(join(this.dir, file)));
    if (sha256(raw) !== e.sha256_of_uncompressed_f32) throw new Error(`${file}: SHA-256 differs from index.json`);
    return raw;
  }
  grid(file: string): MapGrid {
    let g = this.cache.get(file);
    if (!g) {
      const e = this.entry(file);
      const raw = new Uint8Array(this.bytes(file));
      g = {
        label: file,
        rows: e.rows,
        cols: e.cols,
        latFirstDeg: e.lat_first_deg,
        latStepDeg: e.lat_step_deg,
        lonFirstDeg: e.lon_first_deg,
        lonStepDeg: e.lon_step_deg,
        raw: new Float32Array(raw.buffer, 0, e.rows * e.cols),
        scale: 1,
      };
      this.cache.set(file, g);
    }
    return g;
  }
}

function checkGeometry(spec: MapFile, e: IndexEntry): void {
  const same =
    spec.rows === e.rows && spec.cols === e.cols && spec.latFirstDeg === e.lat_first_deg && spec.latStepDeg === e.lat_step_deg &&
    spec.lonFirstDeg === e.lon_first_deg && spec.lonStepDeg === e.lon_step_deg;
  if (!same) throw new Error(`${spec.file}: grid differs from ${e.file} in index.json`);
}

const monthTag = (m: number): string => String(m + 1).padStart(2, '0');

function deriveR001(src: Source): Float32Array {
  const mt = Array.from({ length: 12 }, (_, m) => src.grid(`p837-7/v7_mt_month${monthTag(m)}.f32.gz`));
  const t = Array.from({ length: 12 }, (_, m) => src.grid(`p1510-1/v1_t_month${monthTag(m)}.f32.gz`));
  const g0 = mt[0] as MapGrid;
  checkGeometry(MAP_FILES.r001, src.entry('p837-7/v7_mt_month01.f32.gz'));
  const out = new Float32Array(g0.rows * g0.cols);
  const mtCell = new Float64Array(12);
  const tCell = new Float64Array(12);
  for (let i = 0; i < g0.rows; i++) {
    const lat = Math.max(-90, Math.min(90, nodeLatDeg(g0, i)));
    for (let j = 0; j < g0.cols; j++) {
      const lon = nodeLonDeg(g0, j);
      const k = i * g0.cols + j;
      for (let m = 0; m < 12; m++) {
        mtCell[m] = (mt[m] as MapGrid).raw[k] as number;
        tCell[m] = bilinear(t[m] as MapGrid, lat, lon);
      }
      out[k] = rainRate001FromMonthlyMmH(mtCell, tCell);
    }
  }
  return out;
}

function toMilli(g: MapGrid, file: string): Uint16Array {
  const out = new Uint16Array(g.raw.length);
  for (let k = 0; k < g.raw.length; k++) {
    const v = g.raw[k] as number;
    const q = Math.round(v * 1000);
    if (!(q >= 0 && q <= 65535) || Math.fround(q / 1000) !== v) throw new Error(`${file}: value ${v} at ${k} is not an exact thousandth in 0..65.535`);
    out[k] = q;
  }
  return out;
}

const COPIES: Partial<Record<MapName, string>> = {
  h0: 'p839-4/v4_esa0height.f32.gz',
  tAnnual: 'p1510-1/v1_t_annual.f32.gz',
  nWet: 'p453-14/v13_nwet_annual_50.f32.gz',
  topo: 'p836-6-topography/v6_topo_0dot5.f32.gz',
  rho5: 'p836-6/v6_rho_5.f32.gz',
  rho10: 'p836-6/v6_rho_10.f32.gz',
  vsch5: 'p836-6/v6_vsch_5.f32.gz',
  vsch10: 'p836-6/v6_vsch_10.f32.gz',
  l5: 'p840-9/v9_l_5.f32.gz',
  l10: 'p840-9/v9_l_10.f32.gz',
};

function writeSamples(src: Source, dir: string): void {
  mkdirSync(dir, { recursive: true });
  // P.837-7: the inputs of the grid points around each site (MT as stored, T as the generator interpolates it).
  const mt0 = src.grid('p837-7/v7_mt_month01.f32.gz');
  const lines = [['row', 'col', 'lat_deg_N', 'lon_deg_E', ...Array.from({ length: 12 }, (_, m) => `MT_month${monthTag(m)}_mm`), ...Array.from({ length: 12 }, (_, m) => `T_month${monthTag(m)}_K`)].join(',')];
  const seen = new Set<string>();
  for (const [lat, lon] of P837_SITES) {
    const c = cornersOf(mt0, lat, lon);
    for (const [i, j] of [[c.i, c.j], [c.i + 1, c.j], [c.i, c.j + 1], [c.i + 1, c.j + 1]] as [number, number][]) {
      if (seen.has(`${i},${j}`)) continue;
      seen.add(`${i},${j}`);
      const la = Math.max(-90, Math.min(90, nodeLatDeg(mt0, i)));
      const lo = nodeLonDeg(mt0, j);
      const mts = Array.from({ length: 12 }, (_, m) => src.grid(`p837-7/v7_mt_month${monthTag(m)}.f32.gz`).raw[i * mt0.cols + j] as number);
      const ts = Array.from({ length: 12 }, (_, m) => bilinear(src.grid(`p1510-1/v1_t_month${monthTag(m)}.f32.gz`), la, lo));
      lines.push([i, j, nodeLatDeg(mt0, i), lo, ...mts, ...ts].join(','));
    }
  }
  writeFileSync(join(dir, 'p837-7_grid_point_inputs.csv'), lines.join('\n') + '\n');

  // P.836-6 and P.840-9: source values at the grid points around each site (and the topography around those).
  const rows = ['map,row,col,value'];
  const add = (file: string, i: number, j: number): void => {
    const g = src.grid(file);
    const period = Math.round(360 / Math.abs(g.lonStepDeg));
    const jj = ((j % period) + period) % period;
    const ii = Math.max(0, Math.min(g.rows - 1, i));
    const key = `${file},${ii},${jj}`;
    if (seen.has(key)) return;
    seen.add(key);
    rows.push(`${file},${ii},${jj},${g.raw[ii * g.cols + jj] as number}`);
  };
  const rho = src.grid('p836-6/v6_rho_1.f32.gz');
  const topo = src.grid('p836-6-topography/v6_topo_0dot5.f32.gz');
  for (const [lat, lon] of P836_SITES) {
    const c = cornersOf(rho, lat, lon);
    for (const [i, j] of [[c.i, c.j], [c.i + 1, c.j], [c.i, c.j + 1], [c.i + 1, c.j + 1]] as [number, number][]) {
      for (const p of P836_LEVELS) for (const q of ['rho', 'v', 'vsch']) add(`p836-6/v6_${q}_${p}.f32.gz`, i, j);
      const t = cornersOf(topo, nodeLatDeg(rho, i), nodeLonDeg(rho, j));
      for (let a = -1; a <= 2; a++) for (let b = -1; b <= 2; b++) add('p836-6-topography/v6_topo_0dot5.f32.gz', t.i + a, t.j + b);
    }
  }
  const l1 = src.grid('p840-9/v9_l_1.f32.gz');
  for (const [lat, lon] of P840_SITES) {
    const c = cornersOf(l1, lat, lon);
    for (const [i, j] of [[c.i, c.j], [c.i + 1, c.j], [c.i, c.j + 1], [c.i + 1, c.j + 1]] as [number, number][]) {
      for (const p of P840_LEVELS) add(`p840-9/v9_l_${p}.f32.gz`, i, j);
    }
  }
  writeFileSync(join(dir, 'node_samples.csv'), rows.join('\n') + '\n');
  const grids: Record<string, Omit<IndexEntry, 'file' | 'sha256_of_uncompressed_f32'>> = {};
  for (const r of rows.slice(1)) {
    const file = r.split(',')[0] as string;
    if (grids[file]) continue;
    const { file: _f, sha256_of_uncompressed_f32: _s, ...geometry } = src.entry(file);
    grids[file] = { rows: geometry.rows, cols: geometry.cols, lat_first_deg: geometry.lat_first_deg, lat_step_deg: geometry.lat_step_deg, lon_first_deg: geometry.lon_first_deg, lon_step_deg: geometry.lon_step_deg };
  }
  writeFileSync(join(dir, 'node_sample_grids.json'), JSON.stringify(grids, null, 1) + '\n');
}

export function generate(mapsDir: string, outDir: string, samplesDir: string | undefined): void {
  const src = new Source(mapsDir);
  mkdirSync(outDir, { recursive: true });
  const sums: string[] = [];
  const write = (name: MapName, bytes: Uint8Array): void => {
    const spec: MapFile = MAP_FILES[name];
    const gz = gzipSync(bytes, { level: 9 });
    writeFileSync(join(outDir, spec.file), gz);
    sums.push(`${sha256(gz)}  ${spec.file}`);
    console.log(`${spec.file}: ${spec.rows} x ${spec.cols} ${spec.encoding}, ${gz.length} bytes`);
  };
  for (const [name, file] of Object.entries(COPIES) as [MapName, string][]) {
    const spec: MapFile = MAP_FILES[name];
    checkGeometry(spec, src.entry(file));
    if (spec.encoding === 'u16-milli') {
      const u = toMilli(src.grid(file), file);
      write(name, new Uint8Array(u.buffer, u.byteOffset, u.byteLength));
    } else {
      write(name, src.bytes(file));
    }
  }
  const r001 = deriveR001(src);
  write('r001', new Uint8Array(r001.buffer, r001.byteOffset, r001.byteLength));
  sums.sort((a, b) => (a.slice(66) < b.slice(66) ? -1 : 1));
  writeFileSync(join(outDir, 'SHA256SUMS'), sums.join('\n') + '\n');
  if (samplesDir) writeSamples(src, samplesDir);
}

function main(argv: string[]): void {
  const arg = (flag: string): string | undefined => {
    const i = argv.indexOf(flag);
    return i >= 0 ? argv[i + 1] : undefined;
  };
  const maps = arg('--maps');
  if (!maps) {
    console.error('usage: node dist/scripts/generate-climate-maps.js --maps DIR [--out data/itu-r] [--samples test/reference/itu-r/maps]');
    process.exitCode = 2;
    return;
  }
  generate(resolve(maps), resolve(arg('--out') ?? 'data/itu-r'), arg('--samples') ? resolve(arg('--samples') as string) : undefined);
}

if (isEntryModule(import.meta.url)) main(process.argv.slice(2));
