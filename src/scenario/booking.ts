/**
 * Reads a booking file (JSON or YAML): the rules the network books by. Every
 * problem names the file and the field; nothing is returned half-read.
 *
 *   booking:        { gridS, maxCandidatesPerWindow, oneStationAtATime, recorderAware, timeLimitS, mipRelGap, mipMaxVariables }
 *   spacecraft:     { ID: { track: { minS, maxS }, stations: { allow: [...] } | { deny: [...] },
 *                           requirements: [ { tracksPerDay | minutesPerDay | volumePerDayGbit | maxGapH: N,
 *                                             hard: bool, penalty: N, dayZone: 'UTC' | IANA } ] } }
 *   stations:       { ID: { mount: el-az, azimuthRateDegS, elevationRateDegS, azimuthAccelDegS2, elevationAccelDegS2,
 *                           cableWrapDeg: [min, max], elevationLimitsDeg: [min, max], trackingToleranceDeg }
 *                       | { mount: x-y, xRateDegS, yRateDegS, xAccelDegS2, yAccelDegS2, xyLimitDeg, ... } }
 *   maintenance:    [ { station, antenna?, start, end, label? } ]
 *   fixedBookings:  [ { station, antenna?, start, end, label? } ]
 */
import { DateTime } from 'luxon';
import { z } from 'zod';
import { ScenarioError, type Problem } from '../errors.js';
import { DEFAULT_RULES, type AntennaMechanics, type BookingRules, type Requirement, type RequirementKind, type SpacecraftRules } from '../plan/booking/types.js';
import { parseStructured, readText, zodProblems } from './read.js';
import type { Scenario } from './types.js';

const pos = z.number().positive();
const nonNeg = z.number().nonnegative();
const iso = z.string().refine((s) => DateTime.fromISO(s, { zone: 'utc' }).isValid, 'is not an ISO 8601 time (e.g. 2026-03-02T06:00:00Z)');
const zone = z.string().refine((s) => s === 'UTC' || DateTime.local().setZone(s).isValid, 'is not UTC or an IANA time zone');

const requirementSchema = z
  .strictObject({
    tracksPerDay: z.number().int().positive().optional(),
    minutesPerDay: pos.optional(),
    volumePerDayGbit: pos.optional(),
    maxGapH: pos.optional(),
    hard: z.boolean().default(false),
    penalty: nonNeg.optional(),
    dayZone: zone.default('UTC'),
  })
  .refine((r) => [r.tracksPerDay, r.minutesPerDay, r.volumePerDayGbit, r.maxGapH].filter((v) => v !== undefined).length === 1, 'needs exactly one of tracksPerDay, minutesPerDay, volumePerDayGbit, maxGapH')
  .refine((r) => r.hard || r.penalty !== undefined, 'a soft requirement (hard: false) needs a penalty (value lost per missing unit)');

const spacecraftSchema = z.strictObject({
  track: z
    .strictObject({ minS: pos, maxS: pos })
    .refine((t) => t.maxS >= t.minS, 'maxS must be >= minS')
    .optional(),
  stations: z.union([z.strictObject({ allow: z.array(z.string()).min(1) }), z.strictObject({ deny: z.array(z.string()) })]).optional(),
  requirements: z.array(requirementSchema).default([]),
});

const common = {
  cableWrapDeg: z.tuple([z.number(), z.number()]).refine((w) => w[1] - w[0] >= 360, 'must span at least 360 deg').default([-270, 270]),
  elevationLimitsDeg: z.tuple([z.number().min(-5).max(90), z.number().min(0).max(90)]).refine((e) => e[1] > e[0], 'max must be above min').default([0, 90]),
  trackingToleranceDeg: pos.default(0.1),
};
const mechanicsSchema = z.discriminatedUnion('mount', [
  z.strictObject({ mount: z.literal('el-az'), azimuthRateDegS: pos, elevationRateDegS: pos, azimuthAccelDegS2: pos.optional(), elevationAccelDegS2: pos.optional(), ...common }),
  z.strictObject({ mount: z.literal('x-y'), xRateDegS: pos, yRateDegS: pos, xAccelDegS2: pos.optional(), yAccelDegS2: pos.optional(), xyLimitDeg: pos.max(90).default(85), ...common }),
]);

const periodSchema = z.strictObject({ station: z.string(), antenna: z.number().int().nonnegative().optional(), start: iso, end: iso, label: z.string().optional() });

export const bookingFileSchema = z.strictObject({
  booking: z
    .strictObject({
      gridS: z.number().int().positive().max(3600).optional(),
      maxCandidatesPerWindow: z.number().int().min(4).max(5000).optional(),
      oneStationAtATime: z.boolean().optional(),
      recorderAware: z.boolean().optional(),
      timeLimitS: pos.max(3600).optional(),
      mipRelGap: nonNeg.max(1).optional(),
      mipMaxVariables: z.number().int().positive().optional(),
    })
    .default({}),
  spacecraft: z.record(z.string(), spacecraftSchema).default({}),
  stations: z.record(z.string(), mechanicsSchema).default({}),
  maintenance: z.array(periodSchema).default([]),
  fixedBookings: z.array(periodSchema).default([]),
});

const ms = (s: string) => DateTime.fromISO(s, { zone: 'utc' }).toMillis();

/** Reads and checks a booking file against the scenario's spacecraft and stations; throws ScenarioError. */
export function loadBooking(file: string, scenario: Pick<Scenario, 'spacecraft' | 'stations'>): BookingRules {
  const problems: Problem[] = [];
  const text = readText(file);
  if (!text.ok) throw new ScenarioError(text.problems);
  const data = parseStructured(text.value, file);
  if (!data.ok) throw new ScenarioError(data.problems);
  const parsed = bookingFileSchema.safeParse(data.value);
  if (!parsed.success) throw new ScenarioError(zodProblems(file, data.value, parsed.error.issues, [], text.value));
  const doc = parsed.data;
  const scIds = new Set(scenario.spacecraft.map((s) => s.id));
  const stations = new Map(scenario.stations.map((s) => [s.id, s]));
  const stationList = [...stations.keys()].join(', ');
  const needStation = (id: string, path: string) => {
    if (!stations.has(id)) problems.push({ file, path, message: `"${id}" is not a station of the network (valid: ${stationList})` });
  };
  const spacecraft = new Map<string, SpacecraftRules>();
  for (const [id, s] of Object.entries(doc.spacecraft)) {
    if (!scIds.has(id)) {
      problems.push({ file, path: `spacecraft.${id}`, message: `is not a spacecraft of the fleet (valid: ${[...scIds].join(', ')})` });
      continue;
    }
    const st = s.stations;
    const allow = st && 'allow' in st ? st.allow : null;
    const deny = st && 'deny' in st ? st.deny : [];
    (allow ?? []).forEach((x, i) => needStation(x, `spacecraft.${id}.stations.allow[${i}]`));
    deny.forEach((x, i) => needStation(x, `spacecraft.${id}.stations.deny[${i}]`));
    const requirements: Requirement[] = s.requirements.map((r, index) => {
      const kind: RequirementKind = r.tracksPerDay !== undefined ? 'tracksPerDay' : r.minutesPerDay !== undefined ? 'minutesPerDay' : r.volumePerDayGbit !== undefined ? 'volumePerDayGbit' : 'maxGapH';
      const value = r.tracksPerDay ?? r.minutesPerDay ?? r.volumePerDayGbit ?? r.maxGapH ?? 0;
      return { index, kind, value, hard: r.hard, penalty: r.penalty ?? 0, dayZone: r.dayZone };
    });
    spacecraft.set(id, { minTrackS: s.track?.minS ?? null, maxTrackS: s.track?.maxS ?? null, allowStations: allow, denyStations: deny, requirements });
  }
  const mechanics = new Map<string, AntennaMechanics>();
  for (const [id, m] of Object.entries(doc.stations)) {
    needStation(id, `stations.${id}`);
    const base = { elevationMinDeg: m.elevationLimitsDeg[0], elevationMaxDeg: m.elevationLimitsDeg[1], cableWrapDeg: m.cableWrapDeg as [number, number], trackingToleranceDeg: m.trackingToleranceDeg };
    mechanics.set(
      id,
      m.mount === 'el-az'
        ? { mount: 'el-az', axis1RateDegS: m.azimuthRateDegS, axis2RateDegS: m.elevationRateDegS, axis1AccelDegS2: m.azimuthAccelDegS2 ?? Infinity, axis2AccelDegS2: m.elevationAccelDegS2 ?? Infinity, xyLimitDeg: 90, ...base }
        : { mount: 'x-y', axis1RateDegS: m.xRateDegS, axis2RateDegS: m.yRateDegS, axis1AccelDegS2: m.xAccelDegS2 ?? Infinity, axis2AccelDegS2: m.yAccelDegS2 ?? Infinity, xyLimitDeg: m.xyLimitDeg, ...base },
    );
  }
  const periods = (list: typeof doc.maintenance, key: string) =>
    list.map((p, i) => {
      const path = `${key}[${i}]`;
      needStation(p.station, `${path}.station`);
      const count = stations.get(p.station)?.antennaCount ?? 1;
      if (p.antenna !== undefined && p.antenna >= count) problems.push({ file, path: `${path}.antenna`, message: `${p.antenna} is not an antenna of ${p.station} (valid: 0..${count - 1})` });
      if (ms(p.end) <= ms(p.start)) problems.push({ file, path: `${path}.end`, message: `${p.end} is not after start ${p.start}` });
      return { stationId: p.station, antenna: p.antenna ?? null, startMs: ms(p.start), endMs: ms(p.end), label: p.label ?? `${key} ${i + 1}` };
    });
  const maintenance = periods(doc.maintenance, 'maintenance');
  const fixed = periods(doc.fixedBookings, 'fixedBookings').map((p) => ({ ...p, antenna: p.antenna ?? 0 }));
  if (problems.length > 0) throw new ScenarioError(problems);
  const b = doc.booking;
  const d = DEFAULT_RULES;
  return {
    gridS: b.gridS ?? d.gridS,
    maxCandidatesPerWindow: b.maxCandidatesPerWindow ?? d.maxCandidatesPerWindow,
    oneStationAtATime: b.oneStationAtATime ?? d.oneStationAtATime,
    recorderAware: b.recorderAware ?? d.recorderAware,
    timeLimitS: b.timeLimitS ?? d.timeLimitS,
    mipRelGap: b.mipRelGap ?? d.mipRelGap,
    mipMaxVariables: b.mipMaxVariables ?? d.mipMaxVariables,
    spacecraft,
    mechanics,
    maintenance,
    fixed,
  };
}
