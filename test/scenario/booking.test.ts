// Booking file checks (src/scenario/booking.ts): every problem names the file
// and the field and says what is valid; a good file reads into rules.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ScenarioError } from '../../src/errors.js';
import { loadBooking } from '../../src/scenario/booking.js';
import type { Scenario } from '../../src/scenario/types.js';

const scenario = {
  spacecraft: [{ id: 'DRIFTER' }, { id: 'MOONWREN' }],
  stations: [{ id: 'SAL', antennaCount: 2 }, { id: 'MDL', antennaCount: 1 }],
} as unknown as Pick<Scenario, 'spacecraft' | 'stations'>;

function problems(text: string): string[] {
  const dir = mkdtempSync(join(tmpdir(), 'booking-'));
  const file = join(dir, 'b.yaml');
  writeFileSync(file, text);
  try {
    loadBooking(file, scenario);
  } catch (err) {
    expect(err).toBeInstanceOf(ScenarioError);
    return (err as ScenarioError).message.split('\n').map((l) => l.replace(file, 'FILE'));
  }
  return [];
}

describe('booking file', () => {
  it('reads the bundled demo rules', () => {
    const rules = loadBooking(join(import.meta.dirname, '../../stations/demo-booking.yaml'), {
      spacecraft: ['ANCHOR-G', 'MOONWREN', 'DRIFTER'].map((id) => ({ id })),
      stations: ['FRV', 'ALK', 'MDL', 'SAL', 'EQP', 'SCX'].map((id) => ({ id, antennaCount: 2 })),
    } as unknown as Pick<Scenario, 'spacecraft' | 'stations'>);
    expect(rules.spacecraft.get('DRIFTER')!.requirements[0]).toMatchObject({ kind: 'tracksPerDay', value: 1, hard: true });
    expect(rules.mechanics.size).toBe(6);
    expect(rules.maintenance).toHaveLength(1);
  });
  it('names the field of each problem', () => {
    const out = problems(
      [
        'spacecraft:',
        '  DRIFTER:',
        '    requirements: [{ tracksPerDay: 1, minutesPerDay: 30, hard: true }]',
        '  NOSUCH: {}',
        '  MOONWREN: { stations: { deny: [XXX] } }',
        'maintenance:',
        '  - { station: MDL, antenna: 3, start: "2026-03-07T08:00:00Z", end: "2026-03-07T07:00:00Z" }',
      ].join('\n'),
    );
    expect(out).toContain('FILE: spacecraft.DRIFTER.requirements[0]: needs exactly one of tracksPerDay, minutesPerDay, volumePerDayGbit, maxGapH');
    expect(problems('spacecraft:\n  NOSUCH: {}\n')).toEqual(['FILE: spacecraft.NOSUCH: is not a spacecraft of the fleet (valid: DRIFTER, MOONWREN)']);
    const later = problems('spacecraft:\n  MOONWREN: { stations: { deny: [XXX] } }\nmaintenance:\n  - { station: MDL, antenna: 3, start: "2026-03-07T08:00:00Z", end: "2026-03-07T07:00:00Z" }\n');
    expect(later).toEqual([
      'FILE: spacecraft.MOONWREN.stations.deny[0]: "XXX" is not a station of the network (valid: SAL, MDL)',
      'FILE: maintenance[0].antenna: 3 is not an antenna of MDL (valid: 0..0)',
      'FILE: maintenance[0].end: 2026-03-07T07:00:00Z is not after start 2026-03-07T08:00:00Z',
    ]);
    expect(problems('spacecraft:\n  DRIFTER: { requirements: [{ tracksPerDay: 1 }] }\n')[0]).toMatch(/requirements\[0\]: a soft requirement \(hard: false\) needs a penalty/);
    expect(problems('stations:\n  SAL: { mount: el-az, azimuthRateDegS: -1, elevationRateDegS: 1 }\n')[0]).toMatch(/^FILE: stations\.SAL\.azimuthRateDegS: /);
  });
});
