/**
 * Test helper: grids holding only the source-map values at the grid points around the
 * workbook sites (test/reference/itu-r/maps/node_samples.csv, written by
 * scripts/generate-climate-maps.ts from the ITU-R digital maps; source note in
 * test/reference/itu-r/README.md). Every other cell is NaN, so a model that reads a point
 * not sampled gives NaN and the test fails.
 */
import { readFileSync } from 'node:fs';
import type { MapGrid } from '../../../src/link/climate/grid.js';

const DIR = new URL('../../reference/itu-r/maps/', import.meta.url);

interface Geometry {
  rows: number;
  cols: number;
  lat_first_deg: number;
  lat_step_deg: number;
  lon_first_deg: number;
  lon_step_deg: number;
}

let grids: Map<string, MapGrid> | undefined;

export function sampledGrid(file: string): MapGrid {
  if (!grids) {
    grids = new Map();
    const geometry = JSON.parse(readFileSync(new URL('node_sample_grids.json', DIR), 'utf8')) as Record<string, Geometry>;
    for (const [f, g] of Object.entries(geometry)) {
      const raw = new Float32Array(g.rows * g.cols).fill(Number.NaN);
      grids.set(f, {
        label: f,
        rows: g.rows,
        cols: g.cols,
        latFirstDeg: g.lat_first_deg,
        latStepDeg: g.lat_step_deg,
        lonFirstDeg: g.lon_first_deg,
        lonStepDeg: g.lon_step_deg,
        raw,
        scale: 1,
      });
    }
    const lines = readFileSync(new URL('node_samples.csv', DIR), 'utf8').trim().split('\n').slice(1);
    for (const line of lines) {
      const [f, i, j, v] = line.split(',') as [string, string, string, string];
      const g = grids.get(f) as MapGrid;
      (g.raw as Float32Array)[Number(i) * g.cols + Number(j)] = Number(v);
    }
  }
  const g = grids.get(file);
  if (!g) throw new Error(`no samples of ${file}`);
  return g;
}

/** Rows of p837-7_grid_point_inputs.csv as numbers. */
export function p837GridPointInputs(): Record<string, number>[] {
  const lines = readFileSync(new URL('p837-7_grid_point_inputs.csv', DIR), 'utf8').trim().split('\n');
  const head = (lines[0] as string).split(',');
  return lines.slice(1).map((l) => Object.fromEntries(l.split(',').map((c, k) => [head[k] as string, Number(c)])));
}
