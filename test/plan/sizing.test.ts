// Sizing (src/plan/sizing.ts). Round trips against the plan pipeline run from
// scratch (runPlan on a scenario edited to the answer, then the same schedule):
// the answer reaches the target and 0.1 dB less (power) / 1 % less (symbol
// rate) misses it. One-geometry mode against evaluateLink directly: at the
// answer the margin is 0 +/- 0.01 dB and the rate reaches the target; 0.01 dB
// below it does not. Demo scenario, first day, link sampled every 10 s.
import { describe, expect, it } from 'vitest';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { runPlan } from '../../src/plan/run.js';
import { scheduleContacts } from '../../src/plan/schedule.js';
import { uniqueVolumeOf } from '../../src/plan/unique-volume.js';
import { pointLink, prepareSizingContext, sizeForWeek, sizePowerAtGeometry, type VolumeBasis } from '../../src/plan/sizing.js';
import { evaluateLink } from '../../src/link/budget.js';
import { newLinkSample } from '../../src/link/types.js';
import type { Radio, Scenario } from '../../src/scenario/types.js';

const scenario = loadScenario(demoFiles());
const span = { startMs: scenario.span!.startMs, endMs: scenario.span!.startMs + 86_400_000 };
const STEP_S = 10;
const ctx = prepareSizingContext(scenario, span, STEP_S);

function withRadio(s: Scenario, id: string, edit: (r: Radio) => Radio): Scenario {
  return { ...s, spacecraft: s.spacecraft.map((sc) => (sc.id === id ? { ...sc, radios: [edit(sc.radios[0]!), ...sc.radios.slice(1)] } : sc)) };
}

/** Delivered bits per day of one spacecraft, by the whole pipeline from scratch. */
function deliveredPerDay(s: Scenario, id: string, basis: VolumeBasis): number {
  const plan = runPlan(s, span, { linkStepS: STEP_S });
  if (basis === 'unscheduled') return uniqueVolumeOf(id, plan.contacts).volumeBits;
  const sched = scheduleContacts(plan, s.stations, s.spacecraft);
  return uniqueVolumeOf(id, sched.taken.map((t) => plan.contacts[t.contactIndex]!)).volumeBits;
}

describe('week sizing round trips (first demo day)', () => {
  it('power, unscheduled: HERON-2 (fixed turbo code) at 4 Gbit/day', () => {
    const target = 4e9;
    const res = sizeForWeek(ctx, { spacecraftId: 'HERON-2', targetBitsPerDay: target, solve: 'power', basis: 'unscheduled' });
    expect(res.answer).not.toBeNull();
    const p = res.answer!;
    expect(deliveredPerDay(withRadio(scenario, 'HERON-2', (r) => ({ ...r, txPowerDbw: p })), 'HERON-2', 'unscheduled')).toBeGreaterThanOrEqual(target);
    expect(deliveredPerDay(withRadio(scenario, 'HERON-2', (r) => ({ ...r, txPowerDbw: p - 0.1 })), 'HERON-2', 'unscheduled')).toBeLessThan(target);
    expect(res.headroomDb).toBeCloseTo(res.current! - p, 12);
  });

  it('power, scheduled (antennas conflict at FRV on the demo): KESTREL-1 (DVB-S2 ACM) at 80 Gbit/day', () => {
    const target = 80e9;
    const res = sizeForWeek(ctx, { spacecraftId: 'KESTREL-1', targetBitsPerDay: target, solve: 'power' });
    expect(res.basis).toBe('scheduled');
    const p = res.answer!;
    expect(deliveredPerDay(withRadio(scenario, 'KESTREL-1', (r) => ({ ...r, txPowerDbw: p })), 'KESTREL-1', 'scheduled')).toBeGreaterThanOrEqual(target);
    expect(deliveredPerDay(withRadio(scenario, 'KESTREL-1', (r) => ({ ...r, txPowerDbw: p - 0.1 })), 'KESTREL-1', 'scheduled')).toBeLessThan(target);
  });

  it('symbol rate, unscheduled: PETREL-3 at 100 Gbit/day reached at the answer, missed 1 % below', () => {
    const target = 100e9;
    const res = sizeForWeek(ctx, { spacecraftId: 'PETREL-3', targetBitsPerDay: target, solve: 'symbol-rate', basis: 'unscheduled' });
    const rs = res.answer!;
    const at = (v: number) => withRadio(scenario, 'PETREL-3', (r) => (r.coding.kind === 'adaptive' ? { ...r, coding: { ...r.coding, symbolRateBaud: v } } : r));
    expect(deliveredPerDay(at(rs), 'PETREL-3', 'unscheduled')).toBeGreaterThanOrEqual(target);
    expect(deliveredPerDay(at(rs * 0.99), 'PETREL-3', 'unscheduled')).toBeLessThan(target);
  });

  it('an unreachable target gives no answer', () => {
    // DRIFTER's fixed code carries 1 kbit/s: at most 86.4 Mbit a day whatever the power.
    const res = sizeForWeek(ctx, { spacecraftId: 'DRIFTER', targetBitsPerDay: 1e9, solve: 'power', basis: 'unscheduled' });
    expect(res.answer).toBeNull();
  });
});

describe('one-geometry power against evaluateLink', () => {
  const cases = [
    { spacecraftId: 'KESTREL-1', stationId: 'FRV', elevationDeg: 10, targetRateBps: 20e6 }, // adaptive DVB-S2
    { spacecraftId: 'PETREL-3', stationId: 'SAL', elevationDeg: 35, targetRateBps: 4e6 }, // adaptive
    { spacecraftId: 'HERON-2', stationId: 'MDL', elevationDeg: 5, targetRateBps: 2e6 }, // fixed code, Rb = target
    { spacecraftId: 'MOONWREN', stationId: 'ALK', elevationDeg: 20, targetRateBps: 1e6 }, // fixed code, Rb > target
  ];
  for (const c of cases) {
    it(`${c.spacecraftId} -> ${c.stationId} at ${c.elevationDeg} deg for ${c.targetRateBps / 1e6} Mbit/s`, () => {
      const res = sizePowerAtGeometry(scenario, c);
      expect(res.requiredPowerDbw).not.toBeNull();
      const { link, look } = pointLink(scenario, c);
      const s = newLinkSample();
      evaluateLink({ ...link, txPowerDbw: res.requiredPowerDbw! }, look, s);
      expect(Math.abs(s.marginDb)).toBeLessThanOrEqual(0.01);
      expect(s.rateBps).toBeGreaterThanOrEqual(c.targetRateBps);
      evaluateLink({ ...link, txPowerDbw: res.requiredPowerDbw! - 0.01 }, look, s);
      expect(s.rateBps).toBeLessThan(c.targetRateBps);
      // the margin at the radio's own power is the one evaluateLink gives there
      evaluateLink(link, look, s);
      expect(res.marginAtCurrentDb).toBe(s.marginDb);
    });
  }

  it('a fixed code slower than the target cannot reach it at any power', () => {
    const coding = scenario.spacecraft.find((x) => x.id === 'DRIFTER')!.radios[0]!.coding;
    const rateBps = coding.kind === 'fixed' ? coding.informationRateBps : Number.NaN;
    const res = sizePowerAtGeometry(scenario, { spacecraftId: 'DRIFTER', stationId: 'SAL', elevationDeg: 30, targetRateBps: 2 * rateBps });
    expect(res.requiredPowerDbw).toBeNull();
    expect(res.why).toContain(`${rateBps} bit/s`);
  });
});

// The "stop the scan with a note" path of week sizing: growing MDL's dish narrows its beam
// until the 12 (theta/theta3dB)^2 pointing-loss model (valid only inside the 3 dB beamwidth,
// theta3dB ~ 70 lambda / D: common practice, see src/link/antenna.ts) is asked for outside
// its range. That is a ModelRangeError kept as such (not a bad-input ScenarioError): the
// scan ends there with a note, and the unreachable target exits 1, never 2.
describe('size: a candidate outside a model\'s range ends the scan with a note', () => {
  it('size --spacecraft-id KESTREL-1 --solve dish --station-id MDL --target-gbit-per-day 100000 --days 1: note, exit 1', async () => {
    const { run } = await import('../../src/cli/main.js');
    let out = '';
    let err = '';
    const code = await run(
      ['size', '--spacecraft-id', 'KESTREL-1', '--solve', 'dish', '--station-id', 'MDL', '--target-gbit-per-day', '100000', '--days', '1', '--no-write'],
      { out: (t) => void (out += t), err: (t) => void (err += t), isTty: false, nowMs: () => 0 },
    );
    expect(err).not.toMatch(/^error:/m);
    expect(code).toBe(1);
    const m = /Note: stopped at ([\d.]+) m: radio (\S+) at station MDL: pointing loss/.exec(out);
    expect(m, out).not.toBeNull();
    // the first scanned dish whose beam is narrower than MDL's 0.08 deg pointing error, for the
    // highest frequency received there (ANCHOR-G's 20.2 GHz): D > 70 lambda / 0.08 deg, and the
    // previous scan step (x1/1.25) is not
    const lambdaM = 299_792_458 / 20.2e9;
    const dLimitM = (70 * lambdaM) / 0.08;
    const stopped = Number(m![1]);
    expect(m![2]).toBe('KA-DATA');
    expect(stopped).toBeGreaterThan(dLimitM);
    expect(stopped / 1.25).toBeLessThan(dLimitM);
    expect(out).toMatch(/Not reachable/);
  });
});
