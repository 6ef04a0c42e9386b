// The shipped ITU-R climate maps (data/itu-r/) are the files the generator wrote: whole-file
// SHA-256 of every file against data/itu-r/SHA256SUMS, and that list pinned here, so a
// changed map needs a deliberate change of this test. Sizes are printed for the README.
import { createHash } from 'node:crypto';
import { readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { MAP_FILES, climateMap, mapsDir } from '../../../src/link/climate/maps.js';

const SUMS_SHA256 = 'd1d361557a6bd0b6e04ba24d56d8533c32a4d7be0bb60373385534b8185decfc';

describe('shipped climate maps', () => {
  const dir = mapsDir();
  const sums = readFileSync(join(dir, 'SHA256SUMS'), 'utf8');
  it('SHA256SUMS is the pinned list', () => {
    expect(createHash('sha256').update(sums).digest('hex')).toBe(SUMS_SHA256);
  });
  it('every map file has the SHA-256 the list gives, and every map the code reads is listed', () => {
    const listed = new Map(sums.trim().split('\n').map((l) => [l.slice(66), l.slice(0, 64)] as const));
    let bytes = 0;
    for (const spec of Object.values(MAP_FILES)) {
      const file = join(dir, spec.file);
      bytes += statSync(file).size;
      expect(createHash('sha256').update(readFileSync(file)).digest('hex'), spec.file).toBe(listed.get(spec.file));
    }
    expect(listed.size).toBe(Object.keys(MAP_FILES).length);
    console.info(`shipped climate maps: ${Object.keys(MAP_FILES).length} files, ${bytes} bytes`);
  });
  it('each map decodes to its grid with finite values where the source has them', () => {
    for (const name of Object.keys(MAP_FILES) as (keyof typeof MAP_FILES)[]) {
      const g = climateMap(name);
      expect(g.raw.length).toBe(g.rows * g.cols);
    }
  });
});
