/**
 * Benchmark of the link engine: the synthetic 200 x 20 x 7-day case of bench.ts with an
 * invented X-band radio on every spacecraft and an invented receive chain and rain
 * climate at every station, run geometry-only and with budgets and volumes; and the
 * bundled demo week. Prints link samples, samples per second and the link engine's
 * share of the run.
 */
import { loadScenario } from '../src/scenario/load.js';
import { demoFiles } from '../src/scenario/paths.js';
import { runPlan } from '../src/plan/run.js';
import { runPlanParallel, threadsFor } from '../src/plan/parallel.js';
import { modcodTable } from '../src/link/modcod/index.js';
import type { Scenario, Span, Station, Spacecraft } from '../src/scenario/types.js';
import { syntheticFleet, syntheticStations, peakRssMb } from './bench.js';

export function syntheticScenario(spacecraft: number, stations: number, span: Span): Scenario {
  const fleet = syntheticFleet(spacecraft, span.startMs - 86_400_000);
  const { sites } = syntheticStations(stations);
  const table = [...(modcodTable('DVB-S2') ?? [])];
  const sc: Spacecraft[] = fleet.map((f, k) => ({
    id: f.id,
    name: f.id,
    priority: 1 + (k % 3),
    orbit: { kind: 'elements', sets: f.sets },
    radios: [
      {
        id: 'X',
        frequencyHz: 8.2e9,
        txPowerDbw: 3,
        txLossDb: 1,
        antenna: { kind: 'constant', gainDbi: 3 },
        polarization: 'RHCP',
        coding: { kind: 'adaptive', tableName: 'DVB-S2', table, symbolRateBaud: 10e6, rollOff: 0.35 },
        implementationLossDb: 1.5,
        requiredMarginDb: 2,
      },
    ],
  }));
  const st: Station[] = sites.map((s, k) => ({
    id: s.stationId,
    name: s.stationId,
    latitudeDeg: s.latitudeDeg,
    longitudeDeg: s.longitudeDeg,
    heightKm: s.heightKm,
    mask: { kind: 'constant', elevationDeg: 5 },
    timeZone: 'UTC',
    receiver: { kind: 'chain', dishDiameterM: 5 + (k % 4) * 2, apertureEfficiency: 0.6, receiverNoiseTempK: 80, feedLossDb: 0.3, feedPhysicalTempK: 290, antennaNoiseTempK: 15 },
    pointingErrorDeg: 0.05,
    polarization: 'RHCP',
    climate: { rainRate001MmH: 20 + (k * 7) % 80, rainHeightKm: 2 + (k % 4) * 0.8, surfaceWaterVapourDensityGM3: 7.5, surfaceTemperatureK: 288, surfacePressureHpa: 1013, nWetMedian: 50 },
    antennaCount: 1,
    setupTimeS: 60,
  }));
  return {
    spacecraft: sc,
    stations: st,
    span,
    link: { availabilityPercent: 99.5, acquisitionTimeS: 10, minDataElevationDeg: 0 },
    sources: { spacecraftFile: '(synthetic)', networkFile: '(synthetic)' },
    inputFiles: [],
    notices: [],
  };
}

function timed<T>(f: () => T): { value: T; ms: number } {
  const t0 = performance.now();
  const value = f();
  return { value, ms: performance.now() - t0 };
}

export async function linkBenchmark(spacecraft = 200, stations = 20, days = 7, stepsS: number[] = [30, 10]): Promise<void> {
  const startMs = Date.UTC(2026, 2, 2);
  const span: Span = { startMs, endMs: startMs + days * 86_400_000 };
  const scenario = syntheticScenario(spacecraft, stations, span);
  console.log(`\nlink engine: ${spacecraft} spacecraft x ${stations} stations x ${days} days (invented X-band radio, DVB-S2 ACM at 10 Msym/s)`);
  const geo = timed(() => runPlan(scenario, span, { geometryOnly: true }));
  console.log(`  geometry only          ${(geo.ms / 1000).toFixed(2).padStart(7)} s  ${geo.value.contacts.length} windows, ${geo.value.stats.propagations} propagations`);
  for (const stepS of stepsS) {
    const full = timed(() => runPlan(scenario, span, { linkStepS: stepS }));
    const linkMs = full.ms - geo.ms;
    const samples = full.value.stats.linkSamples;
    const volume = full.value.contacts.reduce((s, c) => s + (c.link?.volumeBits ?? 0), 0);
    console.log(
      `  with link, step ${String(stepS).padStart(2)} s  ${(full.ms / 1000).toFixed(2).padStart(7)} s  ${samples} link samples, ` +
        `${(samples / (linkMs / 1000) / 1e6).toFixed(2)} M samples/s, link engine adds ${((100 * linkMs) / geo.ms).toFixed(0)} % ` +
        `to geometry (share of run ${((100 * linkMs) / full.ms).toFixed(0)} %), volume ${(volume / 1e12).toFixed(2)} Tbit`,
    );
  }
  const threads = threadsFor(scenario.spacecraft.length);
  const t0 = performance.now();
  const par = await runPlanParallel(scenario, span);
  const parMs = performance.now() - t0;
  console.log(
    `  plan on ${threads} worker thread${threads === 1 ? '' : 's'} (default step): ${(parMs / 1000).toFixed(2)} s, ${par.contacts.length} windows, ` +
      `${par.stats.linkSamples} link samples`,
  );
  console.log(`  peak RSS: ${peakRssMb().toFixed(0)} MB`);
}

export function demoBenchmark(): void {
  const scenario = loadScenario(demoFiles());
  const span = scenario.span!;
  console.log(`\ndemo week (bundled invented scenario, ${scenario.spacecraft.length} spacecraft x ${scenario.stations.length} stations x 7 days)`);
  // best of seven runs each, interleaved (the machine may be shared)
  const geo = timed(() => runPlan(scenario, span, { geometryOnly: true }));
  const full = timed(() => runPlan(scenario, span));
  let geoMs = geo.ms;
  let offMs = Infinity;
  let onMs = full.ms;
  for (let i = 0; i < 7; i++) {
    geoMs = Math.min(geoMs, timed(() => runPlan(scenario, span, { geometryOnly: true })).ms);
    offMs = Math.min(offMs, timed(() => runPlan(scenario, span, { expectedVolume: false })).ms);
    onMs = Math.min(onMs, timed(() => runPlan(scenario, span)).ms);
  }
  console.log(`  geometry only: ${(geoMs / 1000).toFixed(2)} s, ${geo.value.contacts.length} windows, ${geo.value.stats.propagations} propagations`);
  console.log(
    `  plan with link (default ${full.value.linkStepS} s step): ${(onMs / 1000).toFixed(2)} s, ${full.value.stats.linkSamples} link samples, ` +
      `${full.value.stats.propagations} propagations in all`,
  );
  const linkOff = offMs - geoMs;
  const linkOn = onMs - geoMs;
  console.log(
    `  link stage (best of 7): expected volume off ${(linkOff / 1000).toFixed(2)} s, on ${(linkOn / 1000).toFixed(2)} s ` +
      `(expected volume adds ${((100 * (linkOn - linkOff)) / linkOff).toFixed(0)} % to the link stage; limit 100 %)`,
  );
}
