// The report's timeline above TIMELINE_CONTACT_LIMIT contacts: one bar per station and UTC
// day instead of one per contact, said on the page; counts and volumes per bar add up to
// the plan's (checked against a plain recount of the invented contacts below).
import { describe, expect, it } from 'vitest';
import { renderTimeline, TIMELINE_CONTACT_LIMIT } from '../../src/report/html/timeline.js';
import type { Contact, PlanResult } from '../../src/plan/types.js';

const DAY_MS = 86_400_000;
const startMs = Date.UTC(2026, 2, 2);

function plan(contactCount: number): PlanResult {
  const contacts: Contact[] = [];
  for (let i = 0; i < contactCount; i++) {
    const aosMs = startMs + ((i * 7919) % (7 * 86_400)) * 1000;
    contacts.push({
      spacecraftId: `S${i % 50}`,
      stationId: `G${i % 3}`,
      aosMs,
      losMs: aosMs + 300_000,
      tcaMs: aosMs + 150_000,
      maxElevationDeg: 40,
      aosAzimuthDeg: 10,
      losAzimuthDeg: 190,
      aosElevationDeg: 5,
      losElevationDeg: 5,
      aosClipped: false,
      losClipped: false,
      losTrackEnded: false,
      durationS: 300,
    });
  }
  return {
    span: { startMs, endMs: startMs + 7 * DAY_MS },
    linkStepS: 30,
    availabilityPercent: 99.5,
    spacecraft: Array.from({ length: 50 }, (_, i) => ({ id: `S${i}`, name: `S${i}`, priority: 1 })),
    stations: [0, 1, 2].map((i) => ({ id: `G${i}`, name: `G${i}`, timeZone: 'UTC' })),
    contacts,
    warnings: [],
    stats: { propagations: 0, linkSamples: 0 },
  };
}

describe('timeline above the contact limit', () => {
  it('draws one bar per contact up to the limit', () => {
    const svg = renderTimeline(plan(100));
    expect(svg.match(/class="contact-bar/g)?.length).toBe(100);
  });

  it('draws station-day bars above it, says so, and the bars add up to every contact', () => {
    const p = plan(TIMELINE_CONTACT_LIMIT + 1);
    const svg = renderTimeline(p);
    expect(svg).not.toMatch(/class="contact-bar/);
    expect(svg).toMatch(new RegExp(`${p.contacts.length} contacts: more than ${TIMELINE_CONTACT_LIMIT}, so the timeline shows one bar per station and UTC day`));
    const counts = [...svg.matchAll(/data-contacts="(\d+)"/g)].map((m) => Number(m[1]));
    expect(counts.length).toBeLessThanOrEqual(3 * 7);
    expect(counts.reduce((a, b) => a + b, 0)).toBe(p.contacts.length);
    expect(svg.length).toBeLessThan(50_000);
  });
});
