/**
 * Invented, seeded workloads written as scenario files (a spacecraft file, a TLE file and a
 * network file), so the benchmark runs them through the CLI exactly as a user would:
 * - a LEO constellation (invented elements spread over 400..1400 km and 30..99 deg, an
 *   invented X-band DVB-S2 ACM radio each) over invented stations with a rain climate;
 * - the mixed case: LEO, 12-hour HEO (e = 0.72) and 12-hour MEO spacecraft, geometry only.
 * Nothing here is a real spacecraft or a real station.
 */
import { writeFileSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';

const MU_KM3_S2 = 398600.8; // WGS-72, only to invent mean motions
const EARTH_RADIUS_KM = 6378.135;

/** A small seeded generator (mulberry32), so every run writes the same files. */
export function seeded(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** TLE line checksum: digits add their value, '-' adds 1, modulo 10. */
export function checksum(line: string): number {
  let sum = 0;
  for (const ch of line) {
    if (ch >= '0' && ch <= '9') sum += ch.charCodeAt(0) - 48;
    else if (ch === '-') sum += 1;
  }
  return sum % 10;
}

interface Elements {
  catalogNumber: number;
  incDeg: number;
  raanDeg: number;
  eccentricity: number;
  argPerigeeDeg: number;
  meanAnomalyDeg: number;
  revPerDay: number;
}

/** Two TLE lines for invented elements at `epochMs`. */
export function tleLines(e: Elements, epochMs: number): [string, string] {
  const year = new Date(epochMs).getUTCFullYear();
  const doy = (epochMs - Date.UTC(year, 0, 1)) / 86_400_000 + 1;
  const cat = String(e.catalogNumber).padStart(5, '0');
  const f = (v: number, w: number, d: number): string => v.toFixed(d).padStart(w, ' ');
  const l1 = `1 ${cat}U 26001A   ${String(year % 100).padStart(2, '0')}${doy.toFixed(8).padStart(12, '0')}  .00000000  00000-0  10000-3 0  999`;
  const ecc = Math.round(e.eccentricity * 1e7).toString().padStart(7, '0');
  const l2 = `2 ${cat} ${f(e.incDeg, 8, 4)} ${f(e.raanDeg, 8, 4)} ${ecc} ${f(e.argPerigeeDeg, 8, 4)} ${f(e.meanAnomalyDeg, 8, 4)} ${f(e.revPerDay, 11, 8)}    1`;
  return [l1 + checksum(l1), l2 + checksum(l2)];
}

const revPerDayAt = (aKm: number): number => (Math.sqrt(MU_KM3_S2 / aKm ** 3) * 86400) / (2 * Math.PI);

const X_RADIO = {
  id: 'X',
  frequencyMHz: 8200,
  powerDbw: 3,
  txLossDb: 1,
  antenna: { gainDbi: 3 },
  polarization: 'RHCP',
  coding: { adaptive: true, table: 'DVB-S2', symbolRateBaud: 10_000_000, rollOff: 0.35 },
  implementationLossDb: 1.5,
  requiredMarginDb: 2,
};

export interface WorkloadFiles {
  spacecraftFile: string;
  networkFile: string;
}

function stations(count: number, rnd: () => number): Record<string, unknown>[] {
  const out: Record<string, unknown>[] = [];
  for (let k = 0; k < count; k++) {
    out.push({
      id: `GS-${String(k).padStart(2, '0')}`,
      name: `Invented station ${k}`,
      latitudeDeg: Number((-70 + (145 * k) / Math.max(1, count - 1)).toFixed(3)),
      longitudeDeg: Number((-180 + ((k * 97 + rnd() * 10) % 360)).toFixed(3)),
      heightM: Math.round(rnd() * 1500),
      maskDeg: 5,
      timeZone: 'UTC',
      antenna: { dishDiameterM: 5 + (k % 4) * 2, apertureEfficiency: 0.6, pointingErrorDeg: 0.05, polarization: 'RHCP', setupTimeS: 60 },
      receiver: { noiseTempK: 80, feedLossDb: 0.3, feedTempK: 290, antennaNoiseK: 15 },
      climate: {
        rainRate001MmH: 20 + ((k * 7) % 80),
        rainHeightKm: 2 + (k % 4) * 0.8,
        waterVapourDensityGM3: 7.5,
        temperatureK: 288,
        pressureHpa: 1013,
        nWetMedian: 50,
        cloudLiquidWaterKgM2: 0.3,
      },
    });
  }
  return out;
}

function writeScenario(dir: string, fromIso: string, days: number, craft: { entry: Record<string, unknown>; tle: [string, string]; name: string }[], net: Record<string, unknown>[]): WorkloadFiles {
  mkdirSync(dir, { recursive: true });
  const tleText = craft.map((c) => `${c.name}\n${c.tle[0]}\n${c.tle[1]}\n`).join('');
  writeFileSync(join(dir, 'fleet.tle'), tleText);
  const spacecraftFile = join(dir, 'fleet.json');
  writeFileSync(
    spacecraftFile,
    JSON.stringify(
      {
        mission: 'Invented benchmark fleet',
        window: { from: fromIso, days },
        link: { availabilityPercent: 99.5, acquisitionTimeS: 10, minDataElevationDeg: 0 },
        spacecraft: craft.map((c) => c.entry),
      },
      null,
      1,
    ),
  );
  const networkFile = join(dir, 'network.json');
  writeFileSync(networkFile, JSON.stringify({ network: 'Invented benchmark network', stations: net }, null, 1));
  return { spacecraftFile, networkFile };
}

/** The LEO constellation: `spacecraft` invented LEO spacecraft with an X-band ACM radio, `stationCount` stations. */
export function writeConstellation(dir: string, spacecraft: number, stationCount: number, days: number, seed = 10): WorkloadFiles {
  const rnd = seeded(seed);
  const fromMs = Date.UTC(2026, 2, 2);
  const epochMs = fromMs - 86_400_000;
  const craft = [];
  for (let k = 0; k < spacecraft; k++) {
    const altKm = 400 + rnd() * 1000;
    const el: Elements = {
      catalogNumber: 70000 + k,
      incDeg: 30 + rnd() * 69,
      raanDeg: rnd() * 360,
      eccentricity: 0.0001 + rnd() * 0.002,
      argPerigeeDeg: rnd() * 360,
      meanAnomalyDeg: rnd() * 360,
      revPerDay: revPerDayAt(EARTH_RADIUS_KM + altKm),
    };
    const id = `LEO-${String(k).padStart(4, '0')}`;
    craft.push({
      name: id,
      tle: tleLines(el, epochMs),
      entry: { id, priority: 1 + (k % 3), orbit: { tleFile: 'fleet.tle', catalogNumber: el.catalogNumber }, radios: [X_RADIO] },
    });
  }
  return writeScenario(dir, new Date(fromMs).toISOString(), days, craft, stations(stationCount, rnd));
}

/** The mixed case: 5 spacecraft (3 LEO, a 12 h HEO with e = 0.72, a 12 h MEO), 5 stations, no radios. */
export function writeMixed(dir: string, seed = 5): WorkloadFiles {
  const rnd = seeded(seed);
  const fromMs = Date.UTC(2026, 2, 2);
  const epochMs = fromMs - 86_400_000;
  const twelveHourKm = Math.cbrt(MU_KM3_S2 * (43_082 / (2 * Math.PI)) ** 2); // period: half a sidereal day, 43,082 s
  const orbits: (Omit<Elements, 'catalogNumber'> & { id: string })[] = [
    { id: 'MIX-LEO-A', incDeg: 97.6, raanDeg: 40, eccentricity: 0.001, argPerigeeDeg: 90, meanAnomalyDeg: 10, revPerDay: revPerDayAt(EARTH_RADIUS_KM + 560) },
    { id: 'MIX-LEO-B', incDeg: 51.6, raanDeg: 200, eccentricity: 0.0005, argPerigeeDeg: 30, meanAnomalyDeg: 120, revPerDay: revPerDayAt(EARTH_RADIUS_KM + 420) },
    { id: 'MIX-LEO-C', incDeg: 70, raanDeg: 310, eccentricity: 0.002, argPerigeeDeg: 200, meanAnomalyDeg: 250, revPerDay: revPerDayAt(EARTH_RADIUS_KM + 1100) },
    { id: 'MIX-HEO', incDeg: 63.4, raanDeg: 120, eccentricity: 0.72, argPerigeeDeg: 270, meanAnomalyDeg: 0, revPerDay: revPerDayAt(twelveHourKm) },
    { id: 'MIX-MEO', incDeg: 55, raanDeg: 15, eccentricity: 0.005, argPerigeeDeg: 0, meanAnomalyDeg: 60, revPerDay: revPerDayAt(twelveHourKm) },
  ];
  const craft = orbits.map((o, k) => {
    const el: Elements = { ...o, catalogNumber: 71000 + k };
    return { name: o.id, tle: tleLines(el, epochMs), entry: { id: o.id, orbit: { tleFile: 'fleet.tle', catalogNumber: el.catalogNumber } } };
  });
  return writeScenario(dir, new Date(fromMs).toISOString(), 7, craft, stations(5, rnd));
}
