/**
 * Renders sizing answers (week mode and one-geometry mode) as terminal text
 * and JSON. Pure: returns strings. Fixed rounding.
 */
import type { PointSizingResult, WeekSizingResult } from '../plan/sizing.js';
import { isoUtc } from '../time/format.js';
import { formatBits } from './table.js';

const r = (v: number | null, d: number) => (v === null || !Number.isFinite(v) ? null : Number(v.toFixed(d)));

function valueText(res: WeekSizingResult, v: number | null): string {
  if (v === null) return '-';
  if (res.unit === 'dBW') return `${v.toFixed(2)} dBW (${(10 ** (v / 10)).toPrecision(3)} W)`;
  if (res.unit === 'm') return `${v.toFixed(3)} m`;
  return `${(v / 1e6).toFixed(4)} Mbaud`;
}

const what = (res: WeekSizingResult) =>
  res.solve === 'power' ? 'transmit power' : res.solve === 'dish' ? `dish diameter at ${res.stationIds.join(', ')}` : 'symbol rate';

export function renderWeekSizingText(res: WeekSizingResult, span: { startMs: number; endMs: number }): string {
  const lines: string[] = [];
  lines.push(
    `Sizing the ${what(res)} of ${res.spacecraftId} for ${formatBits(res.targetBitsPerDay)}/day over ${isoUtc(span.startMs, 0)} .. ${isoUtc(span.endMs, 0)} ` +
      `(${res.days} d, link at ${res.availabilityPercent} % availability, sampled every ${res.linkStepS} s)`,
  );
  lines.push(`Volume basis: ${res.basis} (${res.basisReason})`);
  lines.push(`Search: ${res.searchRule}; ${res.evaluations} runs of the link engine`);
  if (res.note !== null) lines.push(`Note: ${res.note}`);
  lines.push('');
  if (res.answer === null) {
    lines.push(`Not reachable: no ${what(res)} within the search limits delivers the target.`);
    lines.push(`At the scenario's own value (${valueText(res, res.current)}): ${formatBits(res.currentBitsPerDay)}/day.`);
    return lines.join('\n') + '\n';
  }
  lines.push(`Answer: ${valueText(res, res.answer)}${res.answerAtLimit ? ' (the lower search limit: the target is met there already)' : ''}`);
  lines.push(
    `  delivers ${formatBits(res.achievedBitsPerDay ?? 0)}/day, ${(((res.achievedBitsPerDay ?? 0) / res.targetBitsPerDay - 1) * 100).toFixed(2)} % above the target`,
  );
  if (res.below !== null && res.belowBitsPerDay !== null) {
    lines.push(`  just below, ${valueText(res, res.below)} delivers ${formatBits(res.belowBitsPerDay)}/day (misses)`);
  }
  if (res.current !== null) {
    const head =
      res.headroomDb === null
        ? ''
        : res.solve === 'power'
          ? `; power headroom ${res.headroomDb.toFixed(2)} dB`
          : res.solve === 'dish'
            ? `; gain headroom ${res.headroomDb.toFixed(2)} dB`
            : `; ${res.headroomDb.toFixed(2)} dB from the answer`;
    lines.push(`Scenario's own value: ${valueText(res, res.current)}, delivering ${formatBits(res.currentBitsPerDay)}/day${head}`);
  } else lines.push(`Scenario's own value differs between stations; at it: ${formatBits(res.currentBitsPerDay)}/day`);
  return lines.join('\n') + '\n';
}

export function weekSizingJson(res: WeekSizingResult, span: { startMs: number; endMs: number }): string {
  const doc = {
    mode: 'week',
    span: { from_utc: isoUtc(span.startMs, 3), to_utc: isoUtc(span.endMs, 3) },
    spacecraft: res.spacecraftId,
    solve: res.solve,
    unit: res.unit,
    stations: res.stationIds,
    answer: r(res.answer, 6),
    answer_at_limit: res.answerAtLimit,
    below: r(res.below, 6),
    below_bits_per_day: r(res.belowBitsPerDay, 0),
    current: r(res.current, 6),
    target_bits_per_day: res.targetBitsPerDay,
    achieved_bits_per_day: r(res.achievedBitsPerDay, 0),
    current_bits_per_day: r(res.currentBitsPerDay, 0),
    headroom_db: r(res.headroomDb, 3),
    basis: res.basis,
    basis_reason: res.basisReason,
    days: res.days,
    link_step_s: res.linkStepS,
    availability_percent: res.availabilityPercent,
    evaluations: res.evaluations,
    search: res.searchRule,
    note: res.note,
  };
  return JSON.stringify(doc, null, 2) + '\n';
}

export function renderPointSizingText(res: PointSizingResult): string {
  const lines: string[] = [];
  lines.push(
    `Power for ${(res.targetRateBps / 1e6).toPrecision(6)} Mbit/s: ${res.spacecraftId} radio ${res.radioId} -> ${res.stationId} ` +
      `at ${res.look.elevationDeg.toFixed(2)} deg elevation, ${res.look.rangeKm.toFixed(1)} km`,
  );
  lines.push(`Margin at the radio's own ${res.currentPowerDbw.toFixed(2)} dBW: ${res.marginAtCurrentDb.toFixed(2)} dB (as passbudget budget prints it)`);
  if (res.requiredPowerDbw === null) {
    lines.push(`Not reachable: ${res.why ?? 'the coding cannot carry the target rate'}`);
    return lines.join('\n') + '\n';
  }
  lines.push(
    `Answer: ${res.requiredPowerDbw.toFixed(2)} dBW (${(10 ** (res.requiredPowerDbw / 10)).toPrecision(3)} W) with ${res.codingName} at ${((res.rateBps ?? 0) / 1e6).toPrecision(6)} Mbit/s; margin there ${(res.marginAtAnswerDb ?? 0).toFixed(2)} dB`,
  );
  lines.push(`Power headroom of the radio: ${(res.headroomDb ?? 0).toFixed(2)} dB`);
  return lines.join('\n') + '\n';
}

export function pointSizingJson(res: PointSizingResult): string {
  const doc = {
    mode: 'geometry',
    spacecraft: res.spacecraftId,
    station: res.stationId,
    radio: res.radioId,
    elevation_deg: r(res.look.elevationDeg, 6),
    range_km: r(res.look.rangeKm, 6),
    target_rate_bps: res.targetRateBps,
    current_power_dbw: r(res.currentPowerDbw, 6),
    margin_at_current_db: r(res.marginAtCurrentDb, 4),
    required_power_dbw: r(res.requiredPowerDbw, 6),
    headroom_db: r(res.headroomDb, 4),
    coding: res.codingName,
    rate_bps: r(res.rateBps, 0),
    margin_at_answer_db: r(res.marginAtAnswerDb, 4),
    why: res.why,
  };
  return JSON.stringify(doc, null, 2) + '\n';
}
