/**
 * The ITU-R digital maps shipped with passbudget (data/itu-r/, source note and checksums in
 * data/itu-r/README.md), and the one module that reads them. Each file is the gzip of a
 * row-major grid, little-endian: float32 values, or uint16 thousandths (values the source
 * gives with 3 decimals, stored exactly). Files are read on first use and kept.
 *
 * What is shipped is what the models need (see each model file):
 *   P.837-7 R0.01, derived once from the monthly maps (scripts/generate-climate-maps.ts);
 *   P.839-4 h0; P.1510-1 annual mean T; P.453-14 median Nwet; P.836-6 rho and scale height
 *   at the exceedances gas is taken at (5 and 10 %) with the P.836-6 topography; P.840-9 L at
 *   5 and 10 %.
 */

import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gunzipSync } from 'node:zlib';
import { packageRoot } from '../../scenario/paths.js';
import type { MapGrid } from './grid.js';

export interface MapFile {
  file: string;
  label: string;
  rows: number;
  cols: number;
  latFirstDeg: number;
  latStepDeg: number;
  lonFirstDeg: number;
  lonStepDeg: number;
  encoding: 'f32' | 'u16-milli';
}

const grid025 = { rows: 722, cols: 1442, latFirstDeg: -90.125, latStepDeg: 0.25, lonFirstDeg: -180.125, lonStepDeg: 0.25 };
const grid075 = { rows: 241, cols: 481, latFirstDeg: -90, latStepDeg: 0.75, lonFirstDeg: -180, lonStepDeg: 0.75 };
const grid1125 = { rows: 161, cols: 321, latFirstDeg: 90, latStepDeg: -1.125, lonFirstDeg: 0, lonStepDeg: 1.125 };
const grid025n = { rows: 721, cols: 1441, latFirstDeg: 90, latStepDeg: -0.25, lonFirstDeg: 0, lonStepDeg: 0.25 };

/** Exceedances (%) at which the P.836-6 and P.840-9 maps are shipped. */
export const SHIPPED_EXCEEDANCES_PERCENT = [5, 10] as const;

function f32(file: string, label: string, g: Omit<MapFile, 'file' | 'label' | 'encoding'>): MapFile {
  return { file, label, ...g, encoding: 'f32' };
}

export const MAP_FILES = {
  r001: f32('p837-7_r001_0p25.f32.gz', 'ITU-R P.837-7 Annex 1 R0.01 (0.25 deg, from the monthly maps)', grid025),
  h0: f32('p839-4_h0.f32.gz', 'ITU-R P.839-4 h0 map', { rows: 121, cols: 241, latFirstDeg: 90, latStepDeg: -1.5, lonFirstDeg: 0, lonStepDeg: 1.5 }),
  tAnnual: f32('p1510-1_t_annual.f32.gz', 'ITU-R P.1510-1 annual mean temperature map', grid075),
  nWet: f32('p453-14_nwet_50.f32.gz', 'ITU-R P.453-14 median Nwet map', grid075),
  topo: f32('p836-6_topo_0p5.f32.gz', 'ITU-R P.836-6 topography', { rows: 363, cols: 723, latFirstDeg: 90.5, latStepDeg: -0.5, lonFirstDeg: -0.5, lonStepDeg: 0.5 }),
  rho5: f32('p836-6_rho_5.f32.gz', 'ITU-R P.836-6 rho map (5 %)', grid1125),
  rho10: f32('p836-6_rho_10.f32.gz', 'ITU-R P.836-6 rho map (10 %)', grid1125),
  vsch5: f32('p836-6_vsch_5.f32.gz', 'ITU-R P.836-6 scale height map (5 %)', grid1125),
  vsch10: f32('p836-6_vsch_10.f32.gz', 'ITU-R P.836-6 scale height map (10 %)', grid1125),
  l5: { file: 'p840-9_l_5.u16.gz', label: 'ITU-R P.840-9 L map (5 %)', ...grid025n, encoding: 'u16-milli' },
  l10: { file: 'p840-9_l_10.u16.gz', label: 'ITU-R P.840-9 L map (10 %)', ...grid025n, encoding: 'u16-milli' },
} satisfies Record<string, MapFile>;

export type MapName = keyof typeof MAP_FILES;

/** Folder of the shipped maps. */
export function mapsDir(): string {
  return join(packageRoot(), 'data', 'itu-r');
}

/** Decodes the uncompressed bytes of a map file into a grid. */
export function decodeMap(spec: MapFile, bytes: Uint8Array): MapGrid {
  const n = spec.rows * spec.cols;
  const width = spec.encoding === 'f32' ? 4 : 2;
  if (bytes.length !== n * width) throw new Error(`${spec.file}: ${bytes.length} bytes, expected ${n * width} (bug or damaged file)`);
  const copy = new Uint8Array(bytes); // aligned copy
  const raw = spec.encoding === 'f32' ? new Float32Array(copy.buffer, 0, n) : new Uint16Array(copy.buffer, 0, n);
  return { ...spec, raw, scale: spec.encoding === 'f32' ? 1 : 1e-3 };
}

const cache = new Map<MapName, MapGrid>();

/** The shipped map by name (read and decoded on first use). */
export function climateMap(name: MapName): MapGrid {
  let g = cache.get(name);
  if (!g) {
    const spec: MapFile = MAP_FILES[name];
    g = decodeMap(spec, gunzipSync(readFileSync(join(mapsDir(), spec.file))));
    cache.set(name, g);
  }
  return g;
}
