import { describe, expect, it } from 'vitest';
import { ScenarioError } from '../../src/errors.js';
import { budgetTerms, evaluateLink, prepareLink } from '../../src/link/budget.js';
import { bestModcod } from '../../src/link/modcod/acm.js';
import { DVBS2_EN302307_1 } from '../../src/link/modcod/dvbs2-en302307-1.js';
import { newLinkSample, type LinkSample } from '../../src/link/types.js';
import { SPEED_OF_LIGHT_M_S } from '../../src/link/units.js';
import type { Radio } from '../../src/scenario/types.js';
import { constantAtmosphere, fakeAtmosphere, radio, settings, slantRangeKm, station } from './fixtures.js';

const numericFields = (s: LinkSample): [string, number][] =>
  Object.entries(s).filter((e): e is [string, number] => typeof e[1] === 'number');

const adaptive: Radio['coding'] = {
  kind: 'adaptive',
  tableName: 'DVB-S2',
  table: [...DVBS2_EN302307_1],
  symbolRateBaud: 10e6,
  rollOff: 0.2,
};

describe('fixed coding: margin arithmetic by hand', () => {
  // EIRP 10 dBW (11 dBW - 1 dB + 0 dBi); free-space loss 180 dB exactly (range solved from
  // P.525 at 2.2 GHz); atmosphere 0.5 dB with 0 K sky; G 40 dBi, no feed loss, Trx 100 K ->
  // G/T 20 dB/K. C/N0 = 10 - 180 - 0.5 + 20 + 228.59916 = 78.09916 dB-Hz.
  // Rb 10 Mbit/s (70 dB-Hz): Eb/N0 = 8.09916 dB; efficiency 2 b/sym: Es/N0 = 11.10946 dB.
  const fHz = 2.2e9;
  const rangeKm = ((SPEED_OF_LIGHT_M_S / fHz / (4 * Math.PI)) * 10 ** (180 / 20)) / 1000;
  const mk = (requiredMarginDb: number) =>
    prepareLink(
      radio({
        frequencyHz: fHz,
        txPowerDbw: 11,
        txLossDb: 1,
        antenna: { kind: 'constant', gainDbi: 0 },
        coding: { kind: 'fixed', name: 'conv K7 r1/2 BER 1e-5', ebN0ThresholdDb: 4.2, informationRateBps: 10e6, spectralEfficiencyBitsPerSymbol: 2, rollOff: 0.35 },
        implementationLossDb: 1.5,
        requiredMarginDb,
      }),
      station({
        receiver: { kind: 'chain', gainDbi: 40, receiverNoiseTempK: 100, feedLossDb: 0, feedPhysicalTempK: 290, antennaNoiseTempK: 0 },
        pointingErrorDeg: 0,
      }),
      settings,
      constantAtmosphere(0.5, 0),
    );
  const look = { azimuthDeg: 10, elevationDeg: 40, rangeKm, rangeRateKmS: -7 };

  it('C/N0 78.0992 dB-Hz, Eb/N0 8.0992 dB, Es/N0 11.1095 dB (1e-4 dB)', () => {
    const out = newLinkSample();
    evaluateLink(mk(3), look, out);
    expect(out.freeSpaceLossDb).toBeCloseTo(180, 9);
    expect(out.gOverTDbK).toBeCloseTo(20, 9);
    expect(Math.abs(out.cN0DbHz - 78.09916)).toBeLessThan(1e-4);
    expect(Math.abs(out.ebN0Db - 8.09916)).toBeLessThan(1e-4);
    expect(Math.abs(out.esN0Db - 11.10946)).toBeLessThan(1e-4);
  });

  it('required margin 3 dB: margin 8.0992 - 1.5 - 4.2 - 3 = -0.6008 dB, rate 0; 2 dB: +0.3992 dB, rate 10 Mbit/s', () => {
    const out = newLinkSample();
    evaluateLink(mk(3), look, out);
    expect(Math.abs(out.marginDb - -0.60084)).toBeLessThan(1e-4);
    expect(out.rateBps).toBe(0);
    expect(out.modcodIndex).toBe(-1);
    evaluateLink(mk(2), look, out);
    expect(Math.abs(out.marginDb - 0.39916)).toBeLessThan(1e-4);
    expect(out.rateBps).toBe(10e6);
  });

  it('Shannon over B = Rs (1 + 0.35) = 6.75 MHz, and Doppler -f v/c = +51.37 kHz for -7 km/s at 2.2 GHz', () => {
    const out = newLinkSample();
    evaluateLink(mk(3), look, out);
    const bHz = 5e6 * 1.35;
    expect(out.shannonRateBps).toBeCloseTo(bHz * Math.log2(1 + 10 ** (7.809916) / bHz), -3);
    expect(Math.abs(out.dopplerHz - (2.2e9 * 7000) / 299792458)).toBeLessThan(1e-6);
    expect(Math.abs(out.dopplerHz - 51369)).toBeLessThan(1);
  });

  it('no data below the minimum data elevation (LinkSettings.minDataElevationDeg = 5)', () => {
    const out = newLinkSample();
    evaluateLink(mk(2), { ...look, elevationDeg: 4.9 }, out);
    expect(out.marginDb).toBeGreaterThan(0);
    expect(out.rateBps).toBe(0);
  });
});

describe('adaptive coding over DVB-S2', () => {
  it('picks bestModcod(Es/N0 - implementation loss, required margin) and pays eta x Rs', () => {
    const p = prepareLink(radio({ coding: adaptive, implementationLossDb: 1, requiredMarginDb: 2 }), station(), settings, fakeAtmosphere());
    const out = newLinkSample();
    let closed = 0;
    let none = 0;
    for (const rangeKm of [600, 1000, 2000, 3000, 5000, 10000, 20000, 40000, 100000]) {
      evaluateLink(p, { azimuthDeg: 0, elevationDeg: 30, rangeKm, rangeRateKmS: 0 }, out);
      const idx = bestModcod(DVBS2_EN302307_1, out.esN0Db - 1, 2);
      expect(out.modcodIndex).toBe(idx);
      const k = idx >= 0 ? idx : 0; // QPSK 1/4 has the lowest threshold
      const e = DVBS2_EN302307_1[k]!;
      expect(out.marginDb).toBeCloseTo(out.esN0Db - 1 - e.esN0ThresholdDb - 2, 12);
      expect(out.ebN0Db).toBeCloseTo(out.esN0Db - 10 * Math.log10(e.spectralEfficiencyBitsPerSymbol), 12);
      if (idx >= 0) {
        closed++;
        expect(out.marginDb).toBeGreaterThanOrEqual(0);
        expect(out.rateBps).toBeCloseTo(e.spectralEfficiencyBitsPerSymbol * 10e6, 6);
        expect(out.rateBps).toBeLessThan(out.shannonRateBps);
      } else {
        none++;
        expect(out.marginDb).toBeLessThan(0);
        expect(out.rateBps).toBe(0);
      }
    }
    expect(closed).toBeGreaterThan(2);
    expect(none).toBeGreaterThan(0);
  });
});

describe('transmit pattern with nadir pointing', () => {
  const pattern = { kind: 'pattern' as const, offBoresightDeg: [0, 30, 60], gainDbi: [-2, 1, 5], pointing: 'nadir' as const };
  it('uses the off-nadir angle: boresight at zenith, interpolated gain between, last gain held and flagged beyond', () => {
    const p = prepareLink(radio({ antenna: pattern }), station(), settings, fakeAtmosphere(), { stationGeocentricRadiusKm: 6371 });
    const out = newLinkSample();
    evaluateLink(p, { azimuthDeg: 0, elevationDeg: 90, rangeKm: 600, rangeRateKmS: 0 }, out);
    expect(out.offBoresightDeg).toBeCloseTo(0, 6);
    expect(out.txGainDbi).toBeCloseTo(-2, 6);
    evaluateLink(p, { azimuthDeg: 0, elevationDeg: 0, rangeKm: slantRangeKm(600, 0), rangeRateKmS: 0 }, out);
    // Earth half-angle from 600 km: asin(6371 / 6971) = 66.07 deg > 60 deg: beyond the table.
    expect(out.offBoresightDeg).toBeCloseTo((Math.asin(6371 / 6971) * 180) / Math.PI, 6);
    expect(out.outsidePattern).toBe(true);
    expect(out.txGainDbi).toBe(5);
    expect(out.eirpDbw).toBeCloseTo(3 - 1 + 5, 12);
  });
  it('needs the station geocentric radius', () => {
    expect(() => prepareLink(radio({ antenna: pattern }), station(), settings, fakeAtmosphere())).toThrow();
  });
});

describe('station stated as G/T', () => {
  it('equals the stated G/T at the stated elevation in clear sky and drops with rain and low elevation', () => {
    const clear = fakeAtmosphere(5, 0);
    const s = station({ receiver: { kind: 'gt', gOverTDbK: 30, atElevationDeg: 30, gainDbi: 52 } });
    const p = prepareLink(radio(), s, settings, fakeAtmosphere(5, 0.3), { clearSkyAtmosphere: clear });
    const pClear = prepareLink(radio(), s, settings, clear);
    const out = newLinkSample();
    evaluateLink(pClear, { azimuthDeg: 0, elevationDeg: 30, rangeKm: 1000, rangeRateKmS: 0 }, out);
    expect(out.gOverTDbK).toBeCloseTo(30, 12);
    expect(out.systemNoiseTempK).toBeCloseTo(10 ** 2.2, 9);
    evaluateLink(p, { azimuthDeg: 0, elevationDeg: 30, rangeKm: 1000, rangeRateKmS: 0 }, out);
    const rain30 = out.gOverTDbK;
    expect(rain30).toBeLessThan(30);
    evaluateLink(p, { azimuthDeg: 0, elevationDeg: 10, rangeKm: 2000, rangeRateKmS: 0 }, out);
    expect(out.gOverTDbK).toBeLessThan(rain30);
  });
  it('without a gain: assumed reference Tsys, and a pointing error cannot be turned into a loss (ScenarioError)', () => {
    const s = station({ receiver: { kind: 'gt', gOverTDbK: 30, atElevationDeg: 10 }, pointingErrorDeg: 0 });
    const p = prepareLink(radio(), s, settings, fakeAtmosphere(), { gtReferenceSystemNoiseTempK: 120 });
    expect(p.referenceSystemNoiseTempK).toBe(120);
    expect(() => prepareLink(radio(), { ...s, pointingErrorDeg: 0.05 }, settings, fakeAtmosphere())).toThrow(ScenarioError);
  });
  it('rejects a gain and G/T that imply a system noise below the sky noise', () => {
    const s = station({ receiver: { kind: 'gt', gOverTDbK: 40, atElevationDeg: 5, gainDbi: 45 } }); // Tsys 3.2 K
    expect(() => prepareLink(radio(), s, settings, fakeAtmosphere())).toThrow(ScenarioError);
  });
});

describe('evaluateLink over a sweep', () => {
  it('gives finite numbers for elevations 0..90 and ranges LEO..lunar, every receiver, antenna and coding kind', () => {
    const pattern = { kind: 'pattern' as const, offBoresightDeg: [0, 20, 50, 70], gainDbi: [3, 2, -1, -6], pointing: 'nadir' as const };
    const preps = [
      prepareLink(radio(), station(), settings, fakeAtmosphere()),
      prepareLink(radio({ coding: adaptive, antenna: pattern }), station(), settings, fakeAtmosphere(), { stationGeocentricRadiusKm: 6360 }),
      prepareLink(radio({ polarization: 'linear-v' }), station({ receiver: { kind: 'gt', gOverTDbK: 25, atElevationDeg: 10 }, pointingErrorDeg: 0 }), settings, fakeAtmosphere(2)),
      prepareLink(radio({ coding: adaptive }), station({ receiver: { kind: 'gt', gOverTDbK: 31, atElevationDeg: 45, dishDiameterM: 9 } }), settings, fakeAtmosphere(10, 2)),
    ];
    const out = newLinkSample();
    let n = 0;
    for (const p of preps) {
      for (const hKm of [300, 600, 1200, 8000, 20200, 35786, 384400]) {
        for (let el = 0; el <= 90; el += 0.5) {
          evaluateLink(p, { azimuthDeg: 0, elevationDeg: el, rangeKm: slantRangeKm(hKm, el), rangeRateKmS: -7 + el / 10 }, out);
          for (const [name, v] of numericFields(out)) {
            if (!Number.isFinite(v)) throw new Error(`${name} = ${v} at el ${el}, h ${hKm}`);
          }
          n++;
        }
      }
    }
    expect(n).toBe(4 * 7 * 181);
  });

  it('C/N0 falls monotonically with range at fixed elevation (free-space 20 log d)', () => {
    const p = prepareLink(radio(), station(), settings, fakeAtmosphere());
    const out = newLinkSample();
    let prev = Infinity;
    for (let d = 500; d < 50000; d *= 1.3) {
      evaluateLink(p, { azimuthDeg: 0, elevationDeg: 20, rangeKm: d, rangeRateKmS: 0 }, out);
      expect(out.cN0DbHz).toBeLessThan(prev);
      prev = out.cN0DbHz;
    }
  });
});

describe('budgetTerms', () => {
  it('lists the terms of one budget, finite, consistent with evaluateLink', () => {
    for (const r of [radio(), radio({ coding: adaptive })]) {
      const p = prepareLink(r, station(), settings, fakeAtmosphere());
      const look = { azimuthDeg: 100, elevationDeg: 25, rangeKm: 1500, rangeRateKmS: 3 };
      const terms = budgetTerms(p, look);
      const out = newLinkSample();
      evaluateLink(p, look, out);
      const get = (name: string) => terms.find((t) => t.name === name)!.value;
      for (const t of terms) {
        expect(Number.isFinite(t.value)).toBe(true);
        expect(t.source.length).toBeGreaterThan(0);
      }
      expect(get('EIRP')).toBe(out.eirpDbw);
      expect(get('Transmit power') + get('Transmit losses') + get('Transmit antenna gain')).toBeCloseTo(get('EIRP'), 12);
      expect(get('C/N0')).toBe(out.cN0DbHz);
      // the printed margin is the closure margin (above the most robust entry's threshold plus
      // the required margin); for fixed coding it is the code's margin
      expect(get('Margin')).toBe(out.closureMarginDb);
      if (p.codingKind === 'fixed') expect(out.closureMarginDb).toBe(out.marginDb);
      else {
        const robust = Math.min(...p.modcodTable.map((e) => e.esN0ThresholdDb));
        expect(out.closureMarginDb).toBeCloseTo(out.esN0Db - p.implementationLossDb - robust - p.requiredMarginDb, 12);
        expect(out.closureMarginDb).toBeGreaterThanOrEqual(out.marginDb);
        expect(get('Margin over the entry in use')).toBe(out.marginDb);
      }
      expect(get('Free-space loss')).toBe(-out.freeSpaceLossDb);
    }
  });
});
