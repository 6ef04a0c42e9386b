// `passbudget plan` end to end for the daily outputs: plan.json carries `daily`
// and `spacecraft_totals` consistent with its own contacts, daily.csv holds the
// same rows, the terminal table flags the 23-hour day, and two runs at
// different clock times write byte-identical files (DESIGN.md: "the same
// inputs give byte-identical outputs"; DTSTAMP must not come from the clock).
// Day lengths: IANA tz database, US rule (second Sunday of March, 02:00 local):
// 2026-03-08 is 23 h long in America/Denver.
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, readFileSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { run } from '../../src/cli/main.js';

const args = ['plan', '--from', '2026-03-08T00:00:00Z', '--days', '1', '--step', '10s', '--local-days'];

async function plan(outDir: string, nowMs: number): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await run([...args, '--out', outDir], { out: (t) => (out += t), err: (t) => (err += t), isTty: false, nowMs: () => nowMs });
  return { code, out, err };
}

function listFiles(dir: string, sub = ''): string[] {
  return readdirSync(join(dir, sub), { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? listFiles(dir, join(sub, e.name)) : [join(sub, e.name)],
  );
}

interface Json {
  contacts: { station: string; spacecraft: string; volume_bits?: number }[];
  daily: { station: string; time_zone: string; day: string; day_hours: number; dst_change: boolean; contacts: number; volume_bits: number }[];
  spacecraft_totals: { spacecraft: string; contacts: number; volume_bits: number; station_sum_volume_bits: number }[];
}

describe('plan --local-days outputs', () => {
  const dirA = mkdtempSync(join(tmpdir(), 'pb-daily-a-'));
  const dirB = mkdtempSync(join(tmpdir(), 'pb-daily-b-'));
  let first: { code: number; out: string; err: string };
  let json: Json;

  beforeAll(async () => {
    first = await plan(dirA, Date.UTC(2030, 0, 1));
    json = JSON.parse(readFileSync(join(dirA, 'plan.json'), 'utf8')) as Json;
  });

  it('plan.json: daily rows sum to its contacts, per station, to the bit', () => {
    expect(first.code).toBe(0);
    const stations = [...new Set(json.daily.map((r) => r.station))];
    expect(stations.length).toBe(6);
    for (const st of stations) {
      const rows = json.daily.filter((r) => r.station === st);
      const contacts = json.contacts.filter((c) => c.station === st);
      expect(rows.reduce((s, r) => s + r.volume_bits, 0)).toBe(contacts.reduce((s, c) => s + (c.volume_bits ?? 0), 0));
      expect(rows.reduce((s, r) => s + r.contacts, 0)).toBe(contacts.length);
    }
    for (const t of json.spacecraft_totals) {
      const mine = json.contacts.filter((c) => c.spacecraft === t.spacecraft);
      expect(t.contacts).toBe(mine.length);
      expect(t.station_sum_volume_bits).toBe(mine.reduce((s, c) => s + (c.volume_bits ?? 0), 0));
      expect(t.volume_bits).toBeLessThanOrEqual(t.station_sum_volume_bits);
    }
  });

  it('flags the 23-hour local day at Meadowlark (America/Denver) in JSON, CSV and the table', () => {
    const mdl = json.daily.filter((r) => r.station === 'MDL');
    expect(mdl.map((r) => [r.day, r.day_hours, r.dst_change])).toEqual([
      ['2026-03-07', 24, false],
      ['2026-03-08', 23, true],
    ]);
    expect(mdl.every((r) => r.time_zone === 'America/Denver')).toBe(true);
    // daily.csv has no field that needs quoting (ids, dates, numbers, booleans): split on commas
    const text = readFileSync(join(dirA, 'daily.csv'), 'utf8');
    expect(text).not.toContain('"');
    const [header, ...lines] = text.trimEnd().split('\n').map((l) => l.split(','));
    const csv = lines.map((cells) => Object.fromEntries(header!.map((h, i) => [h, cells[i] ?? ''])));
    expect(csv.length).toBe(json.daily.length);
    csv.forEach((row, i) => {
      const r = json.daily[i]!;
      expect([row.station, row.day, Number(row.volume_bits), row.dst_change]).toEqual([r.station, r.day, r.volume_bits, String(r.dst_change)]);
    });
    const tableLine = first.out.split('\n').find((l) => l.startsWith('2026-03-08') && l.includes('*'));
    expect(tableLine).toBeDefined();
    expect(first.out).toContain('"*": 23- or 25-hour local day');
  });

  it('a second run at another clock time writes byte-identical files', async () => {
    const second = await plan(dirB, Date.UTC(2031, 5, 15, 12, 34, 56));
    expect(second.code).toBe(0);
    const names = listFiles(dirA).sort();
    expect(names).toEqual(listFiles(dirB).sort());
    expect(names).toEqual(
      ['calendar/ALK.ics', 'calendar/EQP.ics', 'calendar/FRV.ics', 'calendar/MDL.ics', 'calendar/SAL.ics', 'calendar/SCX.ics', 'contacts.csv', 'contacts.ics', 'contacts.jsonl', 'daily.csv', 'plan.json', 'report.html', 'sun-outages.csv'].sort(),
    );
    for (const n of names) expect(readFileSync(join(dirB, n)).equals(readFileSync(join(dirA, n))), n).toBe(true);
  });
});
