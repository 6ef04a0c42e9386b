/**
 * Invented test inputs for the link chain and a small fake atmosphere table (the real
 * one lives in src/link/atmosphere and is tested there). The fake is a stand-in with a
 * plausible shape only: gas 0.05 dB / sin(el), rain 3 dB / sin(el) capped, sky noise
 * 275 K (1 - 10^(-A/10)) + 2.7 K 10^(-A/10). No check compares against it.
 */
import type { AtmosphereResult, AtmosphereTable } from '../../src/link/atmosphere/types.js';
import type { LinkSettings, Radio, Station } from '../../src/scenario/types.js';

export function fakeAtmosphere(minElevationDeg = 5, rainZenithDb = 0.3): AtmosphereTable {
  return {
    minElevationDeg,
    at(elevationDeg: number, out: AtmosphereResult): void {
      if (elevationDeg < minElevationDeg) throw new Error(`fake table asked below ${minElevationDeg} deg`);
      const s = Math.sin((elevationDeg * Math.PI) / 180);
      out.gasDb = 0.05 / s;
      out.rainDb = Math.min(rainZenithDb / s, 20);
      out.cloudDb = 0.02 / s;
      out.scintillationDb = 0.1 / s;
      out.totalDb = out.gasDb + Math.sqrt((out.rainDb + out.cloudDb) ** 2 + out.scintillationDb ** 2);
      const t = 10 ** (-out.totalDb / 10);
      out.skyNoiseTempK = 275 * (1 - t) + 2.7 * t;
    },
  };
}

/** A constant atmosphere: fixed total loss and sky temperature at every elevation. */
export function constantAtmosphere(totalDb: number, skyNoiseTempK: number): AtmosphereTable {
  return {
    minElevationDeg: 0,
    at(_elevationDeg: number, out: AtmosphereResult): void {
      out.gasDb = totalDb;
      out.rainDb = 0;
      out.cloudDb = 0;
      out.scintillationDb = 0;
      out.totalDb = totalDb;
      out.skyNoiseTempK = skyNoiseTempK;
    },
  };
}

export const settings: LinkSettings = { availabilityPercent: 99.5, acquisitionTimeS: 10, minDataElevationDeg: 5 };

export function radio(over: Partial<Radio> = {}): Radio {
  return {
    id: 'xband-1',
    frequencyHz: 8.2e9,
    txPowerDbw: 3,
    txLossDb: 1,
    antenna: { kind: 'constant', gainDbi: 6 },
    polarization: 'RHCP',
    coding: {
      kind: 'fixed',
      name: 'conv K7 r1/2 BER 1e-5',
      ebN0ThresholdDb: 4.2,
      informationRateBps: 50e6,
      spectralEfficiencyBitsPerSymbol: 1,
      rollOff: 0.35,
    },
    implementationLossDb: 1.5,
    requiredMarginDb: 3,
    ...over,
  };
}

export function station(over: Partial<Station> = {}): Station {
  return {
    id: 'northcape-test',
    name: 'Invented test station',
    latitudeDeg: 67.2,
    longitudeDeg: 14.1,
    heightKm: 0.1,
    mask: { kind: 'constant', elevationDeg: 5 },
    timeZone: 'UTC',
    receiver: {
      kind: 'chain',
      dishDiameterM: 7.3,
      apertureEfficiency: 0.6,
      receiverNoiseTempK: 60,
      feedLossDb: 0.3,
      feedPhysicalTempK: 290,
      antennaNoiseTempK: 15,
    },
    pointingErrorDeg: 0.03,
    polarization: 'RHCP',
    climate: { surfaceWaterVapourDensityGM3: 7.5, surfaceTemperatureK: 283, surfacePressureHpa: 1013, nWetMedian: 40 },
    antennaCount: 1,
    setupTimeS: 60,
    ...over,
  };
}

/** Slant range to a spacecraft at altitude hKm seen at elevation elDeg, spherical Earth of radius rKm. */
export function slantRangeKm(hKm: number, elDeg: number, rKm = 6371): number {
  const e = (elDeg * Math.PI) / 180;
  return Math.sqrt((rKm + hKm) ** 2 - (rKm * Math.cos(e)) ** 2) - rKm * Math.sin(e);
}
