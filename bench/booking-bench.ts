/**
 * Booking benchmark (called from bench.ts): the time to book the demo week
 * with its booking rules, and a synthetic network of 200 spacecraft x 20
 * stations x 7 days with requirements on. The synthetic windows are invented:
 * per spacecraft and station 2..4 passes a day of 5..12 min at a constant
 * rate (whole windows), plus 10 slow spacecraft with one 6 h window a day at
 * 4 stations (tracks of 1..4 h); every spacecraft needs 3 tracks a day (soft;
 * every tenth hard) and a track every 8 h (soft); half carry a recorder.
 * Antennas 1..3 per station, set-up 60..180 s.
 */
import { loadScenario } from '../src/scenario/load.js';
import { demoFiles } from '../src/scenario/paths.js';
import { loadBooking } from '../src/scenario/booking.js';
import { runPlan } from '../src/plan/run.js';
import { bookNetwork } from '../src/plan/booking/solve.js';
import { solverSummary } from '../src/report/booking.js';
import { DEFAULT_RULES, type BookingRules, type SpacecraftRules } from '../src/plan/booking/types.js';
import { VOLUME_BIN_MS, type Contact, type PlanResult } from '../src/plan/types.js';
import type { Scenario } from '../src/scenario/types.js';
import { join } from 'node:path';
import { seeded as rng } from './workload.js';


function window(sc: string, st: string, aosMs: number, losMs: number, rateBps: number): Contact {
  const binStartMs = Math.floor(aosMs / VOLUME_BIN_MS) * VOLUME_BIN_MS;
  const bins: number[] = [];
  for (let b = binStartMs; b < losMs; b += VOLUME_BIN_MS) bins.push(Math.round((rateBps * (Math.min(b + VOLUME_BIN_MS, losMs) - Math.max(b, aosMs))) / 1000));
  return {
    spacecraftId: sc, stationId: st, aosMs, losMs, tcaMs: (aosMs + losMs) / 2, maxElevationDeg: 40, aosAzimuthDeg: 0, losAzimuthDeg: 180,
    aosClipped: false, losClipped: false, durationS: (losMs - aosMs) / 1000,
    link: { radioId: 'R', volumeBits: bins.reduce((s, x) => s + x, 0), dataStartMs: aosMs, dataEndMs: losMs, closedS: (losMs - aosMs) / 1000, worstMarginDb: 3, worstMarginAtMs: aosMs, worstMarginElevationDeg: 10, peakRateBps: rateBps, timeInModcodS: {}, samples: 2, binStartMs, volumeBinsBits: bins },
  };
}

export function syntheticNetwork(nSc: number, nSt: number, days: number): { plan: PlanResult; scenario: Scenario; rules: BookingRules } {
  const r = rng(14);
  const t0 = Date.UTC(2026, 2, 5);
  const span = { startMs: t0, endMs: t0 + days * 86_400_000 };
  const stations = Array.from({ length: nSt }, (_, i) => ({ id: `ST${i}`, antennaCount: 1 + (i % 3), setupTimeS: 60 + 60 * (i % 3) }));
  const spacecraft = Array.from({ length: nSc }, (_, i) => ({
    id: `SC${i}`,
    priority: 1 + (i % 4),
    ...(i % 2 === 0 ? { recorder: { capacityBits: 2e11, generationBps: 2e5 + 1e4 * (i % 7), initialFillBits: 5e10 } } : {}),
  }));
  const contacts: Contact[] = [];
  const rules = new Map<string, SpacecraftRules>();
  spacecraft.forEach((sc, i) => {
    const slow = i < 10;
    rules.set(sc.id, {
      minTrackS: slow ? 3600 : null,
      maxTrackS: slow ? 4 * 3600 : null,
      allowStations: null,
      denyStations: [],
      requirements: [
        { index: 0, kind: 'tracksPerDay', value: slow ? 1 : 3, hard: i % 10 === 0, penalty: 1, dayZone: 'UTC' },
        { index: 1, kind: 'maxGapH', value: 8, hard: false, penalty: 0.2, dayZone: 'UTC' },
      ],
    });
    for (let d = 0; d < days; d++) {
      const dayMs = t0 + d * 86_400_000;
      if (slow) {
        for (let k = 0; k < 4; k++) {
          const st = stations[(i + 5 * k) % nSt]!;
          const aos = dayMs + (k * 6 + r() * 2) * 3_600_000;
          contacts.push(window(sc.id, st.id, Math.round(aos / 1000) * 1000, Math.round(aos / 1000) * 1000 + 6 * 3_600_000 - 1_000, 2e6));
        }
        continue;
      }
      for (const st of stations) {
        const n = 2 + Math.floor(r() * 3);
        for (let k = 0; k < n; k++) {
          const aos = Math.round((dayMs + r() * 86_000_000) / 1000) * 1000;
          contacts.push(window(sc.id, st.id, aos, aos + Math.round(300 + r() * 420) * 1000, 5e7 + Math.floor(r() * 1e8)));
        }
      }
    }
  });
  const order = new Map(stations.map((s, i) => [s.id, i]));
  contacts.sort((a, b) => order.get(a.stationId)! - order.get(b.stationId)! || a.aosMs - b.aosMs || (a.spacecraftId < b.spacecraftId ? -1 : 1));
  const plan: PlanResult = {
    span, linkStepS: 10, availabilityPercent: 99.5,
    spacecraft: spacecraft.map((s) => ({ id: s.id, name: s.id, priority: s.priority })),
    stations: stations.map((s) => ({ id: s.id, name: s.id, timeZone: 'UTC' })),
    contacts, warnings: [], stats: { propagations: 0, linkSamples: 0 },
  };
  return { plan, scenario: { spacecraft, stations } as unknown as Scenario, rules: { ...DEFAULT_RULES, spacecraft: rules, mechanics: new Map(), maintenance: [], fixed: [] } };
}

function print(label: string, b: Awaited<ReturnType<typeof bookNetwork>>, windows: number): void {
  console.log(
    `  ${label}: ${(b.timeMs / 1000).toFixed(2)} s, ${windows} windows, ${b.tracks.length} tracks, objective ${b.objective.toFixed(1)}, bound ${b.bound.toFixed(1)}, ` +
      `gap ${(b.gap * 100).toFixed(2)} %, ${b.requirements.filter((r) => !r.met).length}/${b.requirements.length} requirement periods missed`,
  );
  for (const l of solverSummary(b)) console.log(`  ${l}`);
}

export async function bookingBenchmark(): Promise<void> {
  console.log('\nbooking (plan --booking): schedule time only, the plan itself excluded');
  const files = demoFiles();
  const scenario = loadScenario(files);
  const plan = runPlan(scenario, scenario.span!);
  const rules = loadBooking(join(files.networkFile, '..', 'demo-booking.yaml'), scenario);
  print('demo week (stations/demo-booking.yaml)', await bookNetwork(plan, scenario, rules), plan.contacts.length);
  const big = syntheticNetwork(200, 20, 7);
  print('200 spacecraft x 20 stations x 7 days, requirements on (target < 30 s)', await bookNetwork(big.plan, big.scenario, big.rules), big.plan.contacts.length);
}
