/**
 * File formats of passbudget's own scenario files, validated with zod.
 *
 * A spacecraft file ("what flies") holds the mission's link settings, an
 * optional default window, and the spacecraft with their orbits and radios.
 * A network file ("where it lands") holds the ground stations.
 *
 * Alternatives (an orbit given as a TLE, an OMM, the Moon or a sky direction)
 * are optional fields checked by "exactly one of" rules, not zod unions, so
 * every message names the field and what is valid.
 */
import { z } from 'zod';
import { IANAZone } from 'luxon';

const finite = () => z.number({ message: 'must be a number' }).refine(Number.isFinite, { message: 'must be a finite number' });
// The bounds are checked by refine (our messages) and stated by meta, so that the JSON
// Schema export (scenario/json-schema.ts) carries them too.
const range = (min: number, max: number) =>
  finite()
    .refine((v) => v >= min && v <= max, { message: `is outside ${min}..${max}` })
    .meta({ minimum: min, maximum: max });
const positive = () =>
  finite()
    .refine((v) => v > 0, { message: 'must be > 0' })
    .meta({ exclusiveMinimum: 0 });
const nonNegative = () =>
  finite()
    .refine((v) => v >= 0, { message: 'must be >= 0' })
    .meta({ minimum: 0 });
const id = () =>
  z
    .string({ message: 'must be a string' })
    .regex(/^[A-Za-z0-9][A-Za-z0-9._-]{0,39}$/, { message: 'must be 1..40 letters, digits, ".", "_" or "-", starting with a letter or digit' });
const text = () => z.string({ message: 'must be a string' }).min(1, { message: 'must not be empty' });

/** Most points of a horizon profile or an antenna pattern (a 0.1 deg grid over 360 deg). */
export const MAX_PROFILE_POINTS = 3600;

/** Exactly one of the named keys must be present. */
function exactlyOne<T extends Record<string, unknown>>(keys: (keyof T & string)[]) {
  return (value: T, ctx: z.RefinementCtx) => {
    const present = keys.filter((k) => value[k] !== undefined);
    if (present.length !== 1) {
      ctx.addIssue({
        code: 'custom',
        message:
          present.length === 0
            ? `needs exactly one of ${keys.join(', ')}`
            : `has ${present.join(' and ')}; give exactly one of ${keys.join(', ')}`,
      });
    }
  };
}

/** Mean orbit parameters of an orbit before launch (converted to SGP4 mean elements, geometry/mean-elements.ts). */
export const plannedOrbitSchema = z
  .object({
    /** Mean altitude above the equatorial radius, or the mean semi-major axis (exactly one). */
    altitudeKm: range(100, 100_000).optional(),
    semiMajorAxisKm: range(6478, 106_378).optional(),
    eccentricity: finite()
      .refine((v) => v >= 0 && v < 0.9, { message: 'must be in 0..0.9 (exclusive)' })
      .optional(),
    inclinationDeg: range(0, 180).optional(),
    sunSynchronous: z.literal(true, { message: 'must be true' }).optional(),
    /** Local (apparent solar) time of the ascending node, "HH:MM" or "HH:MM:SS"; or raanDeg. */
    ltan: z
      .string({ message: 'must be a time of day "HH:MM" (e.g. "10:30")' })
      .regex(/^([01]\d|2[0-3]):[0-5]\d(:[0-5]\d(\.\d+)?)?$/, { message: 'must be a time of day "HH:MM" or "HH:MM:SS" (e.g. "10:30")' })
      .optional(),
    raanDeg: range(0, 360).optional(),
    argPerigeeDeg: range(0, 360).optional(),
    meanAnomalyDeg: range(0, 360).optional(),
    /** Epoch of the elements, ISO 8601 (UTC unless a zone is given). */
    epoch: text(),
  })
  .strict()
  .superRefine((o, ctx) => {
    exactlyOne<typeof o>(['altitudeKm', 'semiMajorAxisKm'])(o, ctx);
    exactlyOne<typeof o>(['inclinationDeg', 'sunSynchronous'])(o, ctx);
    if (o.ltan !== undefined && o.raanDeg !== undefined) ctx.addIssue({ code: 'custom', message: 'has ltan and raanDeg; give at most one of them' });
  });

export const orbitSchema = z
  .object({
    tle: text().optional(),
    tleFile: text().optional(),
    omm: z.union([text(), z.record(z.string(), z.unknown()), z.array(z.record(z.string(), z.unknown()))]).optional(),
    ommFile: text().optional(),
    /** Picks the sets of one object from a file or text that holds several. */
    catalogNumber: z.union([z.string(), z.number()], { message: 'must be a catalogue number (string or number)' }).optional(),
    moon: z.literal(true, { message: 'must be true' }).optional(),
    planned: plannedOrbitSchema.optional(),
    sky: z
      .object({
        rightAscensionDeg: range(0, 360),
        declinationDeg: range(-90, 90),
        rangeKm: positive(),
      })
      .strict()
      .optional(),
    /** A CCSDS OEM file (KVN or XML) from flight dynamics. */
    oemFile: text().optional(),
    /** A transmitter on the lunar surface (selenographic, east-positive longitude). */
    lunarSite: z
      .object({
        latitudeDeg: range(-90, 90),
        longitudeDeg: range(-180, 360),
        heightM: range(-10_000, 11_000),
        maskDeg: range(-10, 90).optional(),
        horizon: z
          .array(z.tuple([range(0, 360), range(-10, 90)], { message: 'each point must be [azimuthDeg, elevationDeg]' }))
          .min(2, { message: 'needs at least 2 [azimuthDeg, elevationDeg] points' })
          .max(MAX_PROFILE_POINTS, { message: `has more than ${MAX_PROFILE_POINTS} points (0.1 deg steps)` })
          .optional(),
      })
      .strict()
      .optional(),
    /** Mean Keplerian elements about the Moon, referred to the lunar equator at the epoch (two-body). */
    lunarOrbit: z
      .object({
        epoch: text(),
        semiMajorAxisKm: range(1737.4 + 10, 60_000),
        eccentricity: finite().refine((v) => v >= 0 && v < 0.95, { message: 'must be in 0..0.95' }),
        inclinationDeg: range(0, 180),
        raanDeg: range(0, 360),
        argPericenterDeg: range(0, 360),
        meanAnomalyDeg: range(0, 360),
      })
      .strict()
      .optional(),
    /** Height above the mean lunar radius within which a line of sight counts as cut by the Moon, km (default 0). */
    grazingMarginKm: range(0, 100).optional(),
  })
  .strict()
  .superRefine(exactlyOne(['tle', 'tleFile', 'omm', 'ommFile', 'planned', 'moon', 'sky', 'oemFile', 'lunarSite', 'lunarOrbit']))
  .superRefine((o, ctx) => {
    if (o.grazingMarginKm !== undefined && o.oemFile === undefined && o.lunarOrbit === undefined) {
      ctx.addIssue({ code: 'custom', path: ['grazingMarginKm'], message: 'applies to oemFile and lunarOrbit only' });
    }
    if (o.lunarSite && o.lunarSite.maskDeg !== undefined && o.lunarSite.horizon !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['lunarSite'], message: 'has maskDeg and horizon; give one of them' });
    }
  });

export const antennaTxSchema = z
  .object({
    gainDbi: range(-30, 80).optional(),
    pattern: z
      .object({
        offBoresightDeg: z.array(range(0, 180)).min(2, { message: 'needs at least 2 points' }).max(MAX_PROFILE_POINTS, { message: `has more than ${MAX_PROFILE_POINTS} points` }),
        gainDbi: z.array(range(-60, 80)).min(2, { message: 'needs at least 2 points' }).max(MAX_PROFILE_POINTS, { message: `has more than ${MAX_PROFILE_POINTS} points` }),
        pointing: z.enum(['nadir', 'tracking'], { message: 'must be "nadir" or "tracking"' }),
      })
      .strict()
      .optional(),
  })
  .strict()
  .superRefine(exactlyOne(['gainDbi', 'pattern']));

export const codingSchema = z
  .object({
    /** A named code from the CCSDS table, or a MODCOD name of a table ("QPSK 1/2"). */
    code: text().optional(),
    /** Table a named MODCOD comes from, or the table for adaptive coding. */
    table: text().optional(),
    /** For a code of one's own: its threshold and efficiency. */
    ebN0ThresholdDb: range(-5, 30).optional(),
    spectralEfficiencyBitsPerSymbol: range(0.01, 10).optional(),
    informationRateBps: positive().optional(),
    adaptive: z.boolean({ message: 'must be true or false' }).optional(),
    symbolRateBaud: positive().optional(),
    rollOff: range(0, 1).optional(),
  })
  .strict();

export const radioSchema = z
  .object({
    id: id(),
    frequencyMHz: range(100, 400_000),
    powerW: positive().optional(),
    powerDbw: range(-60, 60).optional(),
    txLossDb: range(0, 30).optional(),
    antenna: antennaTxSchema,
    polarization: z.enum(['RHCP', 'LHCP', 'linear-h', 'linear-v'], { message: 'must be RHCP, LHCP, linear-h or linear-v' }).optional(),
    coding: codingSchema,
    implementationLossDb: range(0, 20).optional(),
    requiredMarginDb: range(0, 30).optional(),
  })
  .strict()
  .superRefine(exactlyOne(['powerW', 'powerDbw']));

export const spacecraftSchema = z
  .object({
    id: id(),
    name: text().optional(),
    priority: range(0, 1000).optional(),
    orbit: orbitSchema,
    radios: z.array(radioSchema).optional(),
    /** Id of the radio that is the data downlink (totals, recorder, sizing); default: the first. */
    dataRadio: id().optional(),
    recorder: z
      .object({
        capacityGbit: positive(),
        generationMbps: nonNegative(),
        initialFillGbit: nonNegative().optional(),
        /** Payload on/off cycle: generates for onS, then idles offS, from the window start. */
        duty: z.object({ onS: positive(), offS: nonNegative() }).strict().optional(),
      })
      .strict()
      .optional(),
  })
  .strict();

export const spacecraftFileSchema = z
  .object({
    mission: text().optional(),
    note: z.string().optional(),
    window: z
      .object({ from: text(), days: range(0.001, 366) })
      .strict()
      .optional(),
    link: z
      .object({
        availabilityPercent: range(90, 99.999).optional(),
        acquisitionTimeS: range(0, 3600).optional(),
        minDataElevationDeg: range(-5, 90).optional(),
      })
      .strict()
      .optional(),
    spacecraft: z.array(spacecraftSchema).min(1, { message: 'must list at least one spacecraft' }),
  })
  .strict();

// ---- station feeds (self-contained block): what bands a station can hear, each with its
// own gain or dish and its own receive chain or G/T; missing parts come from the station.
/** IEEE Std 521-2019 radar-band letters (common practice), MHz. */
/** A receive chain: a noise temperature, a noise figure or a stated G/T (exactly one), with the feed's losses. */
const receiverSchema = z
  .object({
    noiseTempK: positive().optional(),
    noiseFigureDb: range(0, 20).optional(),
    feedLossDb: range(0, 10).optional(),
    feedTempK: range(0, 400).optional(),
    antennaNoiseK: range(0, 1000).optional(),
    gOverTDbK: range(-40, 70).optional(),
    gOverTAtElevationDeg: range(0, 90).optional(),
  })
  .strict()
  .superRefine(exactlyOne(['noiseTempK', 'noiseFigureDb', 'gOverTDbK']));

export const BAND_RANGES_MHZ: Record<string, [number, number]> = {
  L: [1000, 2000],
  S: [2000, 4000],
  C: [4000, 8000],
  X: [8000, 12000],
  Ku: [12000, 18000],
  K: [18000, 27000],
  Ka: [27000, 40000],
};

export const feedSchema = z
  .object({
    id: id(),
    band: z.enum(Object.keys(BAND_RANGES_MHZ) as [string, ...string[]], { message: `must be one of ${Object.keys(BAND_RANGES_MHZ).join(', ')} (IEEE Std 521)` }).optional(),
    fromMHz: range(100, 400_000).optional(),
    toMHz: range(100, 400_000).optional(),
    gainDbi: range(-10, 90).optional(),
    dishDiameterM: positive().optional(),
    apertureEfficiency: finite()
      .refine((v) => v > 0 && v <= 1, { message: 'must be in (0, 1]' })
      .optional(),
    receiver: receiverSchema.optional(),
  })
  .strict()
  .superRefine((f, ctx) => {
    const hasRange = f.fromMHz !== undefined || f.toMHz !== undefined;
    if ((f.band === undefined) === !hasRange) {
      ctx.addIssue({ code: 'custom', message: 'give a band or a frequency range (fromMHz and toMHz), not both or neither' });
    } else if (hasRange && (f.fromMHz === undefined || f.toMHz === undefined || !(f.toMHz > f.fromMHz))) {
      ctx.addIssue({ code: 'custom', message: 'needs fromMHz < toMHz' });
    }
    if (f.gainDbi !== undefined && f.dishDiameterM !== undefined) {
      ctx.addIssue({ code: 'custom', message: 'has both gainDbi and dishDiameterM; give one' });
    }
  });
// ---- end of station feeds

const timeZone = () =>
  // "UTC" is valid without asking luxon (whose first zone check loads the ICU date data)
  text().refine((v) => v === 'UTC' || IANAZone.isValidZone(v), { message: 'is not an IANA time zone (e.g. "Europe/Oslo", "UTC")' });

export const stationSchema = z
  .object({
    id: id(),
    name: text().optional(),
    latitudeDeg: range(-90, 90),
    longitudeDeg: range(-180, 360),
    /** Above the WGS-84 ellipsoid; default 0 (with a note). */
    heightM: range(-500, 9000).optional(),
    maskDeg: range(-5, 90).optional(),
    horizon: z
      .array(z.tuple([range(0, 360), range(-5, 90)], { message: 'each point must be [azimuthDeg, elevationDeg]' }))
      .min(2, { message: 'needs at least 2 [azimuthDeg, elevationDeg] points' })
      .max(MAX_PROFILE_POINTS, { message: `has more than ${MAX_PROFILE_POINTS} points (0.1 deg steps)` })
      .optional(),
    /** IANA zone for local days and times; default UTC (with a note). */
    timeZone: timeZone().optional(),
    /** Antenna and receiver are optional together: a station without them has windows but no link. */
    antenna: z
      .object({
        dishDiameterM: positive().optional(),
        apertureEfficiency: finite()
          .refine((v) => v > 0 && v <= 1, { message: 'must be in (0, 1]' })
          .optional(),
        gainDbi: range(-10, 90).optional(),
        pointingErrorDeg: range(0, 10).optional(),
        polarization: z.enum(['RHCP', 'LHCP', 'linear-h', 'linear-v'], { message: 'must be RHCP, LHCP, linear-h or linear-v' }).optional(),
        count: z.number().int({ message: 'must be a whole number' }).min(1, { message: 'must be >= 1' }).max(20, { message: 'must be <= 20' }).optional(),
        setupTimeS: range(0, 3600).optional(),
      })
      .strict()
      .superRefine((a, ctx) => {
        if (a.gainDbi === undefined && a.dishDiameterM === undefined) {
          ctx.addIssue({ code: 'custom', message: 'needs dishDiameterM (with apertureEfficiency) or gainDbi' });
        }
      })
      .optional(),
    receiver: receiverSchema.optional(),
    climate: z
      .object({
        rainRate001MmH: range(0, 300).optional(),
        rainHeightKm: range(0, 8).optional(),
        waterVapourDensityGM3: range(0, 40).optional(),
        temperatureK: range(180, 340).optional(),
        pressureHpa: range(300, 1100).optional(),
        nWetMedian: range(0, 200).optional(),
        cloudLiquidWaterKgM2: range(0, 10).optional(),
      })
      .strict()
      .optional(),
    /** Bands the station can hear (default: one feed, the station's antenna and receiver, any frequency). */
    feeds: z.array(feedSchema).min(1, { message: 'must list at least one feed (or leave feeds out)' }).optional(),
  })
  .strict()
  .superRefine((s, ctx) => {
    if (s.maskDeg !== undefined && s.horizon !== undefined) {
      ctx.addIssue({ code: 'custom', message: 'has maskDeg and horizon; give one of them' });
    }
    if ((s.antenna === undefined) !== (s.receiver === undefined)) {
      ctx.addIssue({
        code: 'custom',
        message: `has ${s.antenna ? 'an antenna but no receiver' : 'a receiver but no antenna'}; give both (for a link) or neither (windows only)`,
      });
    }
    if (s.feeds !== undefined && s.receiver === undefined) {
      ctx.addIssue({ code: 'custom', message: 'has feeds but no antenna and receiver for them to start from; give the station an antenna and a receiver' });
    }
  });

export const networkFileSchema = z
  .object({
    network: text().optional(),
    note: z.string().optional(),
    stations: z.array(stationSchema).min(1, { message: 'must list at least one station' }),
  })
  .strict();

export type SpacecraftFile = z.infer<typeof spacecraftFileSchema>;
export type SpacecraftEntry = z.infer<typeof spacecraftSchema>;
export type RadioEntry = z.infer<typeof radioSchema>;
export type NetworkFile = z.infer<typeof networkFileSchema>;
export type StationEntry = z.infer<typeof stationSchema>;
export type FeedEntry = z.infer<typeof feedSchema>;
