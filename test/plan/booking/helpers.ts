// Synthetic windows for the booking checks: a contact whose link sends a
// constant whole-bit rate from AOS to LOS (15-min volume bins filled by hand),
// so every track's bits are rate x seconds and can be worked out on paper.
import type { Contact } from '../../../src/plan/types.js';
import { VOLUME_BIN_MS } from '../../../src/plan/types.js';

export const MIN = 60_000;
export const HOUR = 3_600_000;
export const T0 = Date.UTC(2026, 0, 1);

export function contact(spacecraftId: string, stationId: string, aosMs: number, losMs: number, rateBps: number): Contact {
  const binStartMs = Math.floor(aosMs / VOLUME_BIN_MS) * VOLUME_BIN_MS;
  const bins: number[] = [];
  for (let b = binStartMs; b < losMs; b += VOLUME_BIN_MS) {
    const s = Math.max(b, aosMs);
    const e = Math.min(b + VOLUME_BIN_MS, losMs);
    bins.push(Math.round((rateBps * (e - s)) / 1000));
  }
  return {
    spacecraftId,
    stationId,
    aosMs,
    losMs,
    tcaMs: (aosMs + losMs) / 2,
    maxElevationDeg: 45,
    aosAzimuthDeg: 0,
    losAzimuthDeg: 180,
    aosClipped: false,
    losClipped: false,
    durationS: (losMs - aosMs) / 1000,
    link: {
      radioId: 'R',
      volumeBits: bins.reduce((a, b) => a + b, 0),
      dataStartMs: aosMs,
      dataEndMs: losMs,
      closedS: (losMs - aosMs) / 1000,
      worstMarginDb: 3,
      worstMarginAtMs: aosMs,
      worstMarginElevationDeg: 10,
      peakRateBps: rateBps,
      timeInModcodS: {},
      samples: 2,
      binStartMs,
      volumeBinsBits: bins,
    },
  };
}
