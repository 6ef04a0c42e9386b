// Map reads checked against the ITU-R SG3 validation workbook Rev 8.3.0 (copies in
// test/reference/itu-r/, source note there): P.839-4 h0 and hR (p839-4_rain_height.csv),
// P.1510-1 annual mean T (p1510-1_surface_temperature.csv), P.453-14 median Nwet
// (p453-14_nwet_median.csv); P.835-6 reference pressure against the workbook's P.835-6
// profile (p835-6_layer_profile_below_11km.csv, from sheet A_Gas_A1_2.2.1a).
// Tolerance: 1e-4 relative for anything read from a map (the reference folder's README, as
// ITU-Rpy uses); 1e-9 for the closed-form pressure.
import { describe, expect, it } from 'vitest';
import { rainHeightKm, zeroDegreeIsothermHeightKm } from '../../../src/link/climate/p839-4.js';
import { annualMeanSurfaceTemperatureK } from '../../../src/link/climate/p1510-1.js';
import { medianWetRefractivity } from '../../../src/link/climate/p453-14.js';
import { standardPressureHpa } from '../../../src/link/climate/p835-6.js';
import { col, ErrorStats, readReference } from '../atmosphere/reference.js';

const MAP_REL = 1e-4;

describe('ITU-R climate maps read at the workbook sites', () => {
  it('P.839-4 h0 and rain height hR = h0 + 0.36 km', () => {
    const h0 = new ErrorStats('P.839-4 h0');
    const hr = new ErrorStats('P.839-4 hR');
    for (const r of readReference('p839-4_rain_height.csv')) {
      h0.add(zeroDegreeIsothermHeightKm(col(r, 'lat_deg_N'), col(r, 'lon_deg_E')), col(r, 'h0_km'));
      hr.add(rainHeightKm(col(r, 'lat_deg_N'), col(r, 'lon_deg_E')), col(r, 'hR_km'));
    }
    console.info(h0.summary(), '|', hr.summary());
    expect(h0.count).toBe(8);
    expect(h0.max).toBeLessThanOrEqual(MAP_REL);
    expect(hr.max).toBeLessThanOrEqual(MAP_REL);
  });
  it('P.1510-1 annual mean surface temperature (15 points, poles and date line included)', () => {
    const s = new ErrorStats('P.1510-1 T annual');
    for (const r of readReference('p1510-1_surface_temperature.csv')) {
      s.add(annualMeanSurfaceTemperatureK(col(r, 'lat_deg_N'), col(r, 'lon_deg_E')), col(r, 'T_annual_K'));
    }
    console.info(s.summary());
    expect(s.count).toBe(15);
    expect(s.max).toBeLessThanOrEqual(MAP_REL);
  });
  it('P.453-14 median Nwet', () => {
    const s = new ErrorStats('P.453-14 Nwet');
    for (const r of readReference('p453-14_nwet_median.csv')) {
      s.add(medianWetRefractivity(col(r, 'lat_deg_N'), col(r, 'lon_deg_E')), col(r, 'Nwet_N_units'));
    }
    console.info(s.summary());
    expect(s.count).toBe(8);
    expect(s.max).toBeLessThanOrEqual(MAP_REL);
  });
  it('P.835-6 reference pressure at the profile heights below 11 km', () => {
    const s = new ErrorStats('P.835-6 P');
    for (const r of readReference('p835-6_layer_profile_below_11km.csv')) s.add(standardPressureHpa(col(r, 'h_mid_km')), col(r, 'P_hPa'));
    console.info(s.summary());
    expect(s.count).toBe(30);
    expect(s.max).toBeLessThanOrEqual(1e-9);
  });
  it('a longitude given as 0..360 reads the same as -180..180', () => {
    expect(annualMeanSurfaceTemperatureK(51.5, 359.86)).toBeCloseTo(annualMeanSurfaceTemperatureK(51.5, -0.14), 12);
    expect(rainHeightKm(22.9, -43.23)).toBeCloseTo(rainHeightKm(22.9, 316.77), 12);
  });
});
