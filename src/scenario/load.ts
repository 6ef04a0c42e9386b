/**
 * Loads and validates a scenario: a spacecraft file and a network file.
 * Every problem in both files is collected and thrown together as one
 * ScenarioError; nothing after this module reads a file.
 *
 * Defaults (documented in README "Scenario files"): priority 1; radio
 * transmit loss 0 dB, polarisation RHCP, implementation loss 1 dB, required
 * margin 3 dB; station mask 5 deg, pointing error 0 deg, one antenna, no set-up
 * time; feed loss 0 dB at 290 K, antenna noise 10 K; stated G/T referred to
 * 90 deg elevation; climate values left out are read from the ITU-R maps for
 * the site later (src/link/climate/station.ts); availability 99.5 %.
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { DateTime } from 'luxon';
import { ScenarioError, appendAll, type Problem } from '../errors.js';
import { readText, parseStructured, resolveBeside, zodProblems } from './read.js';
import {
  spacecraftFileSchema,
  networkFileSchema,
  spacecraftSchema,
  orbitSchema,
  radioSchema,
  stationSchema,
  type SpacecraftEntry,
  type StationEntry,
  type RadioEntry,
} from './schema.js';
import { parseTleText } from './tle.js';
import { parseOmm } from './omm.js';
import { parseOem } from './oem.js';
import { MOON_MEAN_RADIUS_KM } from '../geometry/targets/moon-ephemeris.js';
import { resolveCoding } from './coding.js';
import { MIN_PERIGEE_HEIGHT_KM, meanMotionAndEccentricity, perigeeProblem } from './elements-common.js';
import { sgp4MeanElements, sunSynchronousInclinationDeg } from '../geometry/mean-elements.js';
import { WGS84_EQUATORIAL_RADIUS_KM } from '../geometry/earth.js';
import { toFeeds } from './feeds.js';
import type { ElementSet, InputFile, Notice, OrbitSource, Radio, Scenario, Spacecraft, Station, Span, Mask, Receiver, TxAntenna } from './types.js';

export interface ScenarioFiles {
  spacecraftFile: string;
  networkFile: string;
}

export const DEFAULT_AVAILABILITY_PERCENT = 99.5;

/**
 * Element-set files read and parsed once per load, by kind and resolved path: a fleet of a
 * thousand spacecraft naming one TLE file by catalogue number would otherwise parse it a
 * thousand times. Emptied when the load ends. (Element sets are plain data, never changed
 * after parsing, so spacecraft may share them.)
 */
const elementFiles = new Map<string, { text: ReturnType<typeof readText>; parsed?: ReturnType<typeof parseTleText> | ReturnType<typeof parseOmm> }>();

function elementFile(
  kind: 'tle' | 'omm',
  target: string,
  parse: (text: string) => ReturnType<typeof parseTleText> | ReturnType<typeof parseOmm>,
): { text: ReturnType<typeof readText>; parsed?: ReturnType<typeof parseTleText> | ReturnType<typeof parseOmm> } {
  const key = `${kind}:${target}`;
  let e = elementFiles.get(key);
  if (!e) {
    const text = readText(target, '');
    e = text.ok ? { text, parsed: parse(text.value) } : { text };
    elementFiles.set(key, e);
  }
  return e;
}

export function loadScenario(files: ScenarioFiles): Scenario {
  elementFiles.clear();
  try {
    return loadScenarioOnce(files);
  } finally {
    elementFiles.clear();
  }
}

function loadScenarioOnce(files: ScenarioFiles): Scenario {
  const problems: Problem[] = [];
  const notices: Notice[] = [];
  const referenced: string[] = [];
  const fleet = loadFleet(files.spacecraftFile, problems, notices, referenced);
  const stations = loadNetwork(files.networkFile, problems, notices);
  if (problems.length > 0 || fleet === undefined || stations === undefined) throw new ScenarioError(problems);
  return {
    spacecraft: fleet.spacecraft,
    stations,
    ...(fleet.span ? { span: fleet.span } : {}),
    link: fleet.link,
    sources: { spacecraftFile: files.spacecraftFile, networkFile: files.networkFile },
    inputFiles: [files.spacecraftFile, files.networkFile, ...new Set(referenced)].map(fingerprint),
    notices,
  };
}

function readData(file: string, problems: Problem[]): { data: unknown; text: string } | undefined {
  const text = readText(file);
  if (!text.ok) {
    appendAll(problems, text.problems);
    return undefined;
  }
  const data = parseStructured(text.value, file);
  if (!data.ok) {
    appendAll(problems, data.problems);
    return undefined;
  }
  return { data: data.value, text: text.value };
}

/** A plain object's field, or undefined (for checking the parts of a file that failed as a whole). */
function field(data: unknown, key: string): unknown {
  return data !== null && typeof data === 'object' && !Array.isArray(data) ? (data as Record<string, unknown>)[key] : undefined;
}

/**
 * All problems at once: when the file as a whole fails its field checks, the
 * deeper checks (window time, element sets, coding names) still run on every
 * part that passes on its own, so one pass reports both kinds.
 */
function checkValidPartsOfFleet(data: unknown, file: string, problems: Problem[]): void {
  const from = field(field(data, 'window'), 'from');
  if (typeof from === 'string' && from !== '' && parseInstant(from) === undefined) {
    problems.push({ file, path: 'window.from', message: `${JSON.stringify(from)} is not an ISO 8601 time from ${INSTANT_RANGE_TEXT} (e.g. "2026-03-05T00:00:00Z")` });
  }
  const list = field(data, 'spacecraft');
  if (!Array.isArray(list)) return;
  list.forEach((entry: unknown, i) => {
    const path = `spacecraft[${i}]`;
    const whole = spacecraftSchema.safeParse(entry);
    if (whole.success) {
      toSpacecraft(whole.data, file, path, problems);
      return;
    }
    const orbit = orbitSchema.safeParse(field(entry, 'orbit'));
    if (orbit.success) toOrbit(orbit.data, file, `${path}.orbit`, problems);
    const radios = field(entry, 'radios');
    if (Array.isArray(radios)) {
      radios.forEach((r: unknown, j) => {
        const radio = radioSchema.safeParse(r);
        if (radio.success) toRadio(radio.data, file, `${path}.radios[${j}]`, problems);
      });
    }
  });
}

function checkValidPartsOfNetwork(data: unknown, file: string, problems: Problem[]): void {
  const list = field(data, 'stations');
  if (!Array.isArray(list)) return;
  list.forEach((entry: unknown, i) => {
    const station = stationSchema.safeParse(entry);
    if (station.success) toStation(station.data, file, `stations[${i}]`, problems);
  });
}

function loadFleet(file: string, problems: Problem[], notices: Notice[], referenced: string[]): Pick<Scenario, 'spacecraft' | 'span' | 'link'> | undefined {
  const read = readData(file, problems);
  if (read === undefined) return undefined;
  const { data, text } = read;
  const parsed = spacecraftFileSchema.safeParse(data);
  if (!parsed.success) {
    appendAll(problems, zodProblems(file, data, parsed.error.issues, [], text));
    checkValidPartsOfFleet(data, file, problems);
    return undefined;
  }
  const doc = parsed.data;
  const before = problems.length;
  checkUnique(doc.spacecraft.map((s) => s.id), file, 'spacecraft', problems);
  const spacecraft = doc.spacecraft.map((entry, i) => toSpacecraft(entry, file, `spacecraft[${i}]`, problems, notices, referenced));
  let span: Span | undefined;
  if (doc.window) {
    const from = parseInstant(doc.window.from);
    if (from === undefined) {
      problems.push({ file, path: 'window.from', message: `${JSON.stringify(doc.window.from)} is not an ISO 8601 time from ${INSTANT_RANGE_TEXT} (e.g. "2026-03-05T00:00:00Z")` });
    } else {
      span = { startMs: from, endMs: from + doc.window.days * 86_400_000 };
    }
  }
  if (problems.length > before) return undefined;
  return {
    spacecraft,
    ...(span ? { span } : {}),
    link: {
      availabilityPercent: doc.link?.availabilityPercent ?? DEFAULT_AVAILABILITY_PERCENT,
      acquisitionTimeS: doc.link?.acquisitionTimeS ?? 0,
      minDataElevationDeg: doc.link?.minDataElevationDeg ?? -5,
    },
  };
}

/** An input file's SHA-256 and size, for the report's provenance (read again: the bytes as they are on disk). */
function fingerprint(path: string): InputFile {
  const bytes = readFileSync(path);
  return { path, sha256: createHash('sha256').update(bytes).digest('hex'), bytes: bytes.length };
}

/**
 * Instants the program accepts: from the first element sets (1957) to the end of
 * 2099 (TLE epoch years run 1957..2056; a window far beyond any element set is
 * refused by the element-set age limit anyway). Bounding dates here keeps every
 * later date computation on valid dates.
 */
export const MIN_INSTANT_MS = Date.UTC(1957, 0, 1);
export const MAX_INSTANT_MS = Date.UTC(2100, 0, 1);
export const INSTANT_RANGE_TEXT = '1957-01-01 to 2099-12-31';

/** "YYYY-MM-DDTHH:MM:SS[.f...]" with "Z" or no zone: the common form, read without luxon. */
const PLAIN_UTC_INSTANT_RE = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2}):(\d{2})(?:\.(\d{1,9}))?Z?$/;

/**
 * parseInstant of a plain UTC instant, or undefined to ask luxon: luxon's own arithmetic for
 * the milliseconds (floor(parseFloat("0." + fraction) * 1000), luxon 3.7.2 parseMillis) and
 * Date.UTC on a date and time that are valid as given, inside 1957..2099. It spares a small
 * run luxon's first call, whose system-locale look-up loads the ICU date data (about 40 ms).
 */
function plainUtcInstantMs(text: string): number | undefined {
  const m = PLAIN_UTC_INSTANT_RE.exec(text);
  if (m === null) return undefined;
  const year = Number(m[1]);
  const month = Number(m[2]);
  const day = Number(m[3]);
  const hour = Number(m[4]);
  const minute = Number(m[5]);
  const second = Number(m[6]);
  if (year < 1957 || year > 2099 || month < 1 || month > 12 || day < 1 || hour > 23 || minute > 59 || second > 59) return undefined;
  if (day > new Date(Date.UTC(year, month, 0)).getUTCDate()) return undefined;
  const ms = m[7] === undefined ? 0 : Math.floor(parseFloat(`0.${m[7]}`) * 1000);
  return Date.UTC(year, month - 1, day, hour, minute, second, ms);
}

/** ISO 8601 instant to epoch ms; a time without a zone is UTC; only 1957..2099. */
export function parseInstant(text: string): number | undefined {
  const plain = plainUtcInstantMs(text);
  if (plain !== undefined) return plain;
  const dt = DateTime.fromISO(text, { zone: 'utc', setZone: true });
  // Real UTC offsets run from -12:00 to +14:00.
  if (!dt.isValid || dt.offset < -12 * 60 || dt.offset > 14 * 60) return undefined;
  const ms = dt.toMillis();
  return ms >= MIN_INSTANT_MS && ms < MAX_INSTANT_MS ? ms : undefined;
}

function checkUnique(ids: string[], file: string, path: string, problems: Problem[]): void {
  const seen = new Map<string, number>();
  ids.forEach((id, i) => {
    const first = seen.get(id);
    if (first !== undefined) {
      problems.push({ file, path: `${path}[${i}].id`, message: `"${id}" is already used by ${path}[${first}]; ids must be unique` });
    } else seen.set(id, i);
  });
}

function toSpacecraft(entry: SpacecraftEntry, file: string, path: string, problems: Problem[], notices: Notice[] = [], referenced: string[] = []): Spacecraft {
  const orbit = toOrbit(entry.orbit, file, `${path}.orbit`, problems, notices, referenced);
  const radios = (entry.radios ?? []).map((r, j) => toRadio(r, file, `${path}.radios[${j}]`, problems));
  checkUnique((entry.radios ?? []).map((r) => r.id), file, `${path}.radios`, problems);
  if (entry.dataRadio !== undefined) {
    // the data downlink goes first: every stage takes radios[0] as the data downlink
    const k = radios.findIndex((r) => r.id === entry.dataRadio);
    if (k < 0) problems.push({ file, path: `${path}.dataRadio`, message: `"${entry.dataRadio}" is not one of its radios (${radios.map((r) => r.id).join(', ') || 'none'})` });
    else radios.unshift(...radios.splice(k, 1));
  }
  return {
    id: entry.id,
    name: entry.name ?? entry.id,
    priority: entry.priority ?? 1,
    orbit,
    radios,
    ...(entry.recorder
      ? {
          recorder: {
            capacityBits: entry.recorder.capacityGbit * 1e9,
            generationBps: entry.recorder.generationMbps * 1e6,
            initialFillBits: (entry.recorder.initialFillGbit ?? 0) * 1e9,
            ...(entry.recorder.duty ? { duty: { onS: entry.recorder.duty.onS, offS: entry.recorder.duty.offS } } : {}),
          },
        }
      : {}),
  };
}

function toOrbit(orbit: SpacecraftEntry['orbit'], file: string, path: string, problems: Problem[], notices: Notice[] = [], referenced: string[] = []): OrbitSource {
  if (orbit.moon) return { kind: 'moon' };
  if (orbit.sky) return { kind: 'fixedSky', ...orbit.sky };
  if (orbit.lunarSite) {
    const ls = orbit.lunarSite;
    return {
      kind: 'lunarSite',
      site: {
        latitudeDeg: ls.latitudeDeg,
        longitudeDeg: ls.longitudeDeg,
        heightKm: ls.heightM / 1000,
        mask: toMask(ls.maskDeg ?? 0, ls.horizon, file, `${path}.lunarSite`, problems),
      },
    };
  }
  if (orbit.lunarOrbit) {
    const lo = orbit.lunarOrbit;
    const epochMs = parseInstant(lo.epoch);
    if (epochMs === undefined) {
      problems.push({ file, path: `${path}.lunarOrbit.epoch`, message: `${JSON.stringify(lo.epoch)} is not an ISO 8601 time from ${INSTANT_RANGE_TEXT}` });
    }
    const periKm = lo.semiMajorAxisKm * (1 - lo.eccentricity) - MOON_MEAN_RADIUS_KM;
    if (periKm < 10) {
      problems.push({ file, path: `${path}.lunarOrbit`, message: `pericentre ${periKm.toFixed(1)} km above the mean lunar radius; valid: >= 10 km` });
    }
    const { epoch: _e, ...rest } = lo;
    return { kind: 'lunarOrbit', elements: { ...rest, epochMs: epochMs ?? 0, grazingMarginKm: orbit.grazingMarginKm ?? 0 } };
  }
  if (orbit.oemFile !== undefined) {
    const target = resolveBeside(file, orbit.oemFile);
    referenced.push(target);
    const empty = { origin: target, objectName: '', segments: [] };
    const text = readText(target, '');
    if (!text.ok) {
      appendAll(problems, text.problems.map((p) => ({ ...p, message: `${p.message} (named by ${file}: ${path}.oemFile)` })));
      return { kind: 'ephemeris', ephemeris: empty, grazingMarginKm: 0 };
    }
    const read = parseOem(text.value, target);
    appendAll(problems, read.problems.map((p) => ({ ...p, message: `${p.message} (named by ${file}: ${path}.oemFile)` })));
    return { kind: 'ephemeris', ephemeris: read.ephemeris ?? empty, grazingMarginKm: orbit.grazingMarginKm ?? 0 };
  }
  let sets: ElementSet[] = [];
  if (orbit.planned !== undefined) {
    const set = plannedElementSet(orbit.planned, file, `${path}.planned`, problems);
    if (set) {
      sets = [set];
      notices.push({
        level: 'note',
        message: `${file}: ${path}.planned: SGP4 mean elements from the planned orbit: ${set.omm!.meanMotionRevPerDay.toFixed(8)} rev/day, inclination ${set.omm!.inclinationDeg.toFixed(4)} deg, RAAN ${set.omm!.raanDeg.toFixed(4)} deg at ${isoFromMs(set.epochMs)}, no drag`,
      });
    }
    if (orbit.catalogNumber !== undefined) problems.push({ file, path: `${path}.catalogNumber`, message: 'picks an element set from a file; a planned orbit has none (leave it out)' });
    return { kind: 'elements', sets };
  }
  if (orbit.tle !== undefined) sets = collect(parseTleText(orbit.tle, file, `${path}.tle`), problems);
  else if (orbit.tleFile !== undefined) {
    const target = resolveBeside(file, orbit.tleFile);
    referenced.push(target);
    const { text, parsed } = elementFile('tle', target, (t) => parseTleText(t, target, ''));
    if (!text.ok) appendAll(problems, text.problems.map((p) => ({ ...p, message: `${p.message} (named by ${file}: ${path}.tleFile)` })));
    else sets = collect(named(parsed!, `${file}: ${path}.tleFile`), problems);
  } else if (orbit.omm !== undefined) {
    const text = typeof orbit.omm === 'string' ? orbit.omm : JSON.stringify(orbit.omm);
    sets = collect(parseOmm(text, file, `${path}.omm`, typeof orbit.omm === 'string' ? undefined : 'json'), problems, notices);
  } else if (orbit.ommFile !== undefined) {
    const target = resolveBeside(file, orbit.ommFile);
    referenced.push(target);
    const { text, parsed } = elementFile('omm', target, (t) => parseOmm(t, target, ''));
    if (!text.ok) appendAll(problems, text.problems.map((p) => ({ ...p, message: `${p.message} (named by ${file}: ${path}.ommFile)` })));
    else sets = collect(named(parsed!, `${file}: ${path}.ommFile`), problems, notices);
  }
  if (orbit.catalogNumber !== undefined) {
    const wanted = String(orbit.catalogNumber).trim().replace(/^0+(?=.)/, '');
    const all = sets;
    sets = all.filter((s) => s.catalogNumber.trim().replace(/^0+(?=.)/, '') === wanted);
    if (sets.length === 0 && all.length > 0) {
      const found = [...new Set(all.map((s) => s.catalogNumber.trim()))].join(', ');
      problems.push({ file, path: `${path}.catalogNumber`, message: `${JSON.stringify(orbit.catalogNumber)} matches no element set (found: ${found})` });
    }
  }
  if (sets.length === 0 && problems.length === 0) problems.push({ file, path, message: 'holds no element set' });
  // an orbit that dips into the Earth (sub-orbital, e close to 1) is refused, not planned empty
  for (const set of sets) {
    const el = meanMotionAndEccentricity(set);
    const low = el ? perigeeProblem(el.meanMotionRevPerDay, el.eccentricity) : undefined;
    if (low) problems.push({ file, path: `${path}.${orbitField(orbit)}`, message: `${setLabel(set, file)}: ${low}` });
  }
  return { kind: 'elements', sets };
}

/** The SGP4 element set of a planned orbit (mean parameters), or undefined with problems pushed. */
function plannedElementSet(o: NonNullable<SpacecraftEntry['orbit']['planned']>, file: string, path: string, problems: Problem[]): ElementSet | undefined {
  const epochMs = parseInstant(o.epoch);
  if (epochMs === undefined) {
    problems.push({ file, path: `${path}.epoch`, message: `${JSON.stringify(o.epoch)} is not an ISO 8601 time from ${INSTANT_RANGE_TEXT} (e.g. "2026-03-05T00:00:00Z")` });
    return undefined;
  }
  const semiMajorAxisKm = o.semiMajorAxisKm ?? WGS84_EQUATORIAL_RADIUS_KM + (o.altitudeKm ?? 0);
  const eccentricity = o.eccentricity ?? 0;
  const perigeeKm = semiMajorAxisKm * (1 - eccentricity) - WGS84_EQUATORIAL_RADIUS_KM;
  if (perigeeKm < MIN_PERIGEE_HEIGHT_KM) {
    problems.push({ file, path, message: `puts the perigee at ${perigeeKm.toFixed(0)} km; valid: a perigee at least ${MIN_PERIGEE_HEIGHT_KM} km above the WGS-84 equatorial radius` });
    return undefined;
  }
  if (o.sunSynchronous && sunSynchronousInclinationDeg(semiMajorAxisKm, eccentricity) === undefined) {
    problems.push({ file, path: `${path}.sunSynchronous`, message: `no inclination makes an orbit of semi-major axis ${semiMajorAxisKm.toFixed(0)} km sun-synchronous; valid: below about 12,350 km` });
    return undefined;
  }
  let ltanHours: number | undefined;
  if (o.ltan !== undefined) {
    const [h, m, sec] = o.ltan.split(':').map(Number);
    ltanHours = (h ?? 0) + (m ?? 0) / 60 + (sec ?? 0) / 3600;
  }
  const el = sgp4MeanElements({
    semiMajorAxisKm,
    eccentricity,
    ...(o.inclinationDeg !== undefined ? { inclinationDeg: o.inclinationDeg } : {}),
    ...(o.sunSynchronous ? { sunSynchronous: true } : {}),
    ...(o.raanDeg !== undefined ? { raanDeg: o.raanDeg } : {}),
    ...(ltanHours !== undefined ? { ltanHours } : {}),
    argPerigeeDeg: o.argPerigeeDeg ?? 0,
    meanAnomalyDeg: o.meanAnomalyDeg ?? 0,
    epochMs,
  });
  const epochIso = `${new Date(epochMs).toISOString().slice(0, 23)}000`;
  return {
    origin: `${file}: ${path}`,
    catalogNumber: '0',
    epochMs,
    omm: {
      objectName: path,
      objectId: '',
      epochIso,
      meanMotionRevPerDay: el.meanMotionRevPerDay,
      eccentricity: el.eccentricity,
      inclinationDeg: el.inclinationDeg,
      raanDeg: el.raanDeg,
      argPericenterDeg: el.argPerigeeDeg,
      meanAnomalyDeg: el.meanAnomalyDeg,
      bstarPerEarthRadii: 0,
      meanMotionDotRevPerDay2: 0,
      meanMotionDdotRevPerDay3: 0,
      noradCatId: 0,
      elementSetNo: 0,
      revAtEpoch: 0,
      classification: 'U',
      ephemerisType: 0,
    },
  };
}

function isoFromMs(tMs: number): string {
  return new Date(tMs).toISOString().replace('.000Z', 'Z');
}

function orbitField(orbit: SpacecraftEntry['orbit']): string {
  return orbit.tle !== undefined ? 'tle' : orbit.tleFile !== undefined ? 'tleFile' : orbit.omm !== undefined ? 'omm' : 'ommFile';
}

/** "element set <origin> (catalogue N)", the origin without the file already named. */
function setLabel(set: ElementSet, file: string): string {
  const origin = set.origin.startsWith(`${file}: `) ? set.origin.slice(file.length + 2) : set.origin;
  return `element set ${origin} (catalogue ${set.catalogNumber})`;
}

/** Problems in a file named by another say which field named it. */
function named(result: { sets: ElementSet[]; problems: Problem[]; warnings?: string[] }, by: string): { sets: ElementSet[]; problems: Problem[]; warnings: string[] } {
  return {
    sets: result.sets,
    problems: result.problems.map((p) => ({ ...p, message: `${p.message} (named by ${by})` })),
    warnings: (result.warnings ?? []).map((w) => `${w} (named by ${by})`),
  };
}

function collect(result: { sets: ElementSet[]; problems: Problem[]; warnings?: string[] }, problems: Problem[], notices: Notice[] = []): ElementSet[] {
  appendAll(problems, result.problems);
  for (const w of result.warnings ?? []) notices.push({ level: 'warning', message: w });
  return result.sets;
}

function toRadio(r: RadioEntry, file: string, path: string, problems: Problem[]): Radio {
  const txPowerDbw = r.powerDbw ?? 10 * Math.log10(r.powerW ?? 1);
  let antenna: TxAntenna;
  if (r.antenna.pattern) {
    const p = r.antenna.pattern;
    if (p.offBoresightDeg.length !== p.gainDbi.length) {
      problems.push({ file, path: `${path}.antenna.pattern`, message: `offBoresightDeg has ${p.offBoresightDeg.length} points but gainDbi has ${p.gainDbi.length}; they must match` });
    }
    for (let i = 1; i < p.offBoresightDeg.length; i++) {
      if ((p.offBoresightDeg[i] ?? 0) <= (p.offBoresightDeg[i - 1] ?? 0)) {
        problems.push({ file, path: `${path}.antenna.pattern.offBoresightDeg[${i}]`, message: `${p.offBoresightDeg[i]} must be greater than the point before it (angles ascend)` });
        break;
      }
    }
    antenna = { kind: 'pattern', offBoresightDeg: p.offBoresightDeg, gainDbi: p.gainDbi, pointing: p.pointing };
  } else {
    antenna = { kind: 'constant', gainDbi: r.antenna.gainDbi ?? 0 };
  }
  const coding = resolveCoding(r.coding, file, `${path}.coding`, problems);
  return {
    id: r.id,
    frequencyHz: r.frequencyMHz * 1e6,
    txPowerDbw,
    txLossDb: r.txLossDb ?? 0,
    antenna,
    polarization: r.polarization ?? 'RHCP',
    coding,
    implementationLossDb: r.implementationLossDb ?? 1,
    requiredMarginDb: r.requiredMarginDb ?? 3,
  };
}

function loadNetwork(file: string, problems: Problem[], notices: Notice[]): Station[] | undefined {
  const read = readData(file, problems);
  if (read === undefined) return undefined;
  const { data, text } = read;
  const parsed = networkFileSchema.safeParse(data);
  if (!parsed.success) {
    appendAll(problems, zodProblems(file, data, parsed.error.issues, [], text));
    checkValidPartsOfNetwork(data, file, problems);
    return undefined;
  }
  const before = problems.length;
  checkUnique(parsed.data.stations.map((s) => s.id), file, 'stations', problems);
  const stations = parsed.data.stations.map((s, i) => toStation(s, file, `stations[${i}]`, problems, notices));
  return problems.length > before ? undefined : stations;
}

function toStation(s: StationEntry, file: string, path: string, problems: Problem[], notices: Notice[] = []): Station {
  const mask = toMask(s.maskDeg ?? 5, s.horizon, file, path, problems);
  const receiver = s.antenna && s.receiver ? toReceiver(s.antenna, s.receiver, file, path, problems) : undefined;
  const c = s.climate ?? {};
  const feeds = receiver ? toFeeds(s, receiver, file, path, problems) : undefined;
  const taken = [
    ...(s.heightM === undefined ? ['heightM not given: 0 m above the WGS-84 ellipsoid'] : []),
    ...(s.timeZone === undefined ? ['timeZone not given: local days and times in UTC'] : []),
    ...(receiver === undefined ? ['no antenna and receiver: windows only, with no link, volume or margin'] : []),
  ];
  if (taken.length > 0) notices.push({ level: 'note', message: `${file}: ${path} (${s.id}): ${taken.join('; ')}` });
  return {
    id: s.id,
    name: s.name ?? s.id,
    latitudeDeg: s.latitudeDeg,
    longitudeDeg: s.longitudeDeg > 180 ? s.longitudeDeg - 360 : s.longitudeDeg,
    heightKm: (s.heightM ?? 0) / 1000,
    mask,
    timeZone: s.timeZone ?? 'UTC',
    ...(receiver ? { receiver: feeds ? feeds[0]!.receiver : receiver } : {}),
    pointingErrorDeg: s.antenna?.pointingErrorDeg ?? 0,
    polarization: s.antenna?.polarization ?? 'RHCP',
    climate: {
      ...(c.rainRate001MmH !== undefined ? { rainRate001MmH: c.rainRate001MmH } : {}),
      ...(c.rainHeightKm !== undefined ? { rainHeightKm: c.rainHeightKm } : {}),
      ...(c.waterVapourDensityGM3 !== undefined ? { surfaceWaterVapourDensityGM3: c.waterVapourDensityGM3 } : {}),
      ...(c.temperatureK !== undefined ? { surfaceTemperatureK: c.temperatureK } : {}),
      ...(c.pressureHpa !== undefined ? { surfacePressureHpa: c.pressureHpa } : {}),
      ...(c.nWetMedian !== undefined ? { nWetMedian: c.nWetMedian } : {}),
      ...(c.cloudLiquidWaterKgM2 !== undefined ? { cloudLiquidWaterKgM2: c.cloudLiquidWaterKgM2 } : {}),
    },
    antennaCount: s.antenna?.count ?? 1,
    setupTimeS: s.antenna?.setupTimeS ?? 0,
    ...(feeds ? { feeds } : {}),
  };
}

type AntennaEntry = NonNullable<StationEntry['antenna']>;
type ReceiverEntry = NonNullable<StationEntry['receiver']>;

function toReceiver(a: AntennaEntry, rx: ReceiverEntry, file: string, path: string, problems: Problem[]): Receiver {
  let receiver: Receiver;
  if (rx.gOverTDbK !== undefined) {
    receiver = {
      kind: 'gt',
      gOverTDbK: rx.gOverTDbK,
      atElevationDeg: rx.gOverTAtElevationDeg ?? 90,
      ...(a.gainDbi !== undefined ? { gainDbi: a.gainDbi } : {}),
      ...(a.dishDiameterM !== undefined ? { dishDiameterM: a.dishDiameterM, apertureEfficiency: a.apertureEfficiency ?? 0.6 } : {}),
    };
  } else {
    const receiverNoiseTempK = rx.noiseTempK ?? 290 * (10 ** ((rx.noiseFigureDb ?? 0) / 10) - 1);
    receiver = {
      kind: 'chain',
      ...(a.gainDbi !== undefined ? { gainDbi: a.gainDbi } : {}),
      ...(a.dishDiameterM !== undefined ? { dishDiameterM: a.dishDiameterM, apertureEfficiency: a.apertureEfficiency ?? 0.6 } : {}),
      receiverNoiseTempK,
      feedLossDb: rx.feedLossDb ?? 0,
      feedPhysicalTempK: rx.feedTempK ?? 290,
      antennaNoiseTempK: rx.antennaNoiseK ?? 10,
    };
  }
  if (a.gainDbi !== undefined && a.dishDiameterM !== undefined && rx.gOverTDbK === undefined) {
    problems.push({ file, path: `${path}.antenna`, message: 'has both gainDbi and dishDiameterM; give one (the gain is computed from the dish)' });
  }
  return receiver;
}

/** A mask from a constant or a horizon profile ([azimuthDeg, elevationDeg] points), checked. */
function toMask(constantDeg: number, horizon: [number, number][] | undefined, file: string, path: string, problems: Problem[]): Mask {
  if (!horizon) return { kind: 'constant', elevationDeg: constantDeg };
  const pts = [...horizon].sort((a, b) => a[0] - b[0]);
  for (let i = 1; i < pts.length; i++) {
    if (pts[i]![0] === pts[i - 1]![0]) {
      problems.push({ file, path: `${path}.horizon`, message: `azimuth ${pts[i]![0]} appears twice; each azimuth once` });
      break;
    }
  }
  // 0 and 360 deg are one direction: the mask model refuses two elevations there
  const first = pts[0];
  const last = pts[pts.length - 1];
  if (first && last && first[0] === 0 && last[0] === 360 && first[1] !== last[1]) {
    problems.push({
      file,
      path: `${path}.horizon`,
      message: `[0, ${first[1]}] and [360, ${last[1]}] are the same azimuth with different elevations; valid: give one of them, or the same elevation at both`,
    });
  }
  return { kind: 'profile', azimuthDeg: pts.map((p) => p[0] % 360), elevationDeg: pts.map((p) => p[1]) };
}
