/** Invented station inputs for the atmosphere tests (not a real site). */
import type { AtmosphereInput } from '../../../src/link/atmosphere/types.js';

export function invented(freqGhz: number, extra: Partial<AtmosphereInput> = {}): Omit<AtmosphereInput, 'elevationDeg'> {
  return {
    frequencyHz: freqGhz * 1e9,
    exceedancePercent: 0.1,
    latitudeDeg: 12.5,
    stationHeightKm: 0.35,
    polarizationTiltDeg: 45,
    antennaDiameterM: 7.3,
    apertureEfficiency: 0.62,
    rainRate001MmH: 62,
    rainHeightKm: 4.6,
    surfaceWaterVapourDensityGM3: 14,
    surfaceTemperatureK: 296,
    surfacePressureHpa: 990,
    nWetMedian: 95,
    cloudLiquidWaterKgM2: 0.6,
    ...extra,
  };
}
