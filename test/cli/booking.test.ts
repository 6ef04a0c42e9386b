// plan --booking on the demo week (src/cli/booking.ts): a hard requirement that cannot
// be met exits 1 and names its reason; every component's solver is reported with its
// gap; the booked tracks obey the maintenance period; a bad booking file exits 2 with
// one line naming the file and field. DRIFTER is held to Meadowlark (MDL), where its
// window is 9 h 21 min a day in the demo week (the plan's own table): two 4 h tracks
// and a 60 s set-up fit, three never do.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';

interface Doc {
  booking: {
    components: { solver: string; gap: number; status: string }[];
    tracks: { station: string; antenna: number; spacecraft: string; start_utc: string; end_utc: string }[];
    requirements: { spacecraft: string; met: boolean; reason: string | null; period: string }[];
    missed_hard: number;
  };
  recorder: { spacecraft: { initial_bits: number; generated_bits: number; downlinked_bits: number; stored_at_end_bits: number; lost_bits: number }[] };
}

const dir = mkdtempSync(join(tmpdir(), 'booking-cli-'));
const file = (name: string, text: string) => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};

describe('plan --booking', () => {
  it('reports an infeasible hard requirement with its reason and exits 1', async () => {
    const f = file(
      'b.yaml',
      [
        'booking: { recorderAware: false, timeLimitS: 20 }',
        'spacecraft:',
        '  DRIFTER:',
        '    track: { minS: 14400, maxS: 14400 }',
        '    stations: { allow: [MDL] }',
        '    requirements: [{ tracksPerDay: 3, hard: true }]',
        '  ANCHOR-G: { track: { minS: 1800, maxS: 43200 } }',
        'stations:',
        '  SAL: { mount: el-az, azimuthRateDegS: 2, elevationRateDegS: 1.5 }',
        'maintenance:',
        '  - { station: SAL, start: "2026-03-07T08:00:00Z", end: "2026-03-07T16:00:00Z" }',
      ].join('\n'),
    );
    let out = '';
    const code = await run(['plan', '--booking', f, '--format', 'json', '--no-write'], { out: (t) => void (out += t), err: () => {}, isTty: false, nowMs: () => 0 });
    expect(code).toBe(1);
    const doc = JSON.parse(out) as Doc;
    const drifter = doc.booking.requirements.filter((r) => r.spacecraft === 'DRIFTER');
    expect(drifter).toHaveLength(7);
    for (const r of drifter) {
      expect(r.met).toBe(false);
      expect(r.reason).toMatch(/^only [12] track\(s\) of the allowed length fit in DRIFTER's windows on 2026-03-/);
    }
    expect(doc.booking.missed_hard).toBe(7);
    const drifterTracks = doc.booking.tracks.filter((t) => t.spacecraft === 'DRIFTER');
    expect(drifterTracks.every((t) => t.station === 'MDL' && Date.parse(t.end_utc) - Date.parse(t.start_utc) === 4 * 3_600_000)).toBe(true);
    // no track at SAL within the maintenance period (set-up of 300 s kept clear too)
    const m0 = Date.parse('2026-03-07T08:00:00Z') - 300_000;
    const m1 = Date.parse('2026-03-07T16:00:00Z') + 300_000;
    for (const t of doc.booking.tracks.filter((x) => x.station === 'SAL')) expect(Date.parse(t.end_utc) <= m0 || Date.parse(t.start_utc) >= m1).toBe(true);
    // the MIP ran on the components that need it, within its gap
    const mip = doc.booking.components.filter((c) => c.solver === 'highs-mip');
    expect(mip.length).toBeGreaterThan(0);
    for (const c of mip) expect(c.status === 'optimal' ? c.gap : 0).toBeLessThanOrEqual(1e-3);
    for (const r of doc.recorder.spacecraft) expect(r.initial_bits + r.generated_bits).toBe(r.downlinked_bits + r.stored_at_end_bits + r.lost_bits);
  }, 120_000);

  it('a bad booking file exits 2 with one line naming the file and field', async () => {
    const f = file('bad.yaml', 'stations:\n  SAL: { mount: el-az, azimuthRateDegS: 0, elevationRateDegS: 1 }\n');
    let out = '';
    let err = '';
    const code = await run(['plan', '--booking', f, '--no-write'], { out: (t) => void (out += t), err: (t) => void (err += t), isTty: false, nowMs: () => 0 });
    expect(code).toBe(2);
    expect(out).toBe('');
    expect(err.trim().split('\n')).toHaveLength(1);
    expect(err).toContain(`${f}: stations.SAL.azimuthRateDegS:`);
  });
});
