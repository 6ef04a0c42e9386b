/**
 * Station feeds: which frequencies a station can hear, each with its own receiver.
 * A feed gives a band (IEEE Std 521 letters, schema.ts BAND_RANGES_MHZ) or a frequency
 * range, optionally its own gain or dish, and its own receive chain or G/T; what it leaves
 * out comes from the station's antenna and receiver. A station without feeds has one,
 * the station's receiver, covering every frequency (as before feeds existed).
 * A radio links at a station only through the feed covering its frequency (the first that
 * does, in file order); with none, the pair has windows but no link (plan/link.ts says so).
 */
import type { Problem } from '../errors.js';
import { BAND_RANGES_MHZ, type FeedEntry, type StationEntry } from './schema.js';
import type { Feed, Receiver, Station } from './types.js';

function feedReceiver(f: FeedEntry, a: NonNullable<StationEntry['antenna']>, stationReceiver: Receiver): Receiver {
  const own = f.gainDbi !== undefined || f.dishDiameterM !== undefined;
  const gain = own
    ? {
        ...(f.gainDbi !== undefined ? { gainDbi: f.gainDbi } : {}),
        ...(f.dishDiameterM !== undefined ? { dishDiameterM: f.dishDiameterM, apertureEfficiency: f.apertureEfficiency ?? a.apertureEfficiency ?? 0.6 } : {}),
      }
    : {
        ...(stationReceiver.gainDbi !== undefined ? { gainDbi: stationReceiver.gainDbi } : {}),
        ...(stationReceiver.dishDiameterM !== undefined
          ? { dishDiameterM: stationReceiver.dishDiameterM, apertureEfficiency: f.apertureEfficiency ?? stationReceiver.apertureEfficiency ?? 0.6 }
          : {}),
      };
  const rx = f.receiver;
  if (!rx) {
    const { gainDbi: _g, dishDiameterM: _d, apertureEfficiency: _e, ...rest } = stationReceiver;
    return { ...rest, ...gain } as Receiver;
  }
  if (rx.gOverTDbK !== undefined) return { kind: 'gt', gOverTDbK: rx.gOverTDbK, atElevationDeg: rx.gOverTAtElevationDeg ?? 90, ...gain };
  return {
    kind: 'chain',
    ...gain,
    receiverNoiseTempK: rx.noiseTempK ?? 290 * (10 ** ((rx.noiseFigureDb ?? 0) / 10) - 1),
    feedLossDb: rx.feedLossDb ?? 0,
    feedPhysicalTempK: rx.feedTempK ?? 290,
    antennaNoiseTempK: rx.antennaNoiseK ?? 10,
  };
}

/** The station's feeds from its file entry (receiver: the station's own, already built). */
export function toFeeds(s: StationEntry, stationReceiver: Receiver, file: string, path: string, problems: Problem[]): Feed[] | undefined {
  if (!s.feeds) return undefined;
  const seen = new Set<string>();
  return s.feeds.map((f, i) => {
    if (seen.has(f.id)) problems.push({ file, path: `${path}.feeds[${i}].id`, message: `"${f.id}" is already used by another feed of the station; ids must be unique` });
    seen.add(f.id);
    const [fromMHz, toMHz] = f.band !== undefined ? BAND_RANGES_MHZ[f.band]! : [f.fromMHz!, f.toMHz!];
    return { id: f.id, minHz: fromMHz * 1e6, maxHz: toMHz * 1e6, receiver: feedReceiver(f, s.antenna ?? {}, stationReceiver) };
  });
}

/** The feed of `station` covering freqHz (the first in file order), or undefined. */
export function feedFor(station: Station, freqHz: number): Feed | undefined {
  if (!station.receiver) return undefined;
  if (!station.feeds) return { id: 'main', minHz: 0, maxHz: Number.POSITIVE_INFINITY, receiver: station.receiver };
  return station.feeds.find((f) => freqHz >= f.minHz && freqHz <= f.maxHz);
}

/** The station as one radio sees it: its receiver replaced by that of the feed covering freqHz. */
export function stationThroughFeed(station: Station, freqHz: number): Station | undefined {
  const f = feedFor(station, freqHz);
  if (!f) return undefined;
  return f.receiver === station.receiver ? station : { ...station, receiver: f.receiver };
}
